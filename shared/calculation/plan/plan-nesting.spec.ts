import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { Decimal } from '../../decimal.ts';
import type { BlendFormula, CureFormula } from '../../formula/formula-types.ts';
import { planAssembly } from './plan-assembly.ts';
import { BELLY, BUN, BURGER, GRIND, KITCHEN, SAUCE, assembly, libraryOf } from './plan-fixtures.ts';
import type { PlanResult } from './plan-types.ts';

const OPTIONS = { count: 30, serviceDate: '2026-12-18', today: '2026-11-20' };
const places4 = (value: Decimal | undefined): string =>
  (value ?? new Decimal(-1)).toDecimalPlaces(4).toFixed(4);
const batchOf = (plan: PlanResult, id: string) => plan.batches.find((b) => b.formula.id === id);

describe('planAssembly: nested assemblies, one batch per formula, yields carried back', () => {
  it('should multiply a nested assembly through and add a formula named twice into one batch', () => {
    // 30 platters × 2 burgers = 60 burgers: 120 portions; sauce 60 × 20 g + 30 × 10 g = 1 500 g.
    const platter = assembly(
      'pit-platter',
      [
        { formula: 'smokehouse-burger', units: 2 },
        { formula: 'house-sauce', amount: '10 g' },
      ],
      'Pit platter',
    );
    const plan = planAssembly(platter, libraryOf(...KITCHEN.values(), platter), OPTIONS);
    assert.equal(plan.batches.length, 4);
    assert.deepEqual(batchOf(plan, 'house-sauce')?.batch, { total: '1500 g', start: '2026-12-18' });
    assert.deepEqual(batchOf(plan, 'house-sauce')?.purposes, [
      'Pit platter › Smokehouse burger (60 units): 20 g each = 1200 g',
      'Pit platter (30 units): 10 g each = 300 g',
    ]);
    // 120 portions × 113.3980925 g = 13 607.7711 g
    assert.deepEqual(batchOf(plan, 'chuck-grind')?.batch, {
      total: '13607.7711 g',
      start: '2026-12-18',
    });
    assert.deepEqual(batchOf(plan, 'pit-bun')?.batch, { pieces: '60', start: '2026-12-17' });
    assert.equal(plan.assembly.id, 'pit-platter');
  });

  it('should make one dough batch when a dough is needed by pieces and by weight', () => {
    const both = assembly('bun-and-crumbs', [
      { formula: 'pit-bun', pieces: 1 },
      { formula: 'pit-bun', amount: '10 g' },
    ]);
    const plan = planAssembly(both, libraryOf(BUN, both), OPTIONS);
    // 30 × 90 g ÷ 0.97 = 2 783.5052 g for the pieces, + 30 × 10 g = 300 g: 3 083.5052 g.
    const bun = batchOf(plan, 'pit-bun');
    assert.equal(places4(new Decimal((bun?.batch.total ?? '').replace(' g', ''))), '3083.5052');
    assert.match(
      plan.warnings.join('\n'),
      /Milk and honey bun, with sponge is needed both by pieces and by weight/,
    );
  });

  it('should work a seasoned blend back to its meat so every portion is there', () => {
    // 1.5 % salt + 0.5 % pepper: meat = seasoned ÷ 1.02. 30 × 100 g = 3 000 g seasoned
    // → 2 941.1765 g of meat (rounded up at 10⁻²⁰ g), which seasons back to 30 whole portions.
    const sausage: BlendFormula = {
      ...GRIND,
      id: 'breakfast-patty',
      title: 'Breakfast patty',
      portion: '100 g',
      ingredients: [
        { name: 'fine sea salt', pct: 1.5 },
        { name: 'black pepper', pct: 0.5 },
      ],
      yields: { trim: 90, cook: 75 },
    };
    const plate = assembly('breakfast-plate', [{ formula: 'breakfast-patty', portions: 1 }]);
    const plan = planAssembly(plate, libraryOf(sausage, plate), OPTIONS);
    const patty = batchOf(plan, 'breakfast-patty');
    assert.equal(places4(new Decimal((patty?.batch.total ?? '').replace(' g', ''))), '2941.1765');
    assert.equal(patty?.result.portions?.count, 30);
    // Trim yield 90 %: lean bought = blended ÷ 0.90. Lean 30 ÷ 35 × 2 941.1765 = 2 521.0084 g
    // blended, 2 801.1204 g before trimming.
    const lean = plan.pullList.find((item) => item.name === 'chuck trim 85/15 (15 % fat)');
    assert.equal(places4(lean?.grams), '2521.0084');
    assert.equal(places4(lean?.beforeTrimGrams), '2801.1204');
    // 1.5 % of the meat, 44.1176 g of salt, on the pull list too.
    assert.equal(
      places4(plan.pullList.find((item) => item.name === 'fine sea salt')?.grams),
      '44.1176',
    );
  });

  it('should ask for the green meat before trimming when a cure has a trim yield', () => {
    // 30 × 3 × 25 g = 2 250 g sliced ÷ (0.90 × 0.94) = 2 659.5745 g green ÷ 0.80 trim
    // = 3 324.4681 g of belly to buy.
    const trimmed: CureFormula = { ...BELLY, yields: { trim: 80, smoke: 90, slice: 94 } };
    const plan = planAssembly(BURGER, libraryOf(trimmed, GRIND, BUN, SAUCE), OPTIONS);
    const green = plan.pullList.find((item) => item.name.startsWith('green meat for'));
    assert.equal(places4(green?.grams), '2659.5745');
    assert.equal(places4(green?.beforeTrimGrams), '3324.4681');
  });

  it('should take the thickest size any component gives, and the formula’s own lead days', () => {
    // 2 days/cm × 5 cm = 10 days (over the 7-day minimum) + lead_days 3 = 13 days before
    // 2026-12-18 → start 2026-12-05, ready 2026-12-15.
    const slowBelly: CureFormula = { ...BELLY, lead_days: 3 };
    const blt = assembly('blt', [
      { formula: 'quillmoor-belly', slices: 4, slice: '20 g', thickness: '4 cm' },
      { formula: 'quillmoor-belly', amount: '15 g', thickness: '50 mm' },
    ]);
    const plan = planAssembly(blt, libraryOf(slowBelly, blt), OPTIONS);
    const belly = batchOf(plan, 'quillmoor-belly');
    // 30 × (4 × 20 g + 15 g) = 2 850 g finished.
    assert.deepEqual(belly?.batch, { want: '2850 g', thickness: '50 mm', start: '2026-12-05' });
    assert.equal(belly?.ready, '2026-12-15');
    assert.match(belly?.rule ?? '', /3 days before service \(lead days: the formula's own\)/);
  });
});
