import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { Catalogue } from '../catalogue/catalogue-types.ts';
import { dec, type Decimal } from '../decimal.ts';
import type { CureFormula, DoughFormula } from '../formula/formula-types.ts';
import type { PresentedLine, PresentedResult } from '../presentation/presented-result.ts';
import type { StandingWeights } from '../process/weights-as-weighed.ts';
import { batchNeeds, CURE_MEAT_LINE, type BatchNeeds } from './batch-needs.ts';

// An invented catalogue of the Quillmoor kind: weights in kg, water and milk by the litre, eggs
// by the each.
const CATALOGUE: Catalogue = {
  catalogue: 1,
  items: [
    { key: 'pork-belly', name: 'pork belly', kind: 'meat', unit: 'kg' },
    {
      key: 'sea-salt',
      name: 'sea salt',
      formula_names: ['fine sea salt'],
      kind: 'salt',
      unit: 'kg',
    },
    {
      key: 'curing-salt-1',
      name: 'curing salt',
      formula_names: ['curing salt no. 1'],
      kind: 'curing-salt',
      unit: 'kg',
      nitrite: 6.25,
    },
    { key: 'kosher-salt', name: 'salt', formula_names: ['kosher salt'], kind: 'salt', unit: 'lb' },
    { key: 'water', name: 'water', kind: 'water', unit: 'l' },
    {
      key: 'bread-flour',
      name: 'flour',
      formula_names: ['bread flour'],
      kind: 'flour',
      unit: 'kg',
    },
    { key: 'whole-milk', name: 'whole milk', kind: 'dairy', unit: 'l' },
    { key: 'eggs', name: 'eggs', formula_names: ['whole egg'], kind: 'egg', unit: 'each' },
  ],
};

const BELLY: CureFormula = {
  formula: 1,
  id: 'test-belly',
  title: 'Test belly',
  kind: 'cure',
  method: 'dry',
  product: 'bacon',
  species: 'pork',
  meat_item: 'pork-belly',
  ingredients: [
    { name: 'fine sea salt', pct: 2.25, salt: 100 },
    { name: 'curing salt no. 1', pct: 0.25, nitrite: 6.25, salt: 93.75 },
    { name: 'cracked black pepper', pct: 0.3 },
  ],
};

const line = (name: string, grams: string, role: PresentedLine['role'] = 'ingredient') =>
  ({ name, grams, amount: `${grams} g`, role }) as PresentedLine;

function resultOf(
  inputs: { label: string; exact: string }[],
  groups: { title: string; lines: PresentedLine[] }[],
): PresentedResult {
  return { inputs: inputs.map((i) => ({ ...i, value: i.exact })), groups } as never;
}

const NONE: StandingWeights = { lines: new Map(), stages: new Map() };

// hand-worked: 10 000 g of belly; sea salt 2.25 % = 225 g, curing salt 0.25 % = 25 g,
// pepper 0.3 % = 30 g (the formula's own percentages of green weight)
const BELLY_RESULT = resultOf(
  [{ label: 'Green weight', exact: '10000' }],
  [
    {
      title: 'Cure mix',
      lines: [
        line('fine sea salt', '225'),
        line('curing salt no. 1', '25', 'curing-salt'),
        line('cracked black pepper', '30'),
      ],
    },
  ],
);

const BUN = {
  formula: 1,
  id: 'test-bun',
  title: 'Test bun',
  kind: 'dough',
  ingredients: [
    { name: 'bread flour', pct: 100, flour: true },
    { name: 'whole milk', pct: 30 },
    { name: 'whole egg', pct: 10 },
  ],
} as DoughFormula;

/** The needs as "item: amount" lines and the lines apart as "name: grams", to compare by hand. */
function said(needs: BatchNeeds): { items: string[]; apart: string[] } {
  const text = (d: Decimal | null) => (d === null ? 'unknown' : d.toString());
  return {
    items: needs.items.map((n) => `${n.item}: ${text(n.amount)}${n.weighed ? ' weighed' : ''}`),
    apart: needs.unlinked.map((u) => `${u.name}: ${u.grams.toString()}`),
  };
}

describe('batchNeeds', () => {
  it('should need the belly, the salts and list the pepper with no item apart', () => {
    const needs = batchNeeds(BELLY, BELLY_RESULT, NONE, CATALOGUE);
    assert.deepEqual(said(needs), {
      items: ['pork-belly: 10000', 'sea-salt: 225', 'curing-salt-1: 25'],
      apart: ['cracked black pepper: 30'],
    });
    assert.deepEqual(needs.items[0].lines, [CURE_MEAT_LINE]);
  });

  // The green weight and the salt as weighed (9 820 g, 230 g) stand in for the calculation's.
  it('should take weights as weighed before the calculated ones', () => {
    const weights: StandingWeights = {
      lines: new Map([['fine sea salt', dec('230')]]),
      stages: new Map([['green', dec('9820')]]),
    };
    assert.deepEqual(said(batchNeeds(BELLY, BELLY_RESULT, weights, CATALOGUE)).items, [
      'pork-belly: 9820 weighed',
      'sea-salt: 230 weighed',
      'curing-salt-1: 25',
    ]);
  });

  it('should list every line apart, the meat too, when the formula names no meat item', () => {
    const { meat_item: _none, ...noMeat } = BELLY;
    const needs = batchNeeds(noMeat, BELLY_RESULT, NONE, CATALOGUE);
    assert.deepEqual(said(needs).apart, [`${CURE_MEAT_LINE}: 10000`, 'cracked black pepper: 30']);
    assert.deepEqual(said(batchNeeds(BELLY, BELLY_RESULT, NONE)).items, []);
  });

  // hand-worked: a pump's brine and cover brine each have water and kosher salt, the same item
  // twice: 979 + 2 375 = 3 354 g of water, 1 ml a gram (the project's convention, 1 kg a litre,
  // shared/units/volume.ts) = 3 354 ml; salt 198 + 75 = 273 g, kept in grams though it comes by
  // the pound.
  it('should add up one item over two groups and count water in millilitres', () => {
    const pump: CureFormula = {
      ...BELLY,
      method: 'pump',
      ingredients: [{ name: 'kosher salt', pct: 2 }],
      meat_item: undefined,
    };
    const result = resultOf(
      [],
      [
        { title: 'Brine', lines: [line('water', '979', 'water'), line('kosher salt', '198')] },
        { title: 'Cover', lines: [line('water', '2375', 'water'), line('kosher salt', '75')] },
      ],
    );
    const needs = batchNeeds(pump, result, NONE, CATALOGUE);
    assert.deepEqual(said(needs).items, ['water: 3354', 'kosher-salt: 273']);
    assert.deepEqual(
      needs.items.map((n) => n.measure),
      ['ml', 'g'],
    );
  });

  // hand-worked: flour 357 g in the sponge + 833 g in the final dough = 1 190 g; the sponge
  // weighed into the final dough and the overall formula printed for reference count nothing.
  // Milk is bought by the litre and eggs by the each, with no weight per unit in the catalogue.
  it('should count a dough once, leaving what is bought by volume or the each to the cook', () => {
    const result = resultOf(
      [],
      [
        { title: 'Preferment: sponge', lines: [line('bread flour', '357')] },
        {
          title: 'Final dough',
          lines: [
            line('bread flour', '833'),
            line('whole milk', '357'),
            line('whole egg', '119'),
            line('sponge', '644', 'preferment'),
          ],
        },
        { title: 'Overall formula (reference)', lines: [line('bread flour', '1190')] },
      ],
    );
    assert.deepEqual(said(batchNeeds(BUN, result, NONE, CATALOGUE)), {
      items: ['bread-flour: 1190', 'whole-milk: unknown', 'eggs: unknown'],
      apart: [],
    });
  });

  // hand-worked, with the demo catalogue's weights per unit (source: USDA FoodData Central, SR
  // Legacy, "Egg, whole, raw, fresh", 1 large = 50 g; "Milk, whole, 3.25% milkfat, with added
  // vitamin D", 1 cup = 244 g; both from memory): the dough's 119 g of egg and the wash's 30 g
  // are 149 g, 2.98 eggs, so 3 cracked (rounded once: line by line it would be 3 + 1 = 4); the
  // 357 g of milk are 357 × 236.5882365 ÷ 244 ml (a US cup, NIST SP 811 (2008), Appendix B.8).
  it('should turn grams into pieces and millilitres through the catalogue, rounding pieces once', () => {
    const catalogue: Catalogue = {
      ...CATALOGUE,
      items: CATALOGUE.items.map((item) =>
        item.key === 'eggs'
          ? { ...item, formula_names: ['whole egg', 'egg for the wash'], weighs: '50 g' }
          : item.key === 'whole-milk'
            ? { ...item, weighs: '244 g per cup' }
            : item,
      ),
    };
    const bun: DoughFormula = {
      ...BUN,
      ingredients: [...BUN.ingredients, { name: 'egg for the wash', pct: 2.5 }],
    };
    const result = resultOf(
      [],
      [
        {
          title: 'Final dough',
          lines: [
            line('bread flour', '1190'),
            line('whole milk', '357'),
            line('whole egg', '119'),
            line('egg for the wash', '30'),
          ],
        },
      ],
    );
    const needs = batchNeeds(bun, result, NONE, catalogue);
    assert.deepEqual(said(needs).items, [
      'bread-flour: 1190',
      'whole-milk: 346.1557394692622950819672131147540983607',
      'eggs: 3',
    ]);
    assert.deepEqual(
      needs.items.map((need) => [need.measure, need.grams.toString()]),
      [
        ['g', '1190'],
        ['ml', '357'],
        ['each', '149'],
      ],
    );
  });
});
