import { Decimal } from '../decimal.ts';
import type { FoodKey } from '../formula/formula-types.ts';

/** Where the water contents in {@link WATER_CONTENT} come from. */
export const WATER_CONTENT_SOURCE =
  'USDA Agricultural Research Service, Nutrient Data Laboratory, USDA National Nutrient Database ' +
  'for Standard Reference, Release 26 (2013), abbreviated table, field Water_(g); the same foods ' +
  'are "SR Legacy" in FoodData Central';

/** One food's published water content. */
export interface WaterContent {
  /** The USDA NDB number of the record used; absent for plain water, which is water by definition. */
  readonly ndb?: string;
  /** The food as the USDA record names it. */
  readonly description: string;
  /** Grams of water per 100 g of the food. */
  readonly waterPct: Decimal;
}

// Pinned to SR Legacy on purpose: FoodData Central's newer "Foundation Foods" records for some
// of these foods carry different analytical values, and a test must not drift with them.
/**
 * Water content of each food a dough ingredient may name with `food:`, g per 100 g.
 * source: USDA National Nutrient Database for Standard Reference, Release 26, field Water_(g)
 */
export const WATER_CONTENT: Readonly<Record<FoodKey, WaterContent>> = {
  // Plain water is all water by definition; the USDA tap-water record (14411, 99.90) measures
  // dissolved minerals we do not want to subtract from a dough's hydration.
  water: { description: 'Water', waterPct: new Decimal(100) },
  'milk-whole': {
    ndb: '01077',
    description: 'Milk, whole, 3.25% milkfat, with added vitamin D',
    waterPct: new Decimal('88.13'), // source: USDA SR26, NDB 01077, Water_(g)
  },
  'milk-2pct': {
    ndb: '01079',
    description: 'Milk, reduced fat, fluid, 2% milkfat',
    waterPct: new Decimal('89.21'), // source: USDA SR26, NDB 01079, Water_(g)
  },
  'milk-skim': {
    ndb: '01085',
    description: 'Milk, nonfat, fluid (fat free or skim)',
    waterPct: new Decimal('90.84'), // source: USDA SR26, NDB 01085, Water_(g)
  },
  buttermilk: {
    ndb: '01088',
    description: 'Milk, buttermilk, fluid, cultured, lowfat',
    waterPct: new Decimal('90.13'), // source: USDA SR26, NDB 01088, Water_(g)
  },
  'cream-heavy': {
    ndb: '01053',
    description: 'Cream, fluid, heavy whipping',
    waterPct: new Decimal('57.71'), // source: USDA SR26, NDB 01053, Water_(g)
  },
  'sour-cream': {
    ndb: '01056',
    description: 'Cream, sour, cultured',
    waterPct: new Decimal('74.46'), // source: USDA SR26, NDB 01056, Water_(g)
  },
  'yogurt-whole': {
    ndb: '01116',
    description: 'Yogurt, plain, whole milk',
    waterPct: new Decimal('87.90'), // source: USDA SR26, NDB 01116, Water_(g)
  },
  'butter-salted': {
    ndb: '01001',
    description: 'Butter, salted',
    waterPct: new Decimal('15.87'), // source: USDA SR26, NDB 01001, Water_(g)
  },
  'butter-unsalted': {
    ndb: '01145',
    description: 'Butter, without salt',
    waterPct: new Decimal('17.94'), // source: USDA SR26, NDB 01145, Water_(g)
  },
  'egg-whole': {
    ndb: '01123',
    description: 'Egg, whole, raw, fresh',
    waterPct: new Decimal('76.15'), // source: USDA SR26, NDB 01123, Water_(g)
  },
  'egg-white': {
    ndb: '01124',
    description: 'Egg, white, raw, fresh',
    waterPct: new Decimal('87.57'), // source: USDA SR26, NDB 01124, Water_(g)
  },
  'egg-yolk': {
    ndb: '01125',
    description: 'Egg, yolk, raw, fresh',
    waterPct: new Decimal('52.31'), // source: USDA SR26, NDB 01125, Water_(g)
  },
  honey: {
    ndb: '19296',
    description: 'Honey',
    waterPct: new Decimal('17.10'), // source: USDA SR26, NDB 19296, Water_(g)
  },
  molasses: {
    ndb: '19304',
    description: 'Molasses',
    waterPct: new Decimal('21.87'), // source: USDA SR26, NDB 19304, Water_(g)
  },
  'maple-syrup': {
    ndb: '19353',
    description: 'Syrups, maple',
    waterPct: new Decimal('32.39'), // source: USDA SR26, NDB 19353, Water_(g)
  },
  'corn-syrup': {
    ndb: '19350',
    description: 'Syrups, corn, light',
    waterPct: new Decimal('22.81'), // source: USDA SR26, NDB 19350, Water_(g)
  },
  'yeast-fresh': {
    ndb: '18374',
    description: "Leavening agents, yeast, baker's, compressed",
    waterPct: new Decimal('69.00'), // source: USDA SR26, NDB 18374, Water_(g)
  },
};

/** Grams of water per 100 g of a food in {@link WATER_CONTENT}. */
export function waterContentPct(food: FoodKey): Decimal {
  return WATER_CONTENT[food].waterPct;
}
