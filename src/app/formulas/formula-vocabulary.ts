import type {
  BlendFormula,
  CureMethod,
  CureProduct,
  FoodKey,
  FormulaKind,
  HoldRule,
  YeastKind,
} from '../../../shared/formula/formula-types.ts';
import type { SpeciesWord } from './species-choices';

/** A value a formula may take, with the words a cook reads for it. */
export interface Choice<T extends string> {
  readonly value: T;
  readonly label: string;
}

// Records keyed by the shared types: the compiler insists every value of the schema has words.
function choices<T extends string>(labels: Record<T, string>): readonly Choice<T>[] {
  return (Object.entries(labels) as [T, string][]).map(([value, label]) => ({ value, label }));
}

/** Names of the formula kinds. */
export const KIND_LABELS: Record<FormulaKind, string> = {
  cure: 'Cure',
  dough: 'Dough',
  blend: 'Blend',
  mix: 'Mix',
  assembly: 'Assembly (menu item)',
};

/** The formula kinds as choices. */
export const KINDS = choices(KIND_LABELS);

/** Cure methods. */
export const CURE_METHODS = choices<CureMethod>({
  dry: 'Dry (rubbed on or mixed in)',
  brine: 'Brine (held to equilibrium)',
  pump: 'Pump (injected)',
});

/** Product classes that select the nitrite limit. */
export const CURE_PRODUCTS = choices<CureProduct>({
  bacon: 'Bacon',
  'whole-muscle': 'Whole muscle (ham, loin, brisket…)',
  comminuted: 'Comminuted (ground, chopped)',
});

/** The rate keys of a hold rule, and the fixed-days key. */
export type HoldRateKey = keyof Pick<
  HoldRule,
  'days_per_cm' | 'days_per_inch' | 'days_per_kg' | 'days_per_lb' | 'days'
>;

/** Ways to state how long a cure takes; "default" leaves it to the core's rule of thumb. */
export const HOLD_RULES = choices<HoldRateKey | 'default'>({
  default: 'Rule of thumb for the method',
  days_per_cm: 'Days per cm of thickness',
  days_per_inch: 'Days per inch of thickness',
  days_per_kg: 'Days per kg of the heaviest piece',
  days_per_lb: 'Days per lb of the heaviest piece',
  days: 'A fixed number of days',
});

/** Foods with a published water content, for true hydration. */
export const FOODS = choices<FoodKey>({
  water: 'Water',
  'milk-whole': 'Whole milk',
  'milk-2pct': 'Milk, 2 % fat',
  'milk-skim': 'Skim milk',
  buttermilk: 'Buttermilk',
  'cream-heavy': 'Heavy cream',
  'sour-cream': 'Sour cream',
  'yogurt-whole': 'Whole-milk yogurt',
  'butter-salted': 'Salted butter',
  'butter-unsalted': 'Unsalted butter',
  'egg-whole': 'Whole egg',
  'egg-white': 'Egg white',
  'egg-yolk': 'Egg yolk',
  honey: 'Honey',
  molasses: 'Molasses',
  'maple-syrup': 'Maple syrup',
  'corn-syrup': 'Corn syrup',
  'yeast-fresh': 'Fresh yeast',
});

/** Kinds of baker's yeast. */
export const YEASTS = choices<YeastKind>({
  fresh: 'Fresh',
  'active-dry': 'Active dry',
  instant: 'Instant',
});

/** Species of a cure or blend, for the cooking caution. */
export const SPECIES = choices<SpeciesWord>({
  beef: 'Beef',
  pork: 'Pork',
  lamb: 'Lamb',
  veal: 'Veal',
  poultry: 'Poultry',
  mixed: 'Mixed, meats not named',
});

/** Standards of identity a blend may be held to. */
export const STANDARDS = choices<NonNullable<BlendFormula['standard']>>({
  'ground-beef': 'Ground beef (at most 30 % fat, no fat added as such)',
  hamburger: 'Hamburger (at most 30 % fat, fat as such allowed)',
  'fresh-pork-sausage': 'Fresh pork sausage (at most 50 % fat)',
});

/** What a revision's source means, in words. */
export const SOURCE_LABELS: Partial<Record<string, string>> = {
  save: 'Saved in the console',
  create: 'Created',
  upload: 'Uploaded',
  disk: 'Found on disk',
  delete: 'Removed',
};
