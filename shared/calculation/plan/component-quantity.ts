import type { Decimal } from '../../decimal.ts';
import type { AssemblyComponent, FormulaKind } from '../../formula/formula-types.ts';
import { parseLength } from '../../units/length.ts';
import { parseMass } from '../../units/mass.ts';
import { QuantityError } from '../../units/quantity-error.ts';
import type { HoldMeasures } from '../cure/hold-time.ts';

/**
 * The keys that say how much of a formula goes into one unit of an assembly; `pct` (with `on`)
 * is a share of the green weight of the part it goes on.
 */
export const QUANTITY_KEYS = ['portions', 'pieces', 'slices', 'amount', 'units', 'pct'] as const;

/** One of {@link QUANTITY_KEYS}. */
export type QuantityKey = (typeof QUANTITY_KEYS)[number];

/** The kinds of formula each quantity key can name. */
export const KINDS_FOR: Readonly<Record<QuantityKey, readonly FormulaKind[]>> = {
  portions: ['blend'],
  pieces: ['dough'],
  slices: ['cure'],
  amount: ['cure', 'dough', 'blend', 'mix'],
  units: ['assembly'],
  pct: ['cure', 'dough', 'blend', 'mix'],
};

/** The size keys a cure's hold rule may need; they apply only to a cure. */
export const SIZE_KEYS = ['thickness', 'largest_piece'] as const;

/** The quantity keys a component gives, in the order of {@link QUANTITY_KEYS}. */
export function quantityKeysOf(component: AssemblyComponent): QuantityKey[] {
  return QUANTITY_KEYS.filter((key) => component[key] !== undefined);
}

/** The one quantity key of a component that passed checkAssemblyFormula. */
export function quantityKeyOf(component: AssemblyComponent): QuantityKey {
  const [key] = quantityKeysOf(component);
  if (key === undefined) {
    throw new Error(`component "${component.formula}" gives no quantity; check the assembly first`);
  }
  return key;
}

/**
 * The quantity keys that fit a kind, in words: "portions or amount". A share of another part
 * (pct) is left out: it is a way of applying a part, not of serving it.
 */
export function keysForKind(kind: FormulaKind): string {
  const keys = QUANTITY_KEYS.filter((key) => key !== 'pct' && KINDS_FOR[key].includes(kind)).map(
    (key) => (key === 'slices' ? 'slices (with slice)' : key),
  );
  return keys.length > 1 ? `${keys.slice(0, -1).join(', ')} or ${keys.at(-1)}` : keys[0];
}

/** A size read from a component, or undefined when it is missing or does not read. */
function readOr(text: string | undefined, parse: (text: string) => Decimal): Decimal | undefined {
  if (text === undefined) return undefined;
  try {
    return parse(text);
  } catch (error) {
    // checkAssemblyFormula reports a size that does not read; here it counts as not given.
    if (error instanceof QuantityError) return undefined;
    throw error;
  }
}

/** The sizes a component gives for a cure's hold rule: thickness in mm, heaviest piece in g. */
export function componentSizes(component: AssemblyComponent): HoldMeasures {
  const thicknessMm = readOr(component.thickness, parseLength);
  const largestPieceGrams = readOr(component.largest_piece, parseMass);
  return {
    ...(thicknessMm ? { thicknessMm } : {}),
    ...(largestPieceGrams ? { largestPieceGrams } : {}),
  };
}
