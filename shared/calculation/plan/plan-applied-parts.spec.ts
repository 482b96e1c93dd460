import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { Decimal } from '../../decimal.ts';
import type { CureFormula } from '../../formula/formula-types.ts';
import { planAssembly } from './plan-assembly.ts';
import { PlanError } from './plan-error.ts';
import { BELLY, BRISKET, RUB, SANDWICH, assembly, libraryOf } from './plan-fixtures.ts';
import type { PlanResult } from './plan-types.ts';

const OPTIONS = { count: 60, serviceDate: '2026-12-18', today: '2026-11-20' };
const places4 = (value: Decimal | undefined): string =>
  (value ?? new Decimal(-1)).toDecimalPlaces(4).toFixed(4);
const batchOf = (plan: PlanResult, id: string) => {
  const batch = plan.batches.find((b) => b.formula.id === id);
  assert.ok(batch, `no batch of ${id}`);
  return batch;
};
const grams = (text: string | undefined): Decimal =>
  new Decimal((text ?? '-1 g').replace(' g', ''));
const KITCHEN = libraryOf(BRISKET, RUB, SANDWICH);

describe('planAssembly: a part applied to another part (the rub on the brisket)', () => {
  const plan = planAssembly(SANDWICH, KITCHEN, OPTIONS);

  it('should start the rub on the day the brisket comes out of the brine, not on the service day', () => {
    // Brisket hold: 1.5 days/cm × 5 cm + 1 = 8.5, rounded up to 9 days (over the 5-day minimum),
    // then lead_days 2 (soak out and dry overnight, rub and smoke, rest): 11 days before
    // 2026-12-18 → start 2026-12-07, out of the brine (ready) 2026-12-16.
    // The rub goes on after the hold, before smoking, so it is made by 2026-12-16.
    // source: the demo formula's own hold rule and lead days (common practice, no source)
    const brisket = batchOf(plan, 'brisket-brine');
    assert.equal(brisket.start, '2026-12-07');
    assert.equal(brisket.ready, '2026-12-16');
    const rub = batchOf(plan, 'brisket-rub');
    assert.equal(rub.start, '2026-12-16');
    assert.deepEqual(rub.goesOn, [
      {
        formula: { id: 'brisket-brine', title: 'Brisket flat, equilibrium brine' },
        date: '2026-12-16',
      },
    ]);
    assert.match(rub.rule, /goes on Brisket flat, equilibrium brine when it comes out of its hold/);
    assert.deepEqual(
      plan.days.map((day) => [day.date, day.batches.map((b) => b.formula.id)]),
      [
        ['2026-12-07', ['brisket-brine']],
        ['2026-12-16', ['brisket-rub']],
      ],
    );
  });

  it('should weigh the rub as 1.5 % of the brisket’s green weight: 167.0201 g for 60 sandwiches', () => {
    // 60 × 140 g = 8 400 g sliced ÷ (0.82 smoke × 0.92 slice) = 11 134.6766 g green;
    // 1.5 % of that = 167.0201 g of rub. (Worked by hand, bc: 8400/(0.82*0.92)*0.015.)
    const brisket = batchOf(plan, 'brisket-brine');
    assert.deepEqual(brisket.batch, { want: '8400 g', thickness: '50 mm', start: '2026-12-07' });
    const rub = batchOf(plan, 'brisket-rub');
    assert.equal(places4(grams(rub.batch.total)), '167.0201');
    assert.deepEqual(rub.purposes, [
      'Smoked corned-beef sandwich (60 units): 1.5 % of the green weight of Brisket flat, equilibrium brine',
    ]);
  });

  it('should rub only the brisket of the part it goes on, when the same brisket is served plain too', () => {
    // 10 platters of one sandwich and 60 g of plain brisket: brisket 10 × 200 g = 2 000 g sliced;
    // rub 1.5 % × (10 × 140 g ÷ 0.7544) = 1.5 % × 1 855.7794 g = 27.8367 g.
    const platter = assembly('platter', [
      { formula: 'corned-beef-sandwich', units: 1 },
      { formula: 'brisket-brine', amount: '60 g', thickness: '5 cm' },
    ]);
    const both = planAssembly(platter, libraryOf(BRISKET, RUB, SANDWICH, platter), {
      ...OPTIONS,
      count: 10,
    });
    assert.equal(batchOf(both, 'brisket-brine').batch.want, '2000 g');
    assert.equal(places4(grams(batchOf(both, 'brisket-rub').batch.total)), '27.8367');
  });

  it('should make one batch, by the earliest day, of a part both applied and served on its own', () => {
    // The rub on the brisket (167.0201 g, made 2026-12-16) and 3 g a sandwich on the side
    // (180 g, made on the day): one batch of 347.0201 g, started 2026-12-16.
    const side = assembly('side-rub', [
      ...SANDWICH.components,
      { formula: 'brisket-rub', amount: '3 g' },
    ]);
    const rub = batchOf(planAssembly(side, libraryOf(BRISKET, RUB, side), OPTIONS), 'brisket-rub');
    assert.equal(places4(grams(rub.batch.total)), '347.0201');
    assert.equal(rub.start, '2026-12-16');
  });

  it('should count an applied part’s own lead days back from the day it goes on', () => {
    // A rub left a day to bloom (lead_days 1) is made the day before the brisket comes out of
    // the brine: 2026-12-16 − 1 = 2026-12-15.
    const rested = planAssembly(
      SANDWICH,
      libraryOf(BRISKET, { ...RUB, lead_days: 1 }, SANDWICH),
      OPTIONS,
    );
    assert.equal(batchOf(rested, 'brisket-rub').start, '2026-12-15');
    assert.match(batchOf(rested, 'brisket-rub').rule, /1 day before it goes on/);
  });

  it('should count the days a plan needs from the earliest start to service', () => {
    // Service 2026-12-10: the brisket would start 2026-11-29 (11 days before); from 2026-12-02
    // the earliest service is 2026-12-02 + 11 = 2026-12-13.
    assert.throws(
      () =>
        planAssembly(SANDWICH, KITCHEN, {
          ...OPTIONS,
          serviceDate: '2026-12-10',
          today: '2026-12-02',
        }),
      (error: unknown) =>
        error instanceof PlanError &&
        error.reason === 'past-start' &&
        /^Brisket flat, equilibrium brine must start 29 Nov 2026, .*it needs 11 days; the earliest service this plan can make is 13 Dec 2026\)$/.test(
          error.message,
        ),
    );
  });

  it('should refuse parts applied to each other across nested assemblies', () => {
    const belly: CureFormula = { ...BELLY, lead_days: 1 };
    const one = assembly('one', [
      { formula: 'quillmoor-belly', amount: '20 g', thickness: '4 cm' },
      { formula: 'brisket-brine', on: 'quillmoor-belly', pct: 10, thickness: '5 cm' },
    ]);
    const two = assembly('two', [
      { formula: 'brisket-brine', amount: '20 g', thickness: '5 cm' },
      { formula: 'quillmoor-belly', on: 'brisket-brine', pct: 10, thickness: '4 cm' },
    ]);
    const both = assembly('both', [
      { formula: 'one', units: 1 },
      { formula: 'two', units: 1 },
    ]);
    assert.throws(
      () => planAssembly(both, libraryOf(belly, BRISKET, one, two, both), OPTIONS),
      (error: unknown) =>
        error instanceof PlanError &&
        error.reason === 'cycle' &&
        /goes on .* goes round in a circle/.test(error.message),
    );
  });
});
