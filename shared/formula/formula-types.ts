/**
 * TypeScript shapes of a formula file. They mirror shared/schema/formula.schema.json, which is the
 * authority; tests/formulas check that every demo file validates and type-checks as these.
 */

/** The formula kinds. */
export type FormulaKind = 'cure' | 'dough' | 'blend' | 'mix';

/** The nine major food allergens of US law (FALCPA 2004 plus sesame, FASTER Act 2021). */
export type Allergen =
  'milk' | 'egg' | 'fish' | 'shellfish' | 'tree-nuts' | 'peanuts' | 'wheat' | 'soy' | 'sesame';

/** Keys every formula has. */
export interface FormulaBase {
  formula: 1;
  id: string;
  title: string;
  kind: FormulaKind;
  steps?: string[];
  cautions?: string[];
  notes?: string;
}

/** Weight after each process step as a percent of the weight before it. */
export interface Yields {
  trim?: number;
  cure?: number;
  smoke?: number;
  cook?: number;
  slice?: number;
}

/** The cure methods. */
export type CureMethod = 'dry' | 'brine' | 'pump';
/** Product classes that, with the method, select the nitrite limit. */
export type CureProduct = 'bacon' | 'whole-muscle' | 'comminuted';

export interface CureIngredient {
  name: string;
  /** % of green weight (dry, pump) or of meat plus water (brine). */
  pct: number;
  /** Sodium nitrite in the ingredient, % by weight. */
  nitrite?: number;
  /** Sodium nitrate in the ingredient, % by weight. */
  nitrate?: number;
  /** Sodium chloride in the ingredient, % by weight. */
  salt?: number;
  /** Sodium ascorbate or erythorbate in the ingredient, % by weight. */
  accelerator?: number;
  allergens?: Allergen[];
}

export interface HoldRule {
  days_per_cm?: number;
  days_per_inch?: number;
  days_per_kg?: number;
  days_per_lb?: number;
  days?: number;
  plus_days?: number;
  min_days?: number;
  flip_every_days?: number;
}

export interface CureFormula extends FormulaBase {
  kind: 'cure';
  method: CureMethod;
  product: CureProduct;
  ingredients: CureIngredient[];
  brine?: { water_pct?: number; pump_pct?: number; cover_pct?: number; extra_pct?: number };
  hold?: HoldRule;
  yields?: Yields;
}

/** Foods with a published water content (shared/reference/water-content.ts). */
export type FoodKey =
  | 'water'
  | 'milk-whole'
  | 'milk-2pct'
  | 'milk-skim'
  | 'buttermilk'
  | 'cream-heavy'
  | 'sour-cream'
  | 'yogurt-whole'
  | 'butter-salted'
  | 'butter-unsalted'
  | 'egg-whole'
  | 'egg-white'
  | 'egg-yolk'
  | 'honey'
  | 'molasses'
  | 'maple-syrup'
  | 'corn-syrup'
  | 'yeast-fresh';

/** Kinds of baker's yeast. */
export type YeastKind = 'fresh' | 'active-dry' | 'instant';

export interface DoughIngredient {
  name: string;
  /** Baker's percentage. */
  pct: number;
  flour?: boolean;
  food?: FoodKey;
  /** Water content override, % by weight. */
  water_pct?: number;
  yeast?: YeastKind;
  raw_egg?: boolean;
  allergens?: Allergen[];
}

export interface Preferment {
  name: string;
  /** Share of the total flour that is prefermented, %. */
  flour_pct: number;
  /** The preferment's own formula, % of its flour; names match overall ingredients. */
  ingredients: { name: string; pct: number }[];
}

export interface DoughFormula extends FormulaBase {
  kind: 'dough';
  ingredients: DoughIngredient[];
  preferment?: Preferment;
  /** Default piece weight, e.g. "90 g". */
  piece?: string;
  loss_pct?: number;
  ddt?: { target: string; friction?: string };
}

export interface BlendComponent {
  key: string;
  name: string;
  fat?: number;
  lean?: number;
}

export interface BlendFormula extends FormulaBase {
  kind: 'blend';
  species?: 'beef' | 'pork' | 'lamb' | 'veal' | 'poultry' | 'mixed';
  standard?: 'ground-beef' | 'fresh-pork-sausage';
  components: [BlendComponent, BlendComponent];
  target: { fat?: number; lean?: number };
  ingredients?: { name: string; pct: number; allergens?: Allergen[] }[];
  /** Portion weight, e.g. "4 oz". */
  portion?: string;
  yields?: Yields;
}

export interface MixIngredient {
  name: string;
  /** % of the base ingredient. */
  pct: number;
  base?: boolean;
  raw_egg?: boolean;
  allergens?: Allergen[];
}

export interface MixFormula extends FormulaBase {
  kind: 'mix';
  ingredients: MixIngredient[];
}

/** Any formula. */
export type Formula = CureFormula | DoughFormula | BlendFormula | MixFormula;
