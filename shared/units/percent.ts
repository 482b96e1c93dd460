import type { Decimal } from '../decimal.ts';
import { QuantityError } from './quantity-error.ts';
import { tokenize } from './tokenize.ts';

const EXPECTED = 'a percentage such as "3" or "3 %"';

/**
 * Reads a percentage ("3", "3%", "12.5 %") and returns the number of percent (3, 12.5).
 * @throws QuantityError when the text is not a percentage
 */
export function parsePercent(text: string): Decimal {
  const terms = tokenize(text);
  if (typeof terms === 'string') throw new QuantityError(text, EXPECTED, terms);
  if (terms.length !== 1) throw new QuantityError(text, EXPECTED, 'give one number');
  const [term] = terms;
  if (term.unit !== '' && term.unit !== '%') {
    throw new QuantityError(text, EXPECTED, `"${term.unit}" is not a percent sign`);
  }
  return term.value;
}

/**
 * Reads a plain whole count such as a number of pieces.
 * @throws QuantityError when the text is not a whole number
 */
export function parseCount(text: string): number {
  const trimmed = text.trim();
  if (!/^\d+$/.test(trimmed)) {
    throw new QuantityError(text, 'a whole number such as 48', 'it is not a whole number');
  }
  return Number(trimmed);
}
