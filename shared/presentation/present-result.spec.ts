import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import fc from 'fast-check';
import { Decimal } from '../decimal.ts';
import type { CalcResult } from '../calculation/calc-result.ts';
import { calculateCure } from '../calculation/cure/calculate-cure.ts';
import { calculateDough } from '../calculation/dough/calculate-dough.ts';
import { bunDough } from '../calculation/dough/dough-fixtures.ts';
import type { CureFormula } from '../formula/formula-types.ts';
import { formatMass, formatTemperature } from './format-figure.ts';
import { presentResult } from './present-result.ts';

const BELLY: CureFormula = {
  formula: 1,
  id: 'belly',
  title: 'Belly',
  kind: 'cure',
  method: 'dry',
  product: 'bacon',
  ingredients: [
    { name: 'salt', pct: 2.25, salt: 100 },
    { name: 'curing salt', pct: 0.25, nitrite: 6.25, salt: 93.75 },
    { name: 'sugar', pct: 1.2 },
  ],
};

function result(grams: string | number): CalcResult {
  return calculateCure(BELLY, { meat: new Decimal(grams) });
}

describe('presentResult', () => {
  it('should weigh curing salt and minor lines to 0.1 g and the rest to 1 g', () => {
    // source: the product brief's rules for a batch sheet. 4260 g × 0.25 % = 10.65 → 10.7 g (half-up);
    // 20 000 g × 2.25 % = 450 g → "450 g"; 20 000 × 0.25 % = 50 g of curing salt → "50.0 g"
    const small = presentResult(result(4260), 'metric').groups[0].lines;
    assert.equal(small[1].amount, '10.7 g');
    assert.equal(small[0].amount, '95.9 g');
    const large = presentResult(result(20_000), 'metric').groups[0].lines;
    assert.equal(large[0].amount, '450 g');
    assert.equal(large[1].amount, '50.0 g');
  });

  it('should print kilograms with three decimals from 10 kg', () => {
    // source: the product brief (kilograms with 3 decimals above 10 kg)
    assert.equal(formatMass(new Decimal('12345.4'), 'metric'), '12.345 kg');
    assert.equal(formatMass(new Decimal('9999.4'), 'metric'), '9999 g');
  });

  it('should print pounds and ounces to 0.1 oz with grams beside the curing salt', () => {
    // source: NIST SP 811 factors; 10 lb = 4535.9237 g; curing salt 0.25 % = 11.3398 g = 0.4 oz (11.3 g beside)
    const lines = presentResult(result('4535.9237'), 'us').groups[0].lines;
    assert.equal(lines[1].amount, '0.4 oz');
    assert.equal(lines[1].gramsShown, '11.3 g');
    assert.equal(formatMass(new Decimal('1133.980925'), 'us'), '2 lb 8.0 oz'); // 40 oz
    assert.equal(formatMass(new Decimal('453.5'), 'us'), '1 lb 0.0 oz'); // 15.997 oz rounds up to a whole pound
  });

  it('should make totals add up to the printed lines', () => {
    // Property: whatever the batch, the total row is the sum of the printed (rounded) lines.
    fc.assert(
      fc.property(
        fc.integer({ min: 100, max: 2_000_000 }),
        fc.constantFrom('metric' as const, 'us' as const),
        (grams, units) => {
          const group = presentResult(result(grams), units).groups[0];
          const unit = units === 'us' ? 'oz' : 'g';
          const toBase = (text: string): Decimal => {
            if (text.endsWith(' kg')) return new Decimal(text.slice(0, -3)).times(1000);
            const pounds = /^(\d+) lb (.*) oz$/.exec(text);
            if (pounds) return new Decimal(pounds[1]).times(16).plus(pounds[2]);
            return new Decimal(text.replace(` ${unit}`, ''));
          };
          const printed = group.lines.reduce(
            (sum, line) => sum.plus(toBase(line.amount)),
            new Decimal(0),
          );
          assert.ok(group.total);
          assert.equal(toBase(group.total.amount).toString(), printed.toString());
        },
      ),
    );
  });

  it('should round temperatures to 0.5 °C or 1 °F', () => {
    // source: the product brief; 30.556 °C (87 °F, the water of the San Francisco Baking
    // Institute's Artisan I example, in °C) prints 30.5 °C and 87 °F
    assert.equal(formatTemperature(new Decimal('30.556'), 'metric'), '30.5 °C');
    assert.equal(formatTemperature(new Decimal('30.556'), 'us'), '87 °F');
    assert.equal(formatTemperature(new Decimal('30.76'), 'metric'), '31.0 °C');
  });

  it('should show the unrounded value when rounding hides that a limit was exceeded', () => {
    // Own example: 0.320001 % of a 6.25 % mix = 200.000625 ppm, which prints as 200.0 but is over 200.
    const over = calculateCure(
      {
        ...BELLY,
        ingredients: [{ name: 'curing salt', pct: 0.320001, nitrite: 6.25, salt: 93.75 }],
      },
      { meat: new Decimal(1000) },
    );
    const check = presentResult(over, 'metric').checks[0];
    assert.equal(check.verdict, 'FAIL');
    assert.match(check.sentence, /200\.0 ppm \(200\.0006 unrounded\) is over the 200 ppm limit/);
    assert.equal(presentResult(over, 'metric').critical, true);
  });

  it('should print the comminuted ceiling as the ratio it is, and say 156.25 meets it', () => {
    // source: 9 CFR 424.21(c) "¼ oz to 100 lb chopped meat" = 0.25 / 1600 × 10⁶ = 156.25 ppm;
    // 0.25 % of a 6.25 % mix is the same 156.25 ppm, which prints as 156.3 to 0.1 ppm
    const sausage = calculateCure(
      {
        ...BELLY,
        product: 'comminuted',
        ingredients: [{ name: 'curing salt', pct: 0.25, nitrite: 6.25, salt: 93.75 }],
      },
      { meat: new Decimal(10_000) },
    );
    const presented = presentResult(sausage, 'metric');
    const check = presented.checks[0];
    assert.equal(check.verdict, 'PASS');
    assert.equal(check.limit, '156.25 ppm');
    assert.match(
      check.sentence,
      /^156\.3 ppm \(156\.25 unrounded\) is within the 156\.25 ppm limit \(¼ oz per 100 lb chopped meat\) for comminuted/,
    );
    assert.equal(presented.critical, false);
  });

  it('should refuse pumped bacon without its erythorbate and say the required level is not met', () => {
    // source: 9 CFR 424.22(b): pumped bacon 120 ppm nitrite with 550 ppm ascorbate or erythorbate
    const bacon = calculateCure(
      {
        ...BELLY,
        method: 'pump',
        brine: { pump_pct: 10 },
        ingredients: [
          { name: 'salt', pct: 1.5, salt: 100 },
          { name: 'curing salt', pct: 0.192, nitrite: 6.25, salt: 93.75 },
        ],
      },
      { meat: new Decimal(5000) },
    );
    const presented = presentResult(bacon, 'metric');
    const accelerator = presented.checks.find((c) => c.id === 'accelerator-required');
    assert.equal(accelerator?.verdict, 'FAIL');
    assert.match(
      accelerator?.sentence ?? '',
      /^critical limit not met: 0\.0 ppm is below the 550 ppm required for pumped bacon/,
    );
    assert.equal(presented.critical, true);
    assert.deepEqual(presented.groups, []);
  });

  it("should call a dough's remainder its loss allowance, not dough left over", () => {
    // Own example (the bun): 48 buns × 80 g with 2 % loss divided out = 3918.367 g;
    // 3918.367 − 3840 = 78.367 g, which is the loss allowance itself (2 % of 3918.367 g), not
    // spare dough.
    // source: "Bread Formula Construction", baking-science education series part 3 (2011),
    // which divides the loss out
    const dough = calculateDough(bunDough(), {
      pieces: 48,
      piece: new Decimal(80),
      loss: new Decimal(2),
    });
    const portions = presentResult(dough, 'metric').portions;
    assert.ok(portions);
    assert.match(
      portions.sentence,
      /^48 × 80\.0 g; the other 78\.4 g is the loss allowance \(2 %\)/,
    );
    assert.match(portions.sentence, /not spare dough/);
    assert.doesNotMatch(portions.sentence, /left over/);
  });
});
