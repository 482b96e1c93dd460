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

/** Whether a unit measures by weight (its base measure is the gram). */
export function isMassUnit(unit: StockUnit): boolean {
  return unit === 'g' || unit === 'kg' || unit === 'lb' || unit === 'oz';
}

/**
 * What an amount in the base measure costs at a price per unit received: amount ÷ base per unit
 * × price (850 g at 9.40 a kg: 850 ÷ 1000 × 9.40 = 7.99). Exact; round only to show it.
 */
export function costOfAmount(amount: Decimal, unit: StockUnit, pricePerUnit: Decimal): Decimal {
  return amount.div(basePerUnit(unit)).times(pricePerUnit);
}

/** A price per unit received as a price per kilogram, for a unit of weight. */
export function pricePerKg(unit: StockUnit, pricePerUnit: Decimal): Decimal {
  return pricePerUnit.times(THOUSAND).div(basePerUnit(unit));
}
