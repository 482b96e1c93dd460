import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import fc from 'fast-check';
import type { Decimal } from '../../decimal.ts';
import { BatchError } from '../batch-error.ts';
import type { CalcResult } from '../calc-result.ts';
import { calculateCure } from './calculate-cure.ts';
import { CURING_SALT, cure, d } from './cure-spec-helpers.ts';

function line(result: CalcResult, name: string): Decimal {
  const found = result.groups.flatMap((g) => g.lines).find((l) => l.name === name);
  assert.ok(found, `line ${name}`);
  return found.grams;
}

function check(result: CalcResult, id: string) {
  const found = result.checks.find((c) => c.id === id);
  assert.ok(found, `check ${id}`);
  return found;
}

describe('calculateCure', () => {
  describe('dry equilibrium cure', () => {
    it('should reproduce the 5000 g belly at 2.5 % salt and 120 ppm', () => {
      // own worked example: 120 ppm by the FSIS 7620.3 ch. 3 comminuted formula needs 1.92 g of a
      // 6.25 % mix per kg (the 6.25 % mix: common practice, no source), so curing salt
      // 5000 × 1.92 / 1000 = 9.60 g carrying 9.00 g NaCl; plain salt 125 − 9 = 116.00 g;
      // the 200 ppm cap for dry-cured bacon is 9 CFR 424.22(b)
      const result = calculateCure(cure({}), { meat: d(5000) });
      assert.equal(line(result, 'curing salt').toFixed(2), '9.60');
      assert.equal(line(result, 'salt').toFixed(2), '116.00');
      assert.equal(check(result, 'nitrite-max').value.toString(), '120');
      assert.equal(check(result, 'nitrite-max').limit.toString(), '200');
      assert.equal(check(result, 'nitrite-max').status, 'pass');
      const salt = result.figures.find((f) => f.label.startsWith('Salt'));
      assert.equal((salt?.value as Decimal).toString(), '2.5');
    });

    it('should refuse a dry-cured bacon over 200 ppm as a critical limit', () => {
      // source: 9 CFR 424.22(b) dry-cured bacon 200 ppm; 0.4 % of a 6.25 % mix = 250 ppm (FSIS
      // 7620.3 ch. 3 comminuted formula)
      const result = calculateCure(cure({ ingredients: [{ ...CURING_SALT, pct: 0.4 }] }), {
        meat: d(1000),
      });
      const max = check(result, 'nitrite-max');
      assert.equal(max.value.toString(), '250');
      assert.equal(max.status, 'fail');
      assert.equal(max.critical, true);
    });

    it('should hold comminuted products to ¼ oz per 100 lb exactly, passing the 0.25 % label rate', () => {
      // source: 9 CFR 424.21(c) "¼ oz to 100 lb chopped meat" = 0.25 / 1600 × 10⁶ = 156.25 ppm (the
      // handbook, FSIS 7620.3 ch. 3, prints the rounded 156)
      const sausage = cure({ product: 'comminuted', ingredients: [{ ...CURING_SALT, pct: 0.25 }] });
      const result = calculateCure(sausage, { meat: d(10_000) });
      assert.equal(check(result, 'nitrite-max').value.toString(), '156.25');
      assert.equal(check(result, 'nitrite-max').limit.toString(), '156.25');
      assert.equal(check(result, 'nitrite-max').status, 'pass');
    });

    it('should allow 625 ppm for dry-cured products other than bacon', () => {
      // source: 9 CFR 424.21(c) "1 oz per 100 lb (dry cure)"; FSIS 7620.3 ch. 3, "Nitrite used in
      // cured, dry products"; 1.0 % of a 6.25 % mix = 625 ppm
      const ham = cure({ product: 'whole-muscle', ingredients: [{ ...CURING_SALT, pct: 1.0 }] });
      const max = check(calculateCure(ham, { meat: d(1000) }), 'nitrite-max');
      assert.equal(max.value.toString(), '625');
      assert.equal(max.limit.toString(), '625');
      assert.equal(max.status, 'pass');
    });

    it('should warn below the usual 120 ppm minimum without refusing', () => {
      // source: FSIS 7620.3 ch. 3 introduction, 120 ppm for Keep Refrigerated cured products (FSIS
      // policy, read in secondary pages quoting it)
      const result = calculateCure(cure({ ingredients: [{ ...CURING_SALT, pct: 0.16 }] }), {
        meat: d(1000),
      });
      assert.equal(check(result, 'nitrite-max').status, 'pass');
      assert.equal(check(result, 'nitrite-min').status, 'warn');
      assert.equal(check(result, 'nitrite-min').value.toString(), '100');
    });

    it('should refuse any nitrate in bacon', () => {
      // source: 9 CFR 424.21(c) lists nitrate only for products other than bacon
      const withNitrate = cure({
        ingredients: [
          { name: 'curing salt no. 2', pct: 0.25, nitrite: 6.25, nitrate: 4, salt: 89.75 },
        ],
      });
      const nitrate = check(calculateCure(withNitrate, { meat: d(1000) }), 'nitrate-max');
      assert.equal(nitrate.value.toString(), '100');
      assert.equal(nitrate.limit.toString(), '0');
      assert.equal(nitrate.status, 'fail');
      assert.equal(nitrate.critical, true);
    });

    it('should give the same ppm for any batch size and scale every line with the meat', () => {
      // Property (scaling invariance): percentages of green weight make ppm independent of batch size.
      const formula = cure({});
      const reference = calculateCure(formula, { meat: d(1000) });
      fc.assert(
        fc.property(fc.integer({ min: 1, max: 1_000_000 }), (grams) => {
          const result = calculateCure(formula, { meat: d(grams) });
          assert.ok(
            check(result, 'nitrite-max').value.equals(check(reference, 'nitrite-max').value),
          );
          const factor = d(grams).div(1000);
          result.groups[0].lines.forEach((l, i) =>
            assert.ok(l.grams.equals(reference.groups[0].lines[i].grams.times(factor))),
          );
        }),
      );
    });
  });

  describe('equilibrium brine', () => {
    const brine = cure({
      method: 'brine',
      product: 'whole-muscle',
      brine: { water_pct: 60 },
      ingredients: [
        { name: 'salt', pct: 2.5, salt: 100 },
        { ...CURING_SALT, pct: 0.25 },
      ],
    });

    it('should weigh ingredients on meat plus water and divide nitrite by meat plus pickle', () => {
      // source: FSIS 7620.3 ch. 3 immersion "Method Two". Own example: 10 kg meat, 6 kg water;
      // curing salt 16 kg × 0.25 % = 40 g → 2.5 g nitrite; salt 400 g; pickle 6440 g;
      // ppm = 2.5 × 1e6 / 16 440 = 152.068…
      const result = calculateCure(brine, { meat: d(10_000) });
      assert.equal(line(result, 'curing salt').toString(), '40');
      assert.equal(line(result, 'water').toString(), '6000');
      assert.equal(check(result, 'nitrite-max').value.toFixed(3), '152.068');
      assert.equal(check(result, 'nitrite-max').limit.toString(), '200');
    });

    it('should print brine strength and degrees salinometer', () => {
      // source: °SAL = % salt ÷ 26.395 × 100, "The Salometer and How to Use It"; own example:
      // NaCl 400 + 37.5 = 437.5 g in 6000 g water → 437.5 / 6437.5 = 6.796 %,
      // ÷ 26.395 × 100 = 25.75 °SAL
      const figures = calculateCure(brine, { meat: d(10_000) }).figures;
      const strength = figures.find((f) => f.label === 'Brine strength')?.value as Decimal;
      const sal = figures.find((f) => f.label === 'Salinometer')?.value as Decimal;
      assert.equal(strength.toFixed(3), '6.796');
      assert.equal(sal.toFixed(2), '25.75');
    });

    it('should take water given by the batch instead of the formula', () => {
      const result = calculateCure(brine, { meat: d(10_000), water: d(8000) });
      assert.equal(line(result, 'water').toString(), '8000');
      assert.equal(line(result, 'curing salt').toString(), '45');
    });

    // Saturated brine: 26.395 % salt, 100 °SAL at 60 °F. source: "The Salometer and How to Use It"
    // Own examples on 10 kg of meat, salt 2.5 % + 0.25 % × 93.75 % = 2.734375 % of meat +
    // water W: salt = (10 000 + W) × 2.734375 %, strength = salt ÷ (salt + W).
    const refusesWater = (water: string, strength: string) =>
      assert.throws(
        () => calculateCure(brine, { meat: d(10_000), water: d(water) }),
        (e: unknown) =>
          e instanceof BatchError &&
          e.option === 'water' &&
          e.message.startsWith(
            `with ${water} g of water, the brine would be ${strength} % salt: more than water can dissolve (26.395 %`,
          ),
        water,
      );

    it('should refuse water too little to dissolve the salt', () => {
      // W = 1 g (0.001 kg): 273.46 g salt in 1 g water → 99.636 %
      refusesWater('1', '99.6');
      // W = 825 g: 295.996 g ÷ 1120.996 g = 26.405 %, just over saturation
      refusesWater('825', '26.4');
    });

    it('should warn near saturation and not below 95 °SAL', () => {
      // W = 826 g: 26.383 % = 99.95 °SAL; W = 850 g: 25.873 % = 98.0 °SAL; W = 900 g: 24.878 % =
      // 94.25 °SAL, under the 95 °SAL warning (common practice, no source)
      for (const water of [826, 850]) {
        const warnings = calculateCure(brine, { meat: d(10_000), water: d(water) }).warnings;
        assert.ok(
          warnings.some((w) => /close to saturated/.test(w)),
          `${water} g: ${warnings.join(' ')}`,
        );
      }
      const plain = calculateCure(brine, { meat: d(10_000), water: d(900) }).warnings;
      assert.ok(!plain.some((w) => /saturated/.test(w)), plain.join(' '));
    });

    it('should refuse a formula whose own water_pct cannot dissolve its salt, naming water_pct', () => {
      // water 5 % of the meat: 10 500 × 2.734375 % = 287.11 g salt in 500 g water → 36.5 %
      const thin = cure({ ...brine, brine: { water_pct: 5 } });
      assert.throws(
        () => calculateCure(thin, { meat: d(10_000) }),
        (e: unknown) =>
          e instanceof BatchError &&
          e.option === undefined &&
          /^with water at 5 % of the meat \(the formula's water_pct\), the brine would be 36\.5 % salt: more than water can dissolve/.test(
            e.message,
          ) &&
          /raise water_pct, or give more water with --water/.test(e.message),
      );
    });
  });

  describe('injection (pump)', () => {
    const pumpedBacon = cure({
      method: 'pump',
      brine: { pump_pct: 10 },
      ingredients: [
        { name: 'salt', pct: 1.5, salt: 100 },
        { ...CURING_SALT, pct: 0.192 },
        { name: 'sodium erythorbate', pct: 0.055, accelerator: 100 },
      ],
    });

    it('should make 100 kg of pickle holding 1.920 kg curing salt and 0.550 kg erythorbate for 1000 kg of belly', () => {
      // own worked example by the FSIS 7620.3 ch. 3 pumped formula: 120 × 100 / (0.10 × 1e6) =
      // 0.120 kg nitrite = 1.920 kg of a 6.25 % mix; 120 ppm + 550 ppm from 9 CFR 424.22(b)
      const result = calculateCure(pumpedBacon, { meat: d(1_000_000) });
      assert.equal(line(result, 'curing salt').toString(), '1920');
      assert.equal(line(result, 'sodium erythorbate').toString(), '550');
      assert.equal(check(result, 'nitrite-max').value.toString(), '120');
      assert.equal(check(result, 'nitrite-max').status, 'pass');
      assert.equal(check(result, 'accelerator-required').status, 'pass');
    });

    it('should refuse the same pickle when the meat took 12 % instead of 10 %', () => {
      // own worked example, FSIS 7620.3 ch. 3 pumped formula: 0.120 × 0.12 × 1e6 / 100 = 144 ppm,
      // over 120 ppm (9 CFR 424.22(b))
      const result = calculateCure(pumpedBacon, { meat: d(1_000_000), pumpedWeight: d(1_120_000) });
      const max = check(result, 'nitrite-max');
      assert.equal(max.value.toString(), '144');
      assert.equal(max.status, 'fail');
      assert.ok(result.warnings.some((w) => w.includes('12.0 % pump')));
    });

    it('should refuse pumped bacon that lacks erythorbate, as a critical limit', () => {
      // source: 9 CFR 424.22(b) requires 550 ppm sodium ascorbate or erythorbate in pumped bacon
      const without = cure({ ...pumpedBacon, ingredients: pumpedBacon.ingredients.slice(0, 2) });
      const accelerator = check(calculateCure(without, { meat: d(1000) }), 'accelerator-required');
      assert.equal(accelerator.status, 'fail');
      assert.equal(accelerator.critical, true);
    });

    it('should make cover brine of the same make-up and count it with the meat (method two)', () => {
      // Own example: 10 kg at 10 % pump with 30 % cover and 10 % extra → (1 + 3) × 1.1 = 4.4 kg of brine.
      // The brine holds 0.192 % × 6.25 % ÷ 10 % = 1200 ppm nitrite; 0.4 of green weight in pickle
      // → 1200 × 0.4 ÷ 1.4 = 342.857 ppm, over the 120 ppm for pumped bacon.
      // source: FSIS 7620.3 ch. 3 immersion method two; 9 CFR 424.22(b)
      const covered = cure({
        ...pumpedBacon,
        brine: { pump_pct: 10, cover_pct: 30, extra_pct: 10 },
      });
      const result = calculateCure(covered, { meat: d(10_000) });
      const total = result.groups[0].lines.reduce((sum, l) => sum.plus(l.grams), d(0));
      assert.equal(total.toString(), '4400');
      assert.equal(check(result, 'nitrite-max').value.toFixed(3), '342.857');
      assert.equal(check(result, 'nitrite-max').status, 'fail');
    });

    it('should refuse a pump % too low to dissolve the salt', () => {
      // source: saturated brine holds 26.395 % salt ("The Salometer and How to Use It"); 3 % salt
      // in the meat at 10 % pump would need a brine of 30 % salt
      const salty = cure({
        method: 'pump',
        product: 'whole-muscle',
        brine: { pump_pct: 10 },
        ingredients: [{ name: 'salt', pct: 3, salt: 100 }],
      });
      assert.throws(
        () => calculateCure(salty, { meat: d(1000) }),
        (e: unknown) =>
          e instanceof BatchError &&
          e.option === 'pump' &&
          e.message.startsWith(
            'at 10 % pump, the brine would be 30.0 % salt: more than water can dissolve (26.395 %',
          ),
      );
    });
  });

  describe('hold and ready date', () => {
    it("should follow the formula's own rule: 2 days per cm for a 4 cm belly is 8 days", () => {
      // common practice, no source: the kitchen's own rule (the brief's example)
      const result = calculateCure(
        cure({ hold: { days_per_cm: 2, min_days: 5, flip_every_days: 2 } }),
        {
          meat: d(4260),
          thickness: d(40),
          start: '2026-12-02',
        },
      );
      assert.equal(result.schedule?.days, 8);
      assert.equal(result.schedule?.ready, '2026-12-10');
      assert.equal(result.schedule?.flipEveryDays, 2);
    });

    it('should fall back to about 7 days per inch for a dry cure and say it is a rule of thumb', () => {
      // common practice, no source: 40 mm = 1.5748 in × 7 = 11.02 → 12 days
      const result = calculateCure(cure({}), {
        meat: d(4260),
        thickness: d(40),
        start: '2026-12-01',
      });
      assert.equal(result.schedule?.days, 12);
      assert.match(result.schedule?.rule ?? '', /rule of thumb/);
    });

    it('should fall back to 4 days per pound for a sweet pickle: a 6 lb shoulder 24 days, a 15 lb ham 60', () => {
      // source: USDA, Pork: Slaughtering, Cutting, Preserving, and Cooking on the Farm, Farmers'
      // Bulletin (1978 revision), "Sweet Pickle Cure", 3½–4 days per pound.
      // Own example of a strong pickle: water 37.5 % of the meat, salt 5.82 % of meat + water →
      // 1.375 × (5.82 + 0.18) = 8.25 % of green weight in 37.5 % water = 18.03 % salt, 68 °SAL.
      const brine = cure({
        method: 'brine',
        product: 'whole-muscle',
        brine: { water_pct: 37.5 },
        ingredients: [
          { name: 'salt', pct: 5.82, salt: 100 },
          { ...CURING_SALT, pct: 0.192 },
        ],
      });
      const batch = (pounds: string, water?: string) =>
        calculateCure(brine, {
          meat: d(10_000),
          largestPiece: d(pounds).times('453.59237'),
          start: '2026-01-01',
          ...(water ? { water: d(water) } : {}),
        });
      assert.equal(batch('6').schedule?.days, 24);
      assert.equal(batch('15').schedule?.days, 60);
      // The same make-up with 15 kg of water for 10 kg of meat: 2.5 × 6 % = 15 % of green weight
      // in 150 % water = 9.09 % salt, 34 °SAL, an equilibrium brine: no days per pound for it
      // (sweet-pickle threshold: common practice, no source).
      const weak = batch('6', '15000');
      assert.equal(weak.schedule, undefined);
      assert.ok(weak.warnings.some((w) => /weaker than a sweet pickle/.test(w)));
    });

    it('should say which size is missing instead of guessing a ready date', () => {
      const result = calculateCure(cure({ hold: { days_per_cm: 2 } }), {
        meat: d(1000),
        start: '2026-12-02',
      });
      assert.equal(result.schedule, undefined);
      assert.ok(result.warnings.some((w) => w.includes('--thickness')));
    });
  });

  describe('yields', () => {
    it('should work back from 6 kg of sliced bacon to the green weight', () => {
      // Own example, derived from yield = weight after ÷ weight before:
      // 6000 ÷ (0.90 × 0.94) = 7092.198… g green
      const result = calculateCure(cure({ yields: { smoke: 90, slice: 94 } }), { want: d(6000) });
      const green = result.inputs.find((f) => f.label === 'Green weight')?.value as Decimal;
      assert.equal(green.toFixed(3), '7092.199');
      const last = result.yields?.at(-1);
      assert.equal(last?.grams.toFixed(6), '6000.000000');
    });

    it('should ask for the meat weight when none is given', () => {
      assert.throws(
        () => calculateCure(cure({}), {}),
        (e: unknown) => e instanceof BatchError && e.option === 'meat',
      );
    });
  });
});
