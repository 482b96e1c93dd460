import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { Decimal } from '../../decimal.ts';
import { GRAMS_PER_OUNCE, GRAMS_PER_POUND } from '../../units/mass.ts';
import {
  curingSaltForTarget,
  ppmAtEquilibrium,
  ppmOfGreenWeight,
  ppmOfPumpedPickle,
  pumpPercentFromWeights,
} from './ingoing.ts';

const d = (value: string | number): Decimal => new Decimal(value);
const HUNDRED_POUNDS = GRAMS_PER_POUND.times(100);

describe('ingoing nitrite by the FSIS formulas', () => {
  it('should turn the curing-agent table of 9 CFR 424.21(c) into ppm', () => {
    // source: 9 CFR 424.21(c) curing-agent table; own arithmetic (100 lb = 1600 oz)
    const ppmOf = (ounces: string): string =>
      ppmOfGreenWeight(GRAMS_PER_OUNCE.times(ounces), HUNDRED_POUNDS).toString();
    assert.equal(ppmOf('0.25'), '156.25'); // nitrite, chopped meat
    assert.equal(ppmOf('1'), '625'); // nitrite, dry cure
    assert.equal(ppmOf('3.5'), '2187.5'); // nitrate, dry cure
    assert.equal(ppmOf('2.75'), '1718.75'); // nitrate, chopped meat
  });

  it('should give the curing salt per kilogram of meat for common targets with a 6.25 % mix', () => {
    // source: FSIS 7620.3 ch. 3 comminuted formula solved for the mix; own worked example (the
    // 6.25 % mix strength: common practice, no source)
    const table: [string, string][] = [
      ['120', '1.92'],
      ['156.25', '2.5'],
      ['200', '3.2'],
      ['625', '10'],
    ];
    for (const [ppm, grams] of table)
      assert.equal(curingSaltForTarget(d(ppm), d(1000), d('6.25')).toString(), grams, `${ppm} ppm`);
  });

  it('should find 156.0 ppm from 12.48 g of 6.25 % mix on 5000 g of meat', () => {
    // own worked example, reverse check by the FSIS 7620.3 ch. 3 comminuted formula
    assert.equal(ppmOfGreenWeight(d('12.48').times('0.0625'), d(5000)).toString(), '156');
  });

  it('should need 16.00 g of curing salt for 5000 g of belly at the 200 ppm dry-bacon cap', () => {
    // own worked example, FSIS 7620.3 ch. 3 comminuted formula; cap from 9 CFR 424.22(b)
    assert.equal(curingSaltForTarget(d(200), d(5000), d('6.25')).toFixed(2), '16.00');
  });

  it('should size a pumped-bacon pickle: 0.120 kg nitrite and 0.550 kg erythorbate in 100 kg at 10 % pump', () => {
    // own worked example, FSIS 7620.3 ch. 3 pumped formula; levels from 9 CFR 424.22(b)
    const pickle = d(100_000);
    const nitrite = d(120).times(pickle).div(d('0.10').times(1_000_000));
    assert.equal(nitrite.toString(), '120');
    assert.equal(nitrite.div('0.0625').toString(), '1920');
    assert.equal(ppmOfPumpedPickle(nitrite, d(10), pickle).toString(), '120');
    assert.equal(ppmOfPumpedPickle(d(550), d(10), pickle).toString(), '550');
  });

  it('should find 144 ppm when the same pickle is pumped at 12 % — over the pumped-bacon level', () => {
    // own worked example, FSIS 7620.3 ch. 3 pumped formula; 120 ppm from 9 CFR 424.22(b)
    assert.equal(ppmOfPumpedPickle(d(120), d(12), d(100_000)).toString(), '144');
  });

  it('should take pump percentages as percent, not fractions, so 10 means 10 %', () => {
    // source: FSIS 7620.3 ch. 3 enters pump as a decimal fraction (0.10); entering 10 there
    // gives 100× too much
    assert.equal(ppmOfPumpedPickle(d(120), d(10), d(100_000)).toString(), '120');
    assert.notEqual(ppmOfPumpedPickle(d(120), d('0.10'), d(100_000)).toString(), '120');
  });

  it('should divide by meat plus pickle at equilibrium (immersion Method Two)', () => {
    // source: FSIS 7620.3 ch. 3, immersion "Method Two"; own example: 1 g nitrite, 6 kg meat,
    // 4 kg pickle → 100 ppm
    assert.equal(ppmAtEquilibrium(d(1), d(6000), d(4000)).toString(), '100');
  });

  it('should figure pump percent from the weights before and after injecting', () => {
    // from memory: standard trade definition, (pumped − green) / green (the wording of FSIS
    // 7620.3 not confirmed)
    assert.equal(pumpPercentFromWeights(d(11_200), d(10_000)).toString(), '12');
  });
});
