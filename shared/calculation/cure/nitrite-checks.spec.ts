import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { Decimal } from '../../decimal.ts';
import type { CureFormula, CureIngredient } from '../../formula/formula-types.ts';
import { failsCriticalLimit, type CalcResult } from '../calc-result.ts';
import { calculateCure } from './calculate-cure.ts';

const d = (value: string | number): Decimal => new Decimal(value);
const CURING_SALT = { name: 'curing salt', nitrite: 6.25, salt: 93.75 };
const SALTPETRE = { name: 'saltpetre', nitrate: 100 };

function cure(
  method: CureFormula['method'],
  product: CureFormula['product'],
  ingredients: CureIngredient[],
  brine?: CureFormula['brine'],
): CureFormula {
  return {
    formula: 1,
    id: 'test-cure',
    title: 'Test cure',
    kind: 'cure',
    method,
    product,
    ingredients,
    ...(brine ? { brine } : {}),
  };
}

function check(result: CalcResult, id: string) {
  const found = result.checks.find((c) => c.id === id);
  assert.ok(found, `check ${id}: ${result.checks.map((c) => c.id).join(', ')}`);
  return found;
}

describe('the curing-agent checks', () => {
  describe('comminuted products at the label rate', () => {
    it('should pass 0.25 % of a 6.25 % curing salt: exactly ¼ oz per 100 lb', () => {
      // source: 9 CFR 424.21(c) "¼ oz to 100 lb chopped meat" = 0.25 / 1 600 × 10⁶ = 156.25 ppm;
      // 0.25 % × 6.25 % × 10⁶ = 156.25 ppm (FSIS 7620.3 ch. 3, comminuted formula)
      const sausage = cure('dry', 'comminuted', [{ ...CURING_SALT, pct: 0.25 }]);
      const result = calculateCure(sausage, { meat: d(10_000) });
      const max = check(result, 'nitrite-max');
      assert.equal(max.value.toString(), d('0.25').div(1600).times(1_000_000).toString());
      assert.equal(max.status, 'pass');
      assert.equal(failsCriticalLimit(result), false);
    });

    it('should still refuse a hair over the ratio', () => {
      // source: 9 CFR 424.21(c); 0.2501 % × 6.25 % × 10⁶ = 156.3125 ppm > 156.25
      const sausage = cure('dry', 'comminuted', [{ ...CURING_SALT, pct: 0.2501 }]);
      const result = calculateCure(sausage, { meat: d(10_000) });
      assert.equal(check(result, 'nitrite-max').value.toString(), '156.3125');
      assert.equal(check(result, 'nitrite-max').status, 'fail');
      assert.equal(failsCriticalLimit(result), true);
    });
  });

  describe('nitrate in pickle cures', () => {
    it('should refuse a brine of 0.5 % saltpetre, far over 7 lb per 100 gal pickle', () => {
      // source: 9 CFR 424.21(c) nitrate "7 lb to 100 gal pickle" = 700 ppm at 10 % pump (FSIS
      // 7620.3 ch. 3 reading of the pickle rule). Method Two (FSIS 7620.3 ch. 3): 1000 g meat,
      // 1000 g water, salt 3 % and saltpetre 0.5 % of 2000 g = 60 g and 10 g; pickle 1070 g;
      // nitrate 10 × 10⁶ / (1000 + 1070) ppm
      const brine = cure(
        'brine',
        'whole-muscle',
        [
          { name: 'salt', pct: 3, salt: 100 },
          { ...SALTPETRE, pct: 0.5 },
        ],
        { water_pct: 100 },
      );
      const result = calculateCure(brine, { meat: d(1000) });
      const nitrate = check(result, 'nitrate-max');
      assert.equal(nitrate.value.toFixed(6), d(10_000_000).div(2070).toFixed(6));
      assert.equal(nitrate.limit.toString(), '700');
      assert.equal(nitrate.status, 'fail');
      assert.equal(nitrate.critical, true);
      assert.ok(!result.warnings.some((w) => /by hand/.test(w)), result.warnings.join(' '));
      assert.equal(failsCriticalLimit(result), true);
    });

    it('should pass a pump cure carrying 700 ppm nitrate and refuse one carrying 800 ppm', () => {
      // source: 9 CFR 424.21(c) nitrate "7 lb to 100 gal pickle" = 7/2 × 200 ppm (the handbook's
      // reading of "2 lb … at 10 percent pump") = 700 ppm; a pump ingredient's pct is its level in
      // the meat on green weight, so 0.07 % = 700 ppm and 0.08 % = 800 ppm
      const ham = (pct: number) =>
        cure(
          'pump',
          'whole-muscle',
          [
            { name: 'salt', pct: 1.5, salt: 100 },
            { ...CURING_SALT, pct: 0.32 },
            { ...SALTPETRE, pct },
          ],
          { pump_pct: 10 },
        );
      const within = check(calculateCure(ham(0.07), { meat: d(10_000) }), 'nitrate-max');
      assert.equal(within.value.toString(), '700');
      assert.equal(within.status, 'pass');
      const over = calculateCure(ham(0.08), { meat: d(10_000) });
      assert.equal(check(over, 'nitrate-max').value.toString(), '800');
      assert.equal(check(over, 'nitrate-max').status, 'fail');
      assert.equal(failsCriticalLimit(over), true);
    });

    it('should refuse nitrate in pumped bacon', () => {
      // source: 9 CFR 424.21(c) lists nitrate for "cured meat products other than bacon" only
      const bacon = cure(
        'pump',
        'bacon',
        [
          { ...CURING_SALT, pct: 0.192 },
          { ...SALTPETRE, pct: 0.01 },
          { name: 'sodium erythorbate', pct: 0.055, accelerator: 100 },
        ],
        { pump_pct: 10 },
      );
      const nitrate = check(calculateCure(bacon, { meat: d(10_000) }), 'nitrate-max');
      assert.equal(nitrate.limit.toString(), '0');
      assert.equal(nitrate.status, 'fail');
    });
  });

  describe('the ascorbate or erythorbate pumped bacon must carry', () => {
    it('should refuse pumped bacon without it, as a critical limit', () => {
      // source: 9 CFR 424.22(b): pumped bacon requires 550 ppm sodium ascorbate or erythorbate
      const bacon = cure('pump', 'bacon', [{ ...CURING_SALT, pct: 0.192 }], { pump_pct: 10 });
      const result = calculateCure(bacon, { meat: d(10_000) });
      const accelerator = check(result, 'accelerator-required');
      assert.equal(accelerator.status, 'fail');
      assert.equal(accelerator.critical, true);
      assert.equal(failsCriticalLimit(result), true);
    });
  });

  describe('whole-muscle dry cures that keep all their cure', () => {
    it('should warn, without refusing, above the 200 ppm finished-product cap', () => {
      // source: 9 CFR 424.21(c): 625 ppm (1 oz per 100 lb, dry cure) is the ceiling, but the use of
      // nitrite "shall not result in more than 200 ppm … in finished product"; 0.5 % × 6.25 % × 10⁶ = 312.5
      const loin = cure('dry', 'whole-muscle', [{ ...CURING_SALT, pct: 0.5 }]);
      const result = calculateCure(loin, { meat: d(1000) });
      assert.equal(check(result, 'nitrite-max').status, 'pass');
      const cap = check(result, 'nitrite-finished-product');
      assert.equal(cap.value.toString(), '312.5');
      assert.equal(cap.limit.toString(), '200');
      assert.equal(cap.status, 'warn');
      assert.equal(cap.critical, false);
      assert.match(cap.rule, /equilibrium/);
      assert.match(cap.source, /9 CFR 424\.21\(c\)/);
      assert.equal(failsCriticalLimit(result), false);
    });

    it('should say nothing more at 200 ppm or below', () => {
      // source: 9 CFR 424.21(c), 200 ppm in finished product; 0.32 % × 6.25 % × 10⁶ = 200 ppm
      const loin = cure('dry', 'whole-muscle', [{ ...CURING_SALT, pct: 0.32 }]);
      const result = calculateCure(loin, { meat: d(1000) });
      assert.equal(check(result, 'nitrite-max').value.toString(), '200');
      assert.ok(!result.checks.some((c) => c.id === 'nitrite-finished-product'));
    });
  });
});
