import { type Decimal, sum } from '../decimal.ts';
import { QuantityError } from './quantity-error.ts';
import { tokenize } from './tokenize.ts';

/** How to read one kind of quantity: its units and the words for its errors. */
export interface UnitTable {
  /** Base units per unit, keyed by every spelling accepted. */
  readonly factors: ReadonlyMap<string, Decimal>;
  /** What would have been accepted, with examples. */
  readonly expected: string;
  /** The kind of quantity, for "is not a … unit" and "cannot be negative". */
  readonly noun: string;
  /** The units to suggest when none is given, e.g. "g, kg, oz or lb". */
  readonly unitHint: string;
}

/** Expands a list of spellings that share one factor into map entries. */
export function spellings(names: readonly string[], factor: Decimal): [string, Decimal][] {
  return names.map((name) => [name, factor]);
}

/**
 * Reads a quantity of one or more terms ("4 lb 4 oz") in the table's units and returns their
 * sum in the base unit.
 * @throws QuantityError when the text is not such a quantity
 */
export function parseWithTable(text: string, table: UnitTable): Decimal {
  const terms = tokenize(text);
  if (typeof terms === 'string') throw new QuantityError(text, table.expected, terms);
  return sum(
    terms.map((term) => {
      if (term.unit === '') {
        throw new QuantityError(text, table.expected, `a unit is missing (${table.unitHint})`);
      }
      const factor = table.factors.get(term.unit);
      if (!factor)
        throw new QuantityError(text, table.expected, `"${term.unit}" is not a ${table.noun} unit`);
      if (term.value.isNegative()) {
        throw new QuantityError(text, table.expected, `a ${table.noun} cannot be negative`);
      }
      return term.value.times(factor);
    }),
  );
}
