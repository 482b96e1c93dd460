import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { BELLY, BUN, GRIND, libraryOf } from '../calculation/plan/plan-fixtures.ts';
import type { BatchMaterial, PlanBatch, PlanResult } from '../calculation/plan/plan-types.ts';
import type { Catalogue } from '../catalogue/catalogue-types.ts';
import { dec } from '../decimal.ts';
import type { DoughFormula } from '../formula/formula-types.ts';
import { planItemNeeds } from './plan-item-needs.ts';

// A bun whose flour names its item by key: the item's own names do not match "bread flour".
const BUN_WITH_ITEM: DoughFormula = {
  ...BUN,
  ingredients: BUN.ingredients.map((line) =>
    line.name === 'bread flour' ? { ...line, item: 'flour-t55' } : line,
  ),
};

const CATALOGUE: Catalogue = {
  catalogue: 1,
  items: [
    {
      key: 'sea-salt',
      name: 'sea salt',
      formula_names: ['fine sea salt'],
      kind: 'salt',
      unit: 'kg',
    },
    {
      key: 'beef-chuck-trim',
      name: 'beef',
      formula_names: ['chuck trim 85/15'],
      kind: 'meat',
      unit: 'kg',
    },
    { key: 'flour-t55', name: 'enriched wheat flour', kind: 'flour', unit: 'lb' },
    { key: 'water', name: 'water', kind: 'water', unit: 'l' },
    { key: 'whole-milk', name: 'whole milk', kind: 'dairy', unit: 'l' },
    { key: 'eggs', name: 'eggs', formula_names: ['whole egg'], kind: 'egg', unit: 'each' },
  ],
};

function material(
  formula: string,
  name: string,
  grams: string,
  beforeTrim?: string,
): BatchMaterial {
  return {
    name,
    grams: dec(grams),
    ...(beforeTrim ? { beforeTrimGrams: dec(beforeTrim) } : {}),
    formula,
  };
}

/** A batch with only what planItemNeeds reads: its formula, start day and materials. */
function batch(id: string, start: string, materials: BatchMaterial[]): PlanBatch {
  return { formula: { id, title: id, kind: 'mix' }, start, materials } as unknown as PlanBatch;
}

// An invented plan, drawn by hand: the belly starts Mon 7 Dec, the grind and the bun Thu 17 Dec.
const PLAN = {
  batches: [
    batch('quillmoor-belly', '2026-12-07', [
      material('quillmoor-belly', 'green meat for Quillmoor belly, dry equilibrium cure', '12000'),
      material('quillmoor-belly', 'fine sea salt', '270'),
    ]),
    batch('chuck-grind', '2026-12-17', [
      material('chuck-grind', 'chuck trim 85/15 (15 % fat)', '10000', '10500'),
      material('chuck-grind', 'Fine  Sea Salt', '150'),
    ]),
    batch('pit-bun', '2026-12-17', [
      material('pit-bun', 'bread flour', '5000'),
      material('pit-bun', 'water', '1400'),
      material('pit-bun', 'whole milk', '1500'),
      material('pit-bun', 'whole egg', '500'),
      material('pit-bun', 'unsalted butter', '500'),
    ]),
  ],
} as unknown as PlanResult;

describe('planItemNeeds', () => {
  const { needs, apart } = planItemNeeds(PLAN, libraryOf(BELLY, GRIND, BUN_WITH_ITEM), CATALOGUE);

  // by hand: salt 270 g on 7 Dec (belly) and 150 g on 17 Dec (grind, linked by its name however
  // spaced); the chuck trim (named with its fat, as a blend's batch names it) before trimming,
  // 10 500 g; the flour through its item key, 5 000 g.
  it('should give each weighed item its uses by start day, in catalogue order', () => {
    assert.deepEqual(
      needs.map((need) => ({
        item: need.item,
        name: need.name,
        uses: need.uses.map((use) => `${use.start} ${use.formula} ${use.amount.toString()}`),
      })),
      [
        {
          item: 'sea-salt',
          name: 'fine sea salt',
          uses: ['2026-12-07 quillmoor-belly 270', '2026-12-17 chuck-grind 150'],
        },
        {
          item: 'beef-chuck-trim',
          name: 'chuck trim 85/15 (15 % fat)',
          uses: ['2026-12-17 chuck-grind 10500'],
        },
        { item: 'flour-t55', name: 'bread flour', uses: ['2026-12-17 pit-bun 5000'] },
      ],
    );
  });

  it('should list apart what it cannot compare with stock, and why', () => {
    assert.deepEqual(
      apart.map((line) => `${line.name}: ${line.grams.toString()} g, ${line.reason}`),
      [
        'green meat for Quillmoor belly, dry equilibrium cure: 12000 g, no-item',
        'unsalted butter: 500 g, no-item',
        'water: 1400 g, tap-water',
        'whole egg: 500 g, by-count',
        'whole milk: 1500 g, by-volume',
      ],
    );
  });
});

describe('planItemNeeds, a cure naming its meat', () => {
  // The same belly batch, its formula naming the pork belly it is cured from: by hand, its
  // 12 000 g of green meat is a need of that item on 7 Dec, no longer a line apart.
  const belly = { ...BELLY, meat_item: 'pork-belly' };
  const catalogue: Catalogue = {
    ...CATALOGUE,
    items: [...CATALOGUE.items, { key: 'pork-belly', name: 'pork', kind: 'meat', unit: 'kg' }],
  };
  const { needs, apart } = planItemNeeds(PLAN, libraryOf(belly, GRIND, BUN_WITH_ITEM), catalogue);

  it('should draw the green meat on the item its meat_item names', () => {
    const meat = needs.find((need) => need.item === 'pork-belly');
    assert.deepEqual(
      meat?.uses.map((use) => `${use.start} ${use.formula} ${use.amount.toString()}`),
      ['2026-12-07 quillmoor-belly 12000'],
    );
    assert.ok(!apart.some((line) => line.name.startsWith('green meat')));
  });
});
