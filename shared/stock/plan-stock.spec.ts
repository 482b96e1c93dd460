import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { BELLY, BUN, libraryOf } from '../calculation/plan/plan-fixtures.ts';
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
      stock.lines.map((line) => [line.name, line.status, line.short.exact]),
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

describe('planStock, eggs counted and milk by the litre', () => {
  // The demo catalogue's weights per unit. source: USDA FoodData Central, SR Legacy, "Egg,
  // whole, raw, fresh", 1 large = 50 g; "Milk, whole, 3.25% milkfat, with added vitamin D",
  // 1 cup = 244 g (both from memory)
  const catalogue: Catalogue = {
    catalogue: 1,
    items: [
      {
        key: 'whole-milk',
        name: 'whole milk',
        kind: 'dairy',
        unit: 'l',
        weighs: '244 g per cup',
      },
      {
        key: 'eggs',
        name: 'eggs',
        formula_names: ['whole egg'],
        kind: 'egg',
        unit: 'each',
        weighs: '50 g',
      },
    ],
  };
  const bun = (start: string, egg: string, milk: string) =>
    ({
      formula: { id: BUN.id, title: BUN.title, kind: 'dough' },
      start,
      materials: [
        { name: 'whole egg', grams: dec(egg), formula: BUN.id },
        { name: 'whole milk', grams: dec(milk), formula: BUN.id },
      ],
    }) as unknown as PlanBatch;
  // An invented plan drawn by hand: buns on Thu 17 and Fri 18 Dec 2026.
  const plan = {
    today: '2026-12-03',
    batches: [bun('2026-12-17', '500', '1500'), bun('2026-12-18', '510', '0')],
  } as unknown as PlanResult;
  const lot = (item: string, code: string, remaining: string) => ({
    item,
    lot: code,
    remaining: dec(remaining),
    useBy: '2026-12-31',
    receivedAt: '2026-12-02T07:00:00Z',
  });
  const stock = planStock(
    plan,
    libraryOf(BUN),
    catalogue,
    {
      lots: [lot('eggs', 'R261202-01', '18'), lot('whole-milk', 'R261202-02', '2000')],
      lastFrom: new Map([['eggs', { supplier: 'Lowmere Dairy', receivedOn: '2026-12-02' }]]),
    },
    'metric',
  );

  // by hand: Thursday's 500 g of egg are 500 ÷ 50 = 10 eggs; Friday's 510 g are 10.2, so 11
  // (a cracked egg is used whole): 21 needed. The 18 on hand give Thursday its 10 and Friday the
  // 8 left: 3 short, to arrive by Friday morning.
  it('should compare a need of eggs in grams with the eggs on hand, counted', () => {
    assert.ok(stock.compared);
    const eggs = stock.lines.find((line) => line.item === 'eggs');
    assert.ok(eggs);
    assert.equal(eggs.measure, 'each');
    assert.deepEqual(
      [eggs.needed.exact, eggs.onHand.exact, eggs.usable.exact, eggs.short.exact],
      ['21', '18', '18', '3'],
    );
    assert.equal(eggs.short.amount, '3 each');
    assert.equal(eggs.arriveBy, '2026-12-18');
    assert.equal(eggs.conversion, 'counted at 50 g for one, in whole pieces for each batch');
    assert.equal(stock.apart.length, 0);
  });

  // by hand: 1 500 g of milk at 244 g a US cup (236.5882365 ml, NIST SP 811 (2008), Appendix
  // B.8) is 1 500 × 236.5882365 ÷ 244 = 1 454.44 ml, within the 2 l on hand.
  it('should compare a need of milk in grams with the litres on hand', () => {
    assert.ok(stock.compared);
    const milk = stock.lines.find((line) => line.item === 'whole-milk');
    assert.ok(milk);
    assert.equal(milk.status, 'covered');
    assert.equal(milk.measure, 'ml');
    assert.equal(milk.needed.exact, '1454.435880122950819672131147540983606557');
    assert.equal(milk.needed.amount, '1454 ml');
    assert.equal(milk.onHand.amount, '2000 ml');
    assert.equal(milk.conversion, 'measured at 244 g per cup');
  });

  it('should say, where the catalogue gives no weight for one, that it is not compared', () => {
    const bare: Catalogue = {
      catalogue: 1,
      items: catalogue.items.map(({ weighs: _none, ...item }) => item),
    };
    const apart = planStock(
      plan,
      libraryOf(BUN),
      bare,
      { lots: [], lastFrom: new Map() },
      'metric',
    );
    assert.ok(apart.compared);
    assert.deepEqual(
      apart.apart.map((line) => [line.name, line.reason, line.why]),
      [
        [
          'whole egg',
          'by-count',
          'stocked by count but weighed in the formulas, and the catalogue of materials gives no weight for one whole egg: check the stock by hand',
        ],
        [
          'whole milk',
          'by-volume',
          'stocked by volume but weighed in the formulas, and the catalogue of materials gives no weight for a volume of whole milk: check the stock by hand',
        ],
      ],
    );
  });
});
