import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { CureFormula } from '../../formula/formula-types.ts';
import { planAssembly } from './plan-assembly.ts';
import { PlanError, type PlanRefusal } from './plan-error.ts';
import { BELLY, BUN, BURGER, GRIND, KITCHEN, SAUCE, assembly, libraryOf } from './plan-fixtures.ts';

const OPTIONS = { count: 120, serviceDate: '2026-12-18', today: '2026-11-20' };

/** Asserts that planning throws a PlanError with this reason and a message matching. */
function assertRefused(
  plan: () => unknown,
  reason: PlanRefusal,
  message: RegExp,
  formula?: string,
): void {
  assert.throws(plan, (error: unknown) => {
    assert.ok(error instanceof PlanError, String(error));
    assert.equal(error.reason, reason, error.message);
    assert.match(error.message, message);
    if (formula !== undefined) assert.equal(error.formula, formula);
    return true;
  });
}

describe('planAssembly refuses a plan that cannot be made, naming the formula', () => {
  it('should refuse a start day already past, and say the earliest service it can make', () => {
    // The bacon needs 8 hold days + 1 lead day: for 2026-12-18 it starts 2026-12-09, which is
    // before 2026-12-10; from 2026-12-10 the earliest service is 2026-12-10 + 9 = 2026-12-19.
    // A cook reads it: the formula by its title, the days as the product writes days.
    assertRefused(
      () => planAssembly(BURGER, KITCHEN, { ...OPTIONS, today: '2026-12-10' }),
      'past-start',
      /^Quillmoor belly, dry equilibrium cure must start 9 Dec 2026, already past; plan for a later date \(for service on 18 Dec 2026 .*earliest service this plan can make is 19 Dec 2026\)$/,
      'quillmoor-belly',
    );
  });

  it('should accept a plan whose first batch starts today', () => {
    const plan = planAssembly(BURGER, KITCHEN, { ...OPTIONS, today: '2026-12-09' });
    assert.equal(plan.batches[0].start, '2026-12-09');
  });

  it('should refuse a component naming a formula that is not there, suggesting a close id', () => {
    const typo = assembly('typo-burger', [{ formula: 'house-sauces', amount: '20 g' }]);
    assertRefused(
      () => planAssembly(typo, KITCHEN, OPTIONS),
      'missing-formula',
      /^typo-burger, component 1 \(house-sauces\): no formula "house-sauces".*did you mean "house-sauce"\?/,
      'house-sauces',
    );
    assertRefused(
      () => planAssembly(BURGER, libraryOf(BELLY, GRIND, BUN), OPTIONS),
      'missing-formula',
      /component 4 \(house-sauce\): no formula "house-sauce"/,
    );
  });

  it('should refuse a quantity that does not fit the formula’s kind', () => {
    const sauceByPortions = assembly('odd-plate', [{ formula: 'house-sauce', portions: 2 }]);
    assertRefused(
      () => planAssembly(sauceByPortions, KITCHEN, OPTIONS),
      'wrong-kind',
      /house-sauce is a mix: portions are for a blend; give amount/,
    );
    const burgerByAmount = assembly('odd-platter', [
      { formula: 'smokehouse-burger', amount: '300 g' },
    ]);
    assertRefused(
      () => planAssembly(burgerByAmount, KITCHEN, OPTIONS),
      'wrong-kind',
      /smokehouse-burger is an assembly: amount is for a cure, a dough, a blend or a mix; give units/,
    );
  });

  it('should refuse assemblies that contain each other', () => {
    const platter = assembly('platter', [{ formula: 'combo', units: 1 }]);
    const combo = assembly('combo', [
      { formula: 'house-sauce', amount: '10 g' },
      { formula: 'platter', units: 2 },
    ]);
    assertRefused(
      () => planAssembly(platter, libraryOf(SAUCE, platter, combo), OPTIONS),
      'cycle',
      /platter → combo → platter goes round in a circle/,
    );
  });

  it('should refuse a cure whose hold rule goes by a size the component does not give', () => {
    const noThickness = assembly('blt', [{ formula: 'quillmoor-belly', slices: 4, slice: '20 g' }]);
    assertRefused(
      () => planAssembly(noThickness, KITCHEN, OPTIONS),
      'needs-size',
      /quillmoor-belly's hold rule goes by thickness: give thickness: here/,
    );
  });

  it('should refuse the whole plan when one batch is over a critical limit', () => {
    // 0.5 % curing salt × 6.25 % nitrite × 10⁶ = 312.5 ppm, over the 200 ppm for dry-cured bacon.
    // source: USDA FSIS Directive 7620.3 ch. 3; 9 CFR 424.22(b)
    const hot: CureFormula = {
      ...BELLY,
      ingredients: BELLY.ingredients.map((i) => (i.nitrite ? { ...i, pct: 0.5 } : i)),
    };
    assertRefused(
      () => planAssembly(BURGER, libraryOf(hot, GRIND, BUN, SAUCE), OPTIONS),
      'critical-limit',
      /^Quillmoor belly, dry equilibrium cure is refused, and the plan with it: critical limit exceeded: ingoing sodium nitrite 312\.5 ppm is over 200 ppm for dry-cured bacon/,
      'quillmoor-belly',
    );
  });

  it('should refuse a batch its calculator cannot make (more than 1000 kg of grind)', () => {
    // 100 000 burgers × 2 × 113.3980925 g = 22 679.6185 kg of grind.
    assertRefused(
      () => planAssembly(BURGER, KITCHEN, { ...OPTIONS, count: 100_000 }),
      'bad-batch',
      /^Smokehouse burger grind 80\/20: --total .* is more than 1000 kg/,
    );
  });

  it('should refuse a count that is not a whole number from 1, and dates that are not dates', () => {
    assertRefused(
      () => planAssembly(BURGER, KITCHEN, { ...OPTIONS, count: 0 }),
      'bad-input',
      /count/,
    );
    assertRefused(
      () => planAssembly(BURGER, KITCHEN, { ...OPTIONS, count: 2.5 }),
      'bad-input',
      /count/,
    );
    assertRefused(
      () => planAssembly(BURGER, KITCHEN, { ...OPTIONS, serviceDate: '2026-02-30' }),
      'bad-input',
      /service date must be a date written YYYY-MM-DD/,
    );
  });

  it('should refuse a service day more than a year ahead, naming the last day it can plan for', () => {
    // A year (365 days) from 2026-11-20 is 2027-11-20. source: our start-day window (start-window.ts)
    for (const [serviceDate, words] of [
      ['2126-12-24', '24 Dec 2126'],
      ['9999-12-31', '31 Dec 9999'],
      ['2027-11-21', '21 Nov 2027'],
    ]) {
      assertRefused(
        () => planAssembly(BURGER, KITCHEN, { ...OPTIONS, serviceDate }),
        'bad-input',
        new RegExp(
          `^the service date ${words} is more than a year ahead: plan for a day up to 20 Nov 2027 \\(a year from today, 20 Nov 2026\\)$`,
        ),
      );
    }
    const lastDay = planAssembly(BURGER, KITCHEN, { ...OPTIONS, serviceDate: '2027-11-20' });
    assert.equal(lastDay.serviceDate, '2027-11-20');
  });

  it('should refuse an assembly with errors of its own', () => {
    const twoQuantities = assembly('double', [
      { formula: 'house-sauce', amount: '20 g', units: 2 },
    ]);
    assertRefused(
      () => planAssembly(twoQuantities, KITCHEN, OPTIONS),
      'invalid-assembly',
      /give one quantity for house-sauce, not amount and units/,
    );
  });
});
