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
species: beef
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
# One unit as served: each part names another formula and how much of it goes in.
components:
  - { formula: chuck-grind, portions: 1 }
`,
};

/** The starter YAML of a kind, with its id and title filled in. */
export function starterYaml(kind: FormulaKind, id: string, title: string): string {
  // JSON quoting is valid YAML and keeps a title with a colon or a hash in one piece.
  return STARTERS[kind]
    .replace('id: ID', `id: ${id}`)
    .replace('title: TITLE', `title: ${JSON.stringify(title)}`);
}
