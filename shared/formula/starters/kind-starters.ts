import type { BatchKind } from '../formula-types.ts';

/** Starter dough, blend and mix formulas (the body after id and title), every key explained. */
export const KIND_STARTERS: Record<Exclude<BatchKind, 'cure'>, string> = {
  dough: `kind: dough
# Baker's percentages: every pct is % of the total flour; the flours add up to 100.
ingredients:
  - { name: bread flour, pct: 100, flour: true, allergens: [wheat] }
  - { name: water, pct: 62, food: water }
  # food: says which published water content counts toward true hydration
  - { name: whole milk, pct: 10, food: milk-whole, allergens: [milk] }
  - { name: instant yeast, pct: 1, yeast: instant }
  - { name: fine salt, pct: 2 }
piece: 90 g                # default piece weight when scaling by --pieces
loss_pct: 2                # dough lost in mixing and dividing, % of the mixed dough
ddt:
  target: 25 °C            # desired dough temperature
  friction: 14 °F          # the mixer's rise, a temperature difference
steps:
  - Mix to full development; bulk 60 minutes.
  - Divide, round, proof and bake.
`,
  blend: `kind: blend
species: beef              # beef, pork, lamb, veal or poultry, or a list: the cooking temperature
standard: ground-beef      # optional: check the legal fat ceiling (30 %)
components:                # two to five; give fat % or chemical lean (lean: 85)
  - { key: lean, name: chuck trim 85/15, fat: 15 }
  - { key: fat, name: fat trim 50/50, fat: 50 }
target: { fat: 20 }        # or { lean: 80 }
portion: 4 oz
steps:
  - Keep everything below 4 °C; grind through the coarse plate, then the fine.
`,
  mix: `kind: mix
# Every pct is % of the base ingredient's weight; exactly one base at 100.
ingredients:
  - { name: mayonnaise, pct: 100, base: true, allergens: [egg] }
  - { name: pickle relish, pct: 20 }
  - { name: smoked paprika, pct: 1.5 }
steps:
  - Whisk together; label and date; hold at 5 °C or below.
`,
};
