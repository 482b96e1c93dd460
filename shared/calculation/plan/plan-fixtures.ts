import type {
  AssemblyComponent,
  AssemblyFormula,
  BlendFormula,
  CureFormula,
  DoughFormula,
  Formula,
  MixFormula,
} from '../../formula/formula-types.ts';

// Formulas shared by the plan specs, copied from the invented Quillmoor Smokehouse's demo files
// (formulas/*.yaml) so that the hand-computed figures stay put if the demo files change.

/** Dry-cured bacon: salt 2.25 %, curing salt 0.25 % (6.25 % nitrite), 2 days per cm, min 7. */
export const BELLY: CureFormula = {
  formula: 1,
  id: 'quillmoor-belly',
  title: 'Quillmoor belly, dry equilibrium cure',
  kind: 'cure',
  method: 'dry',
  product: 'bacon',
  ingredients: [
    { name: 'fine sea salt', pct: 2.25, salt: 100 },
    { name: 'curing salt no. 1 (6.25 % nitrite)', pct: 0.25, nitrite: 6.25, salt: 93.75 },
    { name: 'dark brown sugar', pct: 1.2 },
    { name: 'cracked black pepper', pct: 0.3 },
  ],
  hold: { days_per_cm: 2, min_days: 7, flip_every_days: 2 },
  yields: { smoke: 90, slice: 94 },
};

/** Burger grind: 85/15 chuck and 50/50 fat trim to 20 % fat, quarter-pound portions. */
export const GRIND: BlendFormula = {
  formula: 1,
  id: 'chuck-grind',
  title: 'Smokehouse burger grind 80/20',
  kind: 'blend',
  species: 'beef',
  standard: 'ground-beef',
  components: [
    { key: 'lean', name: 'chuck trim 85/15', fat: 15 },
    { key: 'fat', name: 'brisket fat trim 50/50', fat: 50 },
  ],
  target: { fat: 20 },
  portion: '4 oz',
  yields: { cook: 72 },
};

/** Milk-and-honey bun with a 30 % sponge: 187 % in all, 90 g pieces, 3 % loss. */
export const BUN: DoughFormula = {
  formula: 1,
  id: 'pit-bun',
  title: 'Milk and honey bun, with sponge',
  kind: 'dough',
  ingredients: [
    { name: 'bread flour', pct: 100, flour: true, allergens: ['wheat'] },
    { name: 'water', pct: 28, food: 'water' },
    { name: 'whole milk', pct: 30, food: 'milk-whole', allergens: ['milk'] },
    { name: 'whole egg', pct: 10, food: 'egg-whole', allergens: ['egg'] },
    { name: 'unsalted butter', pct: 10, food: 'butter-unsalted', allergens: ['milk'] },
    { name: 'honey', pct: 6, food: 'honey' },
    { name: 'instant yeast', pct: 1.2, yeast: 'instant' },
    { name: 'fine sea salt', pct: 1.8 },
  ],
  preferment: {
    name: 'sponge',
    flour_pct: 30,
    ingredients: [
      { name: 'bread flour', pct: 100 },
      { name: 'water', pct: 80 },
      { name: 'instant yeast', pct: 0.3 },
    ],
  },
  piece: '90 g',
  loss_pct: 3,
};

/** House sauce: mayonnaise 100 and six more, 138.8 % in all. */
export const SAUCE: MixFormula = {
  formula: 1,
  id: 'house-sauce',
  title: 'Pit-house sandwich sauce',
  kind: 'mix',
  ingredients: [
    { name: 'mayonnaise (made with pasteurized egg)', pct: 100, base: true, allergens: ['egg'] },
    { name: 'chili sauce', pct: 25 },
    { name: 'dill pickle brine', pct: 8 },
    { name: 'Worcestershire sauce', pct: 3, allergens: [{ fish: 'anchovy' }] },
    { name: 'smoked paprika', pct: 1.5 },
    { name: 'granulated garlic', pct: 0.8 },
    { name: 'fine black pepper', pct: 0.5 },
  ],
  cautions: ['Worcestershire sauce contains anchovy; tell guests who ask about fish.'],
};

/** Brisket flats in an equilibrium brine: 9-day hold at 5 cm, 2 lead days, yields 82 and 92 %. */
export const BRISKET: CureFormula = {
  formula: 1,
  id: 'brisket-brine',
  title: 'Brisket flat, equilibrium brine',
  kind: 'cure',
  method: 'brine',
  product: 'whole-muscle',
  brine: { water_pct: 60 },
  ingredients: [
    { name: 'kosher salt', pct: 2.6, salt: 100 },
    { name: 'curing salt no. 1 (6.25 % nitrite)', pct: 0.21, nitrite: 6.25, salt: 93.75 },
    { name: 'white sugar', pct: 1.2 },
    { name: 'pickling spice', pct: 0.3 },
  ],
  hold: { days_per_cm: 1.5, plus_days: 1, min_days: 5, flip_every_days: 2 },
  yields: { smoke: 82, slice: 92 },
  lead_days: 2,
};

/** The beef rub: salt 100, pepper 90, garlic 25, paprika 12, cayenne 3 (230 % in all). */
export const RUB: MixFormula = {
  formula: 1,
  id: 'brisket-rub',
  title: 'Beef rub, salt and pepper forward',
  kind: 'mix',
  ingredients: [
    { name: 'kosher salt', pct: 100, base: true },
    { name: '16-mesh black pepper', pct: 90 },
    { name: 'granulated garlic', pct: 25 },
    { name: 'sweet paprika', pct: 12 },
    { name: 'cayenne', pct: 3 },
  ],
};

/** An assembly from its components. */
export function assembly(
  id: string,
  components: AssemblyComponent[],
  title = id.replace(/-/g, ' '),
): AssemblyFormula {
  return { formula: 1, id, title, kind: 'assembly', components };
}

/** The smokehouse burger: two patties, a bun, three 25 g slices of bacon at 4 cm, 20 g sauce. */
export const BURGER = assembly(
  'smokehouse-burger',
  [
    { formula: 'chuck-grind', portions: 2 },
    { formula: 'pit-bun', pieces: 1 },
    { formula: 'quillmoor-belly', slices: 3, slice: '25 g', thickness: '4 cm' },
    { formula: 'house-sauce', amount: '20 g' },
  ],
  'Smokehouse burger',
);

/** A library of formulas by id. */
export function libraryOf(...formulas: Formula[]): Map<string, Formula> {
  return new Map(formulas.map((formula) => [formula.id, formula]));
}

/** The four demo formulas the burger is built from, and the burger. */
export const KITCHEN = libraryOf(BELLY, GRIND, BUN, SAUCE, BURGER);

/** The corned-beef sandwich: 140 g of brisket at 5 cm, rubbed at 1.5 % of its green weight. */
export const SANDWICH = assembly(
  'corned-beef-sandwich',
  [
    { formula: 'brisket-brine', amount: '140 g', thickness: '5 cm' },
    { formula: 'brisket-rub', on: 'brisket-brine', pct: 1.5 },
  ],
  'Smoked corned-beef sandwich',
);
