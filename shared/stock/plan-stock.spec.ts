import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { BELLY, libraryOf } from '../calculation/plan/plan-fixtures.ts';
import type { PlanBatch, PlanResult } from '../calculation/plan/plan-types.ts';
import type { Catalogue } from '../catalogue/catalogue-types.ts';
import { dec } from '../decimal.ts';
import { planStock } from './plan-stock.ts';

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
      key: 'brown-sugar-dark',
      name: 'brown sugar',
      formula_names: ['dark brown sugar'],
      kind: 'sugar',
      unit: 'kg',
    },
  ],
};

// An invented plan drawn by hand: one belly batch starting Mon 7 Dec 2026.
const PLAN = {
  today: '2026-12-03',
  batches: [
    {
      formula: { id: BELLY.id, title: BELLY.title, kind: 'cure' },
      start: '2026-12-07',
      materials: [
        { name: 'fine sea salt', grams: dec('270'), formula: BELLY.id },
        { name: 'dark brown sugar', grams: dec('144'), formula: BELLY.id },
      ],
    } as unknown as PlanBatch,
  ],
} as unknown as PlanResult;

describe('planStock', () => {
  const stock = planStock(
    PLAN,
    libraryOf(BELLY),
    CATALOGUE,
    {
      lots: [
        {
          item: 'brown-sugar-dark',
          lot: 'R261201-02',
          remaining: dec('5000'),
          receivedAt: '2026-12-01T07:00:00Z',
        },
      ],
      lastFrom: new Map([
        ['sea-salt', { supplier: 'Harrowgate Dry Goods', receivedOn: '2026-11-20' }],
      ]),
    },
    'metric',
  );

  // by hand: salt 270 g needed, none on hand, so short 270 g from the belly's start, Mon 7 Dec;
  // the sugar's 144 g come out of the 5 000 g lot. The short item comes first.
  it('should put the short item first, with the day to arrive by in words and whom to ask', () => {
    assert.ok(stock.compared);
    assert.deepEqual(
      stock.lines.map((line) => [line.name, line.status, line.short.grams]),
      [
        ['fine sea salt', 'short', '270'],
        ['dark brown sugar', 'covered', '0'],
      ],
    );
    const [salt, sugar] = stock.lines;
    assert.equal(
      salt.arriveByWords,
      'by the morning of Mon 7 Dec 2026, when Quillmoor belly, dry equilibrium cure starts',
    );
    assert.deepEqual(salt.lastFrom, { supplier: 'Harrowgate Dry Goods', receivedOn: '2026-11-20' });
    assert.equal(sugar.arriveByWords, null);
    assert.equal(sugar.onHand.amount, '5000 g');
  });
});
