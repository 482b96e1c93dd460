import { Decimal } from '../decimal.ts';

/**
 * An amount of money as shown: to the cent, half-up (2.345 → "2.35"), with no currency sign (the
 * kitchen's own). The only place costs are rounded; sums are made from the exact amounts first.
 */
export function moneyText(amount: Decimal): string {
  return amount.toDecimalPlaces(2, Decimal.ROUND_HALF_UP).toFixed(2);
}
