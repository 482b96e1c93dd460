import { Decimal } from '../decimal.ts';

/** One number with the unit written after it, as in "4.26 kg" or "78°F". */
export interface Term {
  readonly value: Decimal;
  /** The unit as written, lower-cased, with "°" and a trailing dot removed; "" when missing. */
  readonly unit: string;
}

const TERM = /^([+-]?(?:\d+(?:\.\d*)?|\.\d+))\s*(°?\s*[a-zA-Zµ"'%]+\.?)?\s*/;

/**
 * Splits text such as "4 lb 4.5 oz" into terms. Returns an error message instead of terms when
 * the text is not a sequence of numbers with units.
 */
export function tokenize(text: string): Term[] | string {
  const terms: Term[] = [];
  let rest = text.trim();
  if (rest === '') return 'it is empty';
  if (/\d,\d/.test(rest)) return 'write decimals with a point (4.26), not a comma';
  while (rest.length > 0) {
    const match = TERM.exec(rest);
    if (!match) return `"${rest}" is not a number followed by a unit`;
    const unit = (match[2] ?? '').replace(/[°\s]/g, '').replace(/\.$/, '');
    terms.push({ value: new Decimal(match[1]), unit: unit === '"' ? 'in' : unit.toLowerCase() });
    rest = rest.slice(match[0].length);
  }
  return terms;
}
