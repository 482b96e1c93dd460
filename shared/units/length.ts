import { Decimal, sum } from '../decimal.ts';
import { QuantityError } from './quantity-error.ts';
import { tokenize } from './tokenize.ts';

/** Millimetres in one inch, exact. source: NIST SP 811 (2008), Appendix B.8 */
export const MILLIMETRES_PER_INCH = new Decimal('25.4');

const MILLIMETRES_PER_UNIT: ReadonlyMap<string, Decimal> = new Map([
  ...['mm', 'millimetre', 'millimetres', 'millimeter', 'millimeters'].map(
    (u) => [u, new Decimal(1)] as const,
  ),
  ...['cm', 'centimetre', 'centimetres', 'centimeter', 'centimeters'].map(
    (u) => [u, new Decimal(10)] as const,
  ),
  ...['in', 'inch', 'inches'].map((u) => [u, MILLIMETRES_PER_INCH] as const),
]);

const EXPECTED = 'a thickness such as "4 cm", "38 mm" or "1.5 in"';

/**
 * Reads a length (a cut's thickness) and returns it in millimetres.
 * @throws QuantityError when the text is not a length
 */
export function parseLength(text: string): Decimal {
  const terms = tokenize(text);
  if (typeof terms === 'string') throw new QuantityError(text, EXPECTED, terms);
  return sum(
    terms.map((term) => {
      if (term.unit === '')
        throw new QuantityError(text, EXPECTED, 'a unit is missing (mm, cm or in)');
      const factor = MILLIMETRES_PER_UNIT.get(term.unit);
      if (!factor) throw new QuantityError(text, EXPECTED, `"${term.unit}" is not a length unit`);
      if (term.value.isNegative())
        throw new QuantityError(text, EXPECTED, 'a length cannot be negative');
      return term.value.times(factor);
    }),
  );
}
