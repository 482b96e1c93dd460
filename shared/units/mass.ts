import { Decimal } from '../decimal.ts';
import { parseWithTable, spellings, type UnitTable } from './unit-table.ts';

/** Grams in one avoirdupois pound, exact. source: NIST SP 811 (2008), Appendix B.8 */
export const GRAMS_PER_POUND = new Decimal('453.59237');
/** Grams in one avoirdupois ounce, exact (1 lb / 16). source: NIST SP 811 (2008), Appendix B.8 */
export const GRAMS_PER_OUNCE = GRAMS_PER_POUND.div(16);

const MASS: UnitTable = {
  factors: new Map([
    ...spellings(['mg', 'milligram', 'milligrams'], new Decimal('0.001')),
    ...spellings(['g', 'gr', 'gram', 'grams'], new Decimal(1)),
    ...spellings(['kg', 'kilo', 'kilos', 'kilogram', 'kilograms'], new Decimal(1000)),
    ...spellings(['oz', 'ounce', 'ounces'], GRAMS_PER_OUNCE),
    ...spellings(['lb', 'lbs', 'pound', 'pounds'], GRAMS_PER_POUND),
  ]),
  expected: 'a mass such as "4.26 kg", "4260 g", "9.4 lb" or "4 lb 4 oz"',
  noun: 'mass',
  unitHint: 'g, kg, oz or lb',
};

/**
 * Reads a mass and returns it in grams. Several terms add up ("4 lb 4 oz", "1 kg 250 g").
 * @throws QuantityError when the text is not a mass
 */
export function parseMass(text: string): Decimal {
  return parseWithTable(text, MASS);
}

/** Converts grams to pounds. */
export function gramsToPounds(grams: Decimal): Decimal {
  return grams.div(GRAMS_PER_POUND);
}

/** Converts grams to ounces. */
export function gramsToOunces(grams: Decimal): Decimal {
  return grams.div(GRAMS_PER_OUNCE);
}
