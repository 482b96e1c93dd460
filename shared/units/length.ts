import { Decimal } from '../decimal.ts';
import { parseWithTable, spellings, type UnitTable } from './unit-table.ts';

/** Millimetres in one inch, exact. source: NIST SP 811 (2008), Appendix B.8 */
export const MILLIMETRES_PER_INCH = new Decimal('25.4');

const LENGTH: UnitTable = {
  factors: new Map([
    ...spellings(['mm', 'millimetre', 'millimetres', 'millimeter', 'millimeters'], new Decimal(1)),
    ...spellings(['cm', 'centimetre', 'centimetres', 'centimeter', 'centimeters'], new Decimal(10)),
    ...spellings(['in', 'inch', 'inches'], MILLIMETRES_PER_INCH),
  ]),
  expected: 'a thickness such as "4 cm", "38 mm" or "1.5 in"',
  noun: 'length',
  unitHint: 'mm, cm or in',
};

/**
 * Reads a length (a cut's thickness) and returns it in millimetres.
 * @throws QuantityError when the text is not a length
 */
export function parseLength(text: string): Decimal {
  return parseWithTable(text, LENGTH);
}
