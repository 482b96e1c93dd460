import { Decimal, sum } from '../decimal.ts';
import { QuantityError } from './quantity-error.ts';
import { tokenize } from './tokenize.ts';

/** Grams in one avoirdupois pound, exact. source: NIST SP 811 (2008), Appendix B.8 */
export const GRAMS_PER_POUND = new Decimal('453.59237');
/** Grams in one avoirdupois ounce, exact (1 lb / 16). source: NIST SP 811 (2008), Appendix B.8 */
export const GRAMS_PER_OUNCE = GRAMS_PER_POUND.div(16);

/** Grams in one of each mass unit we accept, keyed by every spelling we accept. */
const GRAMS_PER_UNIT: ReadonlyMap<string, Decimal> = new Map([
  ...['mg', 'milligram', 'milligrams'].map((u) => [u, new Decimal('0.001')] as const),
  ...['g', 'gr', 'gram', 'grams'].map((u) => [u, new Decimal(1)] as const),
  ...['kg', 'kilo', 'kilos', 'kilogram', 'kilograms'].map((u) => [u, new Decimal(1000)] as const),
  ...['oz', 'ounce', 'ounces'].map((u) => [u, GRAMS_PER_OUNCE] as const),
  ...['lb', 'lbs', 'pound', 'pounds', '#'].map((u) => [u, GRAMS_PER_POUND] as const),
]);

const EXPECTED = 'a mass such as "4.26 kg", "4260 g", "9.4 lb" or "4 lb 4 oz"';

/**
 * Reads a mass and returns it in grams. Several terms add up ("4 lb 4 oz", "1 kg 250 g").
 * @throws QuantityError when the text is not a mass
 */
export function parseMass(text: string): Decimal {
  const terms = tokenize(text);
  if (typeof terms === 'string') throw new QuantityError(text, EXPECTED, terms);
  const grams = terms.map((term) => {
    if (term.unit === '')
      throw new QuantityError(text, EXPECTED, 'a unit is missing (g, kg, oz or lb)');
    const factor = GRAMS_PER_UNIT.get(term.unit);
    if (!factor) throw new QuantityError(text, EXPECTED, `"${term.unit}" is not a mass unit`);
    if (term.value.isNegative())
      throw new QuantityError(text, EXPECTED, 'a mass cannot be negative');
    return term.value.times(factor);
  });
  return sum(grams);
}

/** Converts grams to pounds. */
export function gramsToPounds(grams: Decimal): Decimal {
  return grams.div(GRAMS_PER_POUND);
}

/** Converts grams to ounces. */
export function gramsToOunces(grams: Decimal): Decimal {
  return grams.div(GRAMS_PER_OUNCE);
}
