import { Decimal } from '../decimal.ts';
import type { StockUnit } from '../catalogue/catalogue-types.ts';
import { GRAMS_PER_OUNCE, GRAMS_PER_POUND } from '../units/mass.ts';

const THOUSAND = new Decimal(1000);

/**
 * How many of the item's base measure (grams for a weight, millilitres for a volume, one for a
 * count) one unit holds: 1000 for kg and l, 453.59237 for lb (exact by definition), 1 for g, ml
 * and each. Lots are kept and used in the base measure; prices are per unit received.
 */
export function basePerUnit(unit: StockUnit): Decimal {
  switch (unit) {
    case 'kg':
    case 'l':
      return THOUSAND;
    case 'lb':
      return GRAMS_PER_POUND;
    case 'oz':
      return GRAMS_PER_OUNCE;
    case 'g':
    case 'ml':
    case 'each':
      return new Decimal(1);
  }
}

/** What lots of an item are kept and used in: grams, millilitres or a count. */
export type BaseMeasure = 'g' | 'ml' | 'each';

/** The base measure of a unit. */
export function baseMeasureOf(unit: StockUnit): BaseMeasure {
  if (unit === 'ml' || unit === 'l') return 'ml';
  return unit === 'each' ? 'each' : 'g';
}

/** Whether a text is one of the stock units (a receipt's unit as stored). */
export function isStockUnit(text: string): text is StockUnit {
  return ['g', 'kg', 'oz', 'lb', 'ml', 'l', 'each'].includes(text);
}

/** Whether a unit measures by weight (its base measure is the gram). */
export function isMassUnit(unit: StockUnit): boolean {
  return unit === 'g' || unit === 'kg' || unit === 'lb' || unit === 'oz';
}

/**
 * What an amount in the base measure costs at a price per unit received: amount × price ÷
 * base per unit (850 g at 9.40 a kg: 850 × 9.40 ÷ 1000 = 7.99). Exact; round only to show it.
 */
export function costOfAmount(amount: Decimal, unit: StockUnit, pricePerUnit: Decimal): Decimal {
  // Multiply first: one division, so a price per lb of a round price per kg stays exact.
  return amount.times(pricePerUnit).div(basePerUnit(unit));
}

/** A price per unit received as a price per kilogram, for a unit of weight. */
export function pricePerKg(unit: StockUnit, pricePerUnit: Decimal): Decimal {
  return pricePerUnit.times(THOUSAND).div(basePerUnit(unit));
}
