import type { QuantityKey } from '../../../shared/calculation/plan/component-quantity.ts';
import type { FormulaKind } from '../../../shared/formula/formula-types.ts';
import type { Choice } from './formula-vocabulary';

export type { QuantityKey };

/**
 * The quantity keys of an assembly's part in the order the form offers them, with the kinds each
 * fits. It mirrors KINDS_FOR in shared/calculation/plan/component-quantity.ts (a spec keeps the
 * two the same); the console keeps its own copy so that it does not load the core's units.
 */
const KEYS: readonly { key: QuantityKey; label: string; kinds: readonly FormulaKind[] }[] = [
  { key: 'portions', label: 'Portions', kinds: ['blend'] },
  { key: 'pieces', label: 'Pieces', kinds: ['dough'] },
  { key: 'slices', label: 'Slices', kinds: ['cure'] },
  { key: 'amount', label: 'Finished weight', kinds: ['cure', 'dough', 'blend', 'mix'] },
  { key: 'units', label: 'Units', kinds: ['assembly'] },
  { key: 'pct', label: '% of the part it goes on', kinds: ['cure', 'dough', 'blend', 'mix'] },
];

/** Every quantity key, in the form's order. */
export const QUANTITY_KEYS: readonly QuantityKey[] = KEYS.map((entry) => entry.key);

/** The kinds each quantity key can name. */
export const KINDS_FOR_KEY: Readonly<Record<QuantityKey, readonly FormulaKind[]>> =
  Object.fromEntries(KEYS.map((entry) => [entry.key, entry.kinds])) as Record<
    QuantityKey,
    readonly FormulaKind[]
  >;

/** Keys given as a whole number (the others, `amount`, as a weight with its unit). */
export const COUNT_KEYS: readonly QuantityKey[] = ['portions', 'pieces', 'slices', 'units'];

/** What each key means, for the hint under the quantity. */
export const KEY_HINTS: Readonly<Record<QuantityKey, string>> = {
  portions: "Of the blend's own portion weight",
  pieces: "Of the dough's own piece weight",
  slices: 'Finished slices, each of the slice weight',
  amount: 'Finished weight per unit, e.g. 20 g',
  units: 'Units of that assembly per unit of this one',
  pct: 'Percent of the green weight of the cure it goes on, e.g. a rub at 1.5',
};

/**
 * The quantity keys that fit a formula of `kind`, as choices; every key when the kind is not
 * known (a formula that is missing or has errors), so whatever the file says can be shown.
 */
export function quantityChoices(kind: FormulaKind | null): readonly Choice<QuantityKey>[] {
  return KEYS.filter((entry) => kind === null || entry.kinds.includes(kind)).map(
    ({ key, label }) => ({ value: key, label }),
  );
}

/**
 * The key a part takes when its formula is chosen: `current` when it fits the kind, else the
 * kind's own count (portions of a blend, pieces of a dough, slices of a cure, units of an
 * assembly), else amount (a mix).
 */
export function quantityKeyFor(kind: FormulaKind | null, current: QuantityKey): QuantityKey {
  if (kind === null || KINDS_FOR_KEY[current].includes(kind)) return current;
  return KEYS.find((entry) => entry.kinds.length === 1 && entry.kinds[0] === kind)?.key ?? 'amount';
}

/** Whether a part with this key takes a cure's sizes (thickness, heaviest piece) for its hold. */
export function takesSizes(kind: FormulaKind | null, key: QuantityKey): boolean {
  return (
    (kind === null || kind === 'cure') && (key === 'slices' || key === 'amount' || key === 'pct')
  );
}
