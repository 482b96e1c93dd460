/**
 * A reading as typed ("71.5 °C", "160 °F", "6.2") in its measure's canonical unit. CONTRACT STUB:
 * the core engineer replaces the body.
 */
import type { Decimal } from '../decimal.ts';
import type { Measure } from './control-types.ts';

/** The value in the measure's canonical unit; throws QuantityError with words for bad input. */
export function parseReadingValue(text: string, measure: Measure): Decimal {
  void text;
  void measure;
  throw new Error('parseReadingValue is not built yet');
}
