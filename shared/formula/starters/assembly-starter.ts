import type { FormulaKind } from '../formula-types.ts';

/** A formula of the library, as the list of formulas gives it. */
export interface LibraryEntry {
  readonly id: string | null;
  readonly kind: FormulaKind | null;
  readonly valid: boolean;
  readonly duplicate?: boolean;
}

// A starter assembly's parts, one per kind in this order, with a finished weight that fits any
// batch formula (common practice, no source: a burger patty, a bun, a spoon of sauce).
const PART_WEIGHTS: readonly { kind: FormulaKind; amount: string }[] = [
  { kind: 'blend', amount: '150 g' },
  { kind: 'dough', amount: '90 g' },
  { kind: 'mix', amount: '20 g' },
];
// Used when the library has none of those kinds: a demo formula, to be replaced.
const PLACEHOLDER = `  # Replace chuck-grind with a formula of your library.
  - { formula: chuck-grind, amount: 150 g }
`;

/**
 * The parts of a starter assembly, as YAML lines: the first valid blend, dough and mix of the
 * library (by id), each by finished weight, which fits any batch formula; a cure only when
 * there is nothing else, with the sizes its hold rule may go by; a placeholder naming a demo
 * formula, said to be replaced, when the library has no usable batch formula at all.
 */
export function starterParts(library: readonly LibraryEntry[]): string {
  const usable = library
    .filter((entry) => entry.valid && !entry.duplicate && entry.id !== null)
    .sort((a, b) => String(a.id).localeCompare(String(b.id)));
  const lines = PART_WEIGHTS.flatMap(({ kind, amount }) => {
    const found = usable.find((entry) => entry.kind === kind);
    return found ? [`  - { formula: ${found.id}, amount: ${amount} }\n`] : [];
  });
  if (lines.length > 0) return lines.join('');
  const cure = usable.find((entry) => entry.kind === 'cure');
  return cure
    ? `  - { formula: ${cure.id}, amount: 50 g, thickness: 4 cm, largest_piece: 2 kg }\n`
    : PLACEHOLDER;
}

/** The starter assembly (the body after id and title), its parts taken from `library`. */
export function assemblyStarter(library: readonly LibraryEntry[]): string {
  return `kind: assembly
# One unit as served. Each part names another formula and how much of it goes into one unit:
# portions (a blend), pieces (a dough), slices with slice (a cure), amount (any batch formula),
# units (another assembly), or pct of the green weight of the cure it goes on, with on (a rub).
# A cure also needs thickness or largest_piece for its hold.
components:
${starterParts(library)}`;
}
