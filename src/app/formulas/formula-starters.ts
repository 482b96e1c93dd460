import type { FormulaKind } from './formula-api-types';

// Small starting points for a new formula, one per kind; each passes the server's checks.
// ID and TITLE are replaced with what the admin typed.
const STARTERS: Record<FormulaKind, string> = {
  cure: `# yaml-language-server: $schema=../shared/schema/formula.schema.json
formula: 1
id: ID
title: TITLE
kind: cure
method: dry # dry, brine or pump
product: bacon # bacon, whole-muscle or comminuted: selects the nitrite limit
species: pork # beef, pork, lamb, veal or poultry, or a list: the cooking temperature
ingredients:
  - { name: fine salt, pct: 2.2, salt: 100 }
  # Read nitrite and salt off the curing salt's own label.
  - { name: curing salt (6.25 % nitrite), pct: 0.25, nitrite: 6.25, salt: 93.75 }
  - { name: brown sugar, pct: 1 }
hold:
  days_per_cm: 2
  min_days: 5
steps:
  - Weigh the trimmed meat and note its green weight.
`,
  dough: `# yaml-language-server: $schema=../shared/schema/formula.schema.json
formula: 1
id: ID
title: TITLE
kind: dough
ingredients:
  - { name: bread flour, pct: 100, flour: true, allergens: [wheat] }
  - { name: water, pct: 65, food: water }
  - { name: fine salt, pct: 2 }
  - { name: instant yeast, pct: 1, yeast: instant }
piece: 100 g
loss_pct: 2
ddt:
  target: 25 °C
  friction: 10 °C
`,
  blend: `# yaml-language-server: $schema=../shared/schema/formula.schema.json
formula: 1
id: ID
title: TITLE
kind: blend
species: beef # beef, pork, lamb, veal or poultry, or a list: the cooking temperature
standard: ground-beef
components:
  - { key: lean, name: lean trim 90/10, fat: 10 }
  - { key: fat, name: fat trim 50/50, fat: 50 }
target: { fat: 20 }
portion: 4 oz
`,
  mix: `# yaml-language-server: $schema=../shared/schema/formula.schema.json
formula: 1
id: ID
title: TITLE
kind: mix
ingredients:
  - { name: base ingredient, pct: 100, base: true }
  - { name: second ingredient, pct: 20 }
`,
  assembly: `# yaml-language-server: $schema=../shared/schema/formula.schema.json
formula: 1
id: ID
title: TITLE
kind: assembly
# One unit as served. Each part names another formula and how much of it goes into one unit:
# portions (a blend), pieces (a dough), slices with slice (a cure), amount (any batch formula),
# units (another assembly), or pct of the green weight of the cure it goes on, with on (a rub).
# A cure also needs thickness or largest_piece for its hold.
components:
PARTS`,
};

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

/**
 * The starter YAML of a kind, with its id and title filled in; an assembly's parts come from
 * the library (see starterParts).
 */
export function starterYaml(
  kind: FormulaKind,
  id: string,
  title: string,
  library: readonly LibraryEntry[] = [],
): string {
  // JSON quoting is valid YAML and keeps a title with a colon or a hash in one piece.
  return STARTERS[kind]
    .replace('id: ID', `id: ${id}`)
    .replace('title: TITLE', `title: ${JSON.stringify(title)}`)
    .replace('PARTS', () => starterParts(library));
}
