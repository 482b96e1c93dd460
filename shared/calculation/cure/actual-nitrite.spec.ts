import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { CureFormula } from '../../formula/formula-types.ts';
import { BatchError } from '../batch-error.ts';
import type { LimitCheck } from '../calc-result.ts';
import { actualCureChecks } from './actual-nitrite.ts';
import { calculateCure } from './calculate-cure.ts';
import { CURING_SALT, cure, d } from './cure-spec-helpers.ts';

// The FSIS formulas these tests work by hand. source: USDA FSIS Directive 7620.3, Processing
// Inspectors' Calculations Handbook (1995), ch. 3 — dry cure: nitrite × 10⁶ ÷ green weight;
// pumped: nitrite in pickle × pump fraction × 10⁶ ÷ pickle weight; immersion method two:
// nitrite × 10⁶ ÷ (green weight + pickle weight). The 6.25 % curing salt: common practice,
// no source.

/** The calculation's grams per line, by name, as the batch record keeps them. */
function calculatedLines(formula: CureFormula, batch: Parameters<typeof calculateCure>[1]) {
  const result = calculateCure(formula, batch);
  return new Map(
    result.groups.flatMap((group) => group.lines).map((line) => [line.name, line.grams]),
  );
}

function nitriteCheck(checks: LimitCheck[]): LimitCheck {
  const found = checks.find((check) => check.id === 'nitrite-max');
  assert.ok(found);
  return found;
}

describe('the cure checks on the actual weights', () => {
  describe('a dry-cured bacon', () => {
    const formula = cure({});
    const calculated = calculatedLines(formula, { meat: d(5000) });

    it('gives the calculation’s 120 ppm when everything is weighed as calculated', () => {
      // source: 9.60 g × 6.25 % × 10⁶ ÷ 5000 g = 120 ppm (dry-cure formula)
      const checks = actualCureChecks(formula, calculated, {
        greenGrams: d(5000),
        lines: new Map(),
      });
      assert.equal(nitriteCheck(checks).value.toString(), '120');
      assert.equal(nitriteCheck(checks).status, 'pass');
    });

    it('fails the nitrite check when 16.5 g of curing salt went on 5000 g (206.25 ppm over 200)', () => {
      // source: 16.5 × 0.0625 × 10⁶ ÷ 5000 = 206.25 ppm; dry-cured bacon 200 ppm, 9 CFR 424.22(b)
      const checks = actualCureChecks(formula, calculated, {
        greenGrams: d(5000),
        lines: new Map([['curing salt', d('16.5')]]),
      });
      const nitrite = nitriteCheck(checks);
      assert.equal(nitrite.value.toString(), '206.25');
      assert.equal(nitrite.limit.toString(), '200');
      assert.equal(nitrite.status, 'fail');
      assert.equal(nitrite.critical, true);
    });

    it('divides by the actual green weight: 9.60 g on 4800 g is 125 ppm', () => {
      // source: 9.6 × 0.0625 × 10⁶ ÷ 4800 = 125 ppm
      const checks = actualCureChecks(formula, calculated, {
        greenGrams: d(4800),
        lines: new Map(),
      });
      assert.equal(nitriteCheck(checks).value.toString(), '125');
    });

    it('keeps the calculation’s check ids, limits and critical flags', () => {
      const result = calculateCure(formula, { meat: d(5000) });
      const actual = actualCureChecks(formula, calculated, {
        greenGrams: d(5000),
        lines: new Map(),
      });
      assert.deepEqual(
        actual.map((check) => [check.id, check.limit.toString(), check.critical]),
        result.checks.map((check) => [check.id, check.limit.toString(), check.critical]),
      );
    });
  });

  describe('a brine (immersion) cure', () => {
    // whole-muscle, water at 100 % of the meat, curing salt 0.2 % of meat + water
    const formula = cure({
      method: 'brine',
      product: 'whole-muscle',
      brine: { water_pct: 100 },
      ingredients: [
        { name: 'salt', pct: 3, salt: 100 },
        { ...CURING_SALT, pct: 0.2 },
      ],
    });
    const calculated = calculatedLines(formula, { meat: d(10_000) });

    it('works method two on the brine as made up: 30 g of curing salt in 10 kg water and 640 g of salt', () => {
      // the calculation's brine is 10 000 g water, 600 g salt and 40 g curing salt (3 % and 0.2 %
      // of meat + water); weighed instead: 640 g salt and 30 g curing salt, so the pickle is
      // 10 670 g. source: 30 × 0.0625 × 10⁶ ÷ (10 000 + 10 670) = 90.71… ppm (method two)
      const checks = actualCureChecks(formula, calculated, {
        greenGrams: d(10_000),
        lines: new Map([
          ['water', d(10_000)],
          ['salt', d(640)],
          ['curing salt', d(30)],
        ]),
      });
      const expected = d(30).times('0.0625').times(1_000_000).div(d(10_000).plus(10_670));
      assert.equal(nitriteCheck(checks).value.toString(), expected.toString());
      assert.equal(nitriteCheck(checks).value.toFixed(2), '90.71');
    });
  });

  describe('a pumped bacon', () => {
    // 10 % pump, curing salt at 0.192 % of green weight: 120 ppm when the meat takes 10 %
    const formula = cure({
      method: 'pump',
      brine: { pump_pct: 10, cover_pct: 0, extra_pct: 0 },
      ingredients: [
        { name: 'salt', pct: 1.5, salt: 100 },
        { ...CURING_SALT, pct: 0.192 },
        { name: 'sodium erythorbate', pct: 0.055, accelerator: 100 },
      ],
    });
    const calculated = calculatedLines(formula, { meat: d(5000) });

    it('gives 120 ppm at the formula’s pump when the pumped weight is not given', () => {
      // source: brine made 500 g carrying 9.6 g of curing salt: 9.6 × 0.0625 × 0.10 × 10⁶ ÷ 500
      // = 120 ppm (pumped-product formula)
      const checks = actualCureChecks(formula, calculated, {
        greenGrams: d(5000),
        lines: new Map(),
      });
      assert.equal(nitriteCheck(checks).value.toString(), '120');
      assert.equal(nitriteCheck(checks).status, 'pass');
    });

    it('fails at 144 ppm when the meat took 12 % (5600 g pumped from 5000 g)', () => {
      // source: pick-up (5600 − 5000) ÷ 5000 = 12 %; 9.6 × 0.0625 × 0.12 × 10⁶ ÷ 500 = 144 ppm;
      // pumped bacon 120 ppm, 9 CFR 424.22(b)
      const checks = actualCureChecks(formula, calculated, {
        greenGrams: d(5000),
        lines: new Map(),
        pumpedGrams: d(5600),
      });
      assert.equal(nitriteCheck(checks).value.toString(), '144');
      assert.equal(nitriteCheck(checks).status, 'fail');
    });

    it('counts extra curing salt put in the brine', () => {
      // source: 12 g in a 502.4 g brine at 10 %: 12 × 0.0625 × 0.1 × 10⁶ ÷ 502.4 = 149.28… ppm
      const lines = new Map([['curing salt', d(12)]]);
      const pickle = [...calculated.entries()]
        .filter(([name]) => name !== 'curing salt')
        .reduce((total, [, grams]) => total.plus(grams), d(12));
      assert.equal(pickle.toString(), '502.4');
      const checks = actualCureChecks(formula, calculated, { greenGrams: d(5000), lines });
      assert.equal(nitriteCheck(checks).value.toFixed(2), '149.28');
      assert.equal(nitriteCheck(checks).status, 'fail');
    });

    it('refuses a pumped weight that is not above the green weight', () => {
      assert.throws(
        () =>
          actualCureChecks(formula, calculated, {
            greenGrams: d(5000),
            lines: new Map(),
            pumpedGrams: d(5000),
          }),
        BatchError,
      );
    });
  });
});
