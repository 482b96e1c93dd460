import { Decimal } from '../decimal.ts';
import { baseMeasureOf, basePerUnit, type ReceivedUnit } from '../stock/base-measure.ts';

export {
  baseMeasureOf,
  basePerUnit,
  isReceivedUnit,
  type BaseMeasure,
} from '../stock/base-measure.ts';

const THOUSAND = new Decimal(1000);

/** Whether a unit measures by weight (its base measure is the gram). */
export function isMassUnit(unit: ReceivedUnit): boolean {
  return baseMeasureOf(unit) === 'g';
}

/**
 * What an amount in the base measure costs at a price per unit received: amount × price ÷
 * base per unit (850 g at 9.40 a kg: 850 × 9.40 ÷ 1000 = 7.99). Exact; round only to show it.
 */
export function costOfAmount(amount: Decimal, unit: ReceivedUnit, pricePerUnit: Decimal): Decimal {
  // Multiply first: one division, so a price per lb of a round price per kg stays exact.
  return amount.times(pricePerUnit).div(basePerUnit(unit));
}

/** A price per unit received as a price per kilogram, for a unit of weight. */
export function pricePerKg(unit: ReceivedUnit, pricePerUnit: Decimal): Decimal {
  return pricePerUnit.times(THOUSAND).div(basePerUnit(unit));
}
