import type { StockUnit } from '../catalogue/catalogue-types.ts';
import type { Decimal } from '../decimal.ts';
import type { BaseMeasure } from '../stock/base-measure.ts';
import { formatMass } from './format-figure.ts';

/**
 * An amount of stock as a cook reads it: a weight as the scale shows it in pounds and ounces for
 * an item bought by the pound or ounce, else in kilograms to the gram from 1 kg up and grams
 * below; a volume in millilitres, or litres to 0.01 L; a count.
 */
export function lotAmountWords(
  amount: Decimal,
  measure: BaseMeasure,
  unit?: StockUnit | null,
): string {
  if (measure === 'g') {
    if (unit === 'lb' || unit === 'oz') return formatMass(amount, 'us');
    if (amount.lessThan(1000)) return formatMass(amount, 'metric');
    return `${amount.div(1000).toDecimalPlaces(3).toString()} kg`;
  }
  if (measure === 'ml')
    return amount.lessThan(1000)
      ? `${amount.toDecimalPlaces(0).toString()} ml`
      : `${amount.div(1000).toDecimalPlaces(2).toString()} L`;
  return amount.toDecimalPlaces(2).toString();
}
