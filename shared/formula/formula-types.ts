/**
 * TypeScript shapes of a formula file. They mirror shared/schema/formula.schema.json, which is the
 * authority; tests/formulas check that every demo file validates and type-checks as these.
 */
import type { FormulaControl } from '../process/control-types.ts';

/** The kinds of formula a batch is made from: each has its own calculator. */
export type BatchKind = 'cure' | 'dough' | 'blend' | 'mix';

/**
 * The formula kinds: the batch kinds, and `assembly` (a menu item built from other formulas),
 * planned (`larder plan`) or made as a batch of its own from batches of its parts.
 */
export type FormulaKind = BatchKind | 'assembly';

/** The major food allergens declared by name alone (FALCPA 2004; sesame, FASTER Act 2021). */
export type PlainAllergen = 'milk' | 'egg' | 'peanuts' | 'wheat' | 'soy' | 'sesame';

/** The three declared with their species or type of nut (21 U.S.C. 343(w)(2)). */
export type KindedAllergen = 'fish' | 'crustacean-shellfish' | 'tree-nuts';

/** One of the nine major food allergens, without its kind. */
export type AllergenGroup = PlainAllergen | KindedAllergen;

/** An allergen as a formula declares it: `milk`, or a kind with its group, `fish: anchovy`. */
export type Allergen = PlainAllergen | { [G in KindedAllergen]: Record<G, string> }[KindedAllergen];

/** The meats the FSIS cooking chart gives a temperature for. */
export type Species = 'beef' | 'pork' | 'lamb' | 'veal' | 'poultry';

/**
 * Which meat a formula is, for its safe cooking temperature: one species, a list of the species
 * in a mixture, or `mixed`, a mixture whose meats are not named (taken as possibly poultry).
 */
export type FormulaSpecies = Species | 'mixed' | Species[];

/** Keys every formula has. */
export interface FormulaBase {
  formula: 1;
  id: string;
  title: string;
  kind: FormulaKind;
  steps?: string[];
  cautions?: string[];
  notes?: string;
  /**
   * The key of the one site of a group this formula belongs to; left out, the formula is the
   * whole group's. A key that is not a site of the install is an error of the file (server).
   */
  site?: string;
  /**
   * Process controls at the critical control points of a batch of it (shared/process). Any kind
   * may write the key; an assembly, put together from batches with their own controls, may only
   * leave it empty.
   */
  controls?: FormulaControl[];
}

/** How the packed product is stored, which decides its label's keep statement. */
export type ProductStorage = 'refrigerated' | 'frozen' | 'shelf-stable';

/** How a product is kept and dated on its label (the formula's `label` key). */
export interface LabelKeeping {
  storage: ProductStorage;
  /** Eaten as it is, without cooking: cooked, or smoked to a lethality. */
  ready_to_eat: boolean;
  /** The kitchen's own validated shelf life, the day of preparation counted as day 1. */
  shelf_life?: { days: number; basis: string };
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
  /** Key of its item in the catalogue of materials; without it the name is looked up there. */
  item?: string;
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
  /** Asked for by the checks: without it the sheet gives the highest cooking temperature. */
  species?: FormulaSpecies;
  /** Key of the meat's item in the catalogue of materials: the green weight draws on its lots. */
  meat_item?: string;
  ingredients: CureIngredient[];
  brine?: {
    water_pct?: number;
    pump_pct?: number;
    cover_pct?: number;
    /** Measured pick-up from the cover brine, % of green weight (FSIS immersion method one). */
    cover_pickup_pct?: number;
    extra_pct?: number;
  };
  /** Pump method: the cover brine's own make-up, each pct % of the cover brine; water is the rest. */
  cover_brine?: CureIngredient[];
  hold?: HoldRule;
  yields?: Yields;
  /** Days from the end of the hold to service (smoking, resting, slicing); default 1. */
  lead_days?: number;
  /** How the product is kept and dated on its label. */
  label?: LabelKeeping;
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
  /** Key of its item in the catalogue of materials; without it the name is looked up there. */
  item?: string;
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
  /** Days from the start of the batch to service; default 1 with a preferment, else 0. */
  lead_days?: number;
  /** How the product is kept and dated on its label. */
  label?: LabelKeeping;
}

export interface BlendComponent {
  key: string;
  name: string;
  /** Key of its item in the catalogue of materials; without it the name is looked up there. */
  item?: string;
  fat?: number;
  lean?: number;
  /** Beef fat added as such (loose fat, suet), not trimmings: not allowed in ground beef. */
  fat_as_such?: boolean;
}

export interface BlendFormula extends FormulaBase {
  kind: 'blend';
  /** Asked for by the checks: without it the sheet gives the highest cooking temperature. */
  species?: FormulaSpecies;
  standard?: 'ground-beef' | 'hamburger' | 'fresh-pork-sausage';
  /** Two to five components. */
  components: BlendComponent[];
  target: { fat?: number; lean?: number };
  ingredients?: { name: string; item?: string; pct: number; allergens?: Allergen[] }[];
  /** Portion weight, e.g. "4 oz". */
  portion?: string;
  /** Blend lost in grinding and forming, % of the batch; portions come from the rest. */
  loss_pct?: number;
  yields?: Yields;
  /** Days from making the blend to service; default 0. */
  lead_days?: number;
  /** How the product is kept and dated on its label. */
  label?: LabelKeeping;
}

export interface MixIngredient {
  name: string;
  /** Key of its item in the catalogue of materials; without it the name is looked up there. */
  item?: string;
  /** % of the base ingredient. */
  pct: number;
  base?: boolean;
  raw_egg?: boolean;
  allergens?: Allergen[];
}

export interface MixFormula extends FormulaBase {
  kind: 'mix';
  ingredients: MixIngredient[];
  /** Days from making the mix to service; default 0. */
  lead_days?: number;
  /** How the product is kept and dated on its label. */
  label?: LabelKeeping;
}

/**
 * One part of an assembly: another formula and how much of it goes into one unit. Exactly one
 * quantity key is given, and it must fit the kind of the formula named (see check-assembly-*.ts).
 */
export interface AssemblyComponent {
  /** Id of the formula this part is made from. */
  formula: string;
  /** Blend: portions of the blend's own portion weight. */
  portions?: number;
  /** Dough: pieces of the dough's own piece weight. */
  pieces?: number;
  /** Cure: finished slices, each `slice` heavy. */
  slices?: number;
  /** Cure, with `slices`: the weight of one finished slice, e.g. "25 g". */
  slice?: string;
  /** Any batch kind: finished weight per unit, e.g. "20 g". */
  amount?: string;
  /** Another assembly: units of it per unit of this one. */
  units?: number;
  /** A part applied to another part of this assembly: the id of the cure it goes on. */
  on?: string;
  /** With `on`: this part's weight as a percent of the green weight of the part it goes on. */
  pct?: number;
  /** Cure: thickness of the thickest piece, for a per-cm or per-inch hold rule. */
  thickness?: string;
  /** Cure: weight of the heaviest piece, for a per-kg or per-lb hold rule. */
  largest_piece?: string;
}

/** A menu item built from other formulas; planned for a count and a service date. */
export interface AssemblyFormula extends FormulaBase {
  kind: 'assembly';
  components: AssemblyComponent[];
  /** How a packed unit is kept and dated on its label; its parts' own say nothing of it. */
  label?: LabelKeeping;
}

/** Any formula a batch is made from. */
export type BatchFormula = CureFormula | DoughFormula | BlendFormula | MixFormula;

/** Any formula. */
export type Formula = BatchFormula | AssemblyFormula;
