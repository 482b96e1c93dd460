import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import fc from 'fast-check';
import { Decimal } from '../decimal.ts';
import {
  GRAMS_PER_OUNCE,
  GRAMS_PER_POUND,
  gramsToOunces,
  gramsToPounds,
  parseMass,
} from './mass.ts';
import { QuantityError } from './quantity-error.ts';

describe('parseMass', () => {
  it('should define the pound as exactly 453.59237 g', () => {
    // source: NIST SP 811 (2008), Appendix B.8 (the avoirdupois pound, exact)
    assert.equal(GRAMS_PER_POUND.toString(), '453.59237');
    assert.equal(parseMass('1 lb').toString(), '453.59237');
  });

  it('should define the ounce as exactly 28.349523125 g', () => {
    // source: NIST SP 811 (2008), Appendix B.8 (1 oz = 1 lb / 16, exact)
    assert.equal(GRAMS_PER_OUNCE.toString(), '28.349523125');
  });

  it('should read 2 lb 8 oz as 1133.980925 g', () => {
    // own worked example: 40 oz × 28.349523125 g (ounce from NIST SP 811 (2008), App. B.8)
    assert.equal(parseMass('2 lb 8 oz').toString(), '1133.980925');
  });

  it('should turn 500 g into 17.636981 oz', () => {
    // own worked example: 500 ÷ 28.349523125 (ounce from NIST SP 811 (2008), App. B.8)
    assert.equal(gramsToOunces(new Decimal(500)).toDecimalPlaces(6).toString(), '17.636981');
  });

  it('should turn 1 kg into 2.20462262185 lb', () => {
    // derived: 1 / 0.45359237 (pound from NIST SP 811 (2008), App. B.8)
    assert.equal(gramsToPounds(new Decimal(1000)).toDecimalPlaces(11).toString(), '2.20462262185');
  });

  it('should read a quarter pound as 113.3980925 g', () => {
    // derived: 453.59237 / 4 (pound from NIST SP 811 (2008), App. B.8)
    assert.equal(parseMass('0.25lb').toString(), '113.3980925');
    assert.equal(parseMass('4 oz').toString(), '113.3980925');
  });

  it('should read metric masses in several spellings', () => {
    // source: SI prefixes, NIST SP 811 (2008)
    assert.equal(parseMass('4.26kg').toString(), '4260');
    assert.equal(parseMass('4.26 KG').toString(), '4260');
    assert.equal(parseMass('1 kg 250 g').toString(), '1250');
    assert.equal(parseMass('250mg').toString(), '0.25');
  });

  it('should say what was expected when the unit is wrong, missing or the number uses a comma', () => {
    for (const bad of ['4.26 kgs', '4.26', '4,26 kg', '', 'kg', '-1 kg', '4 lb oz']) {
      assert.throws(
        () => parseMass(bad),
        (error: unknown) => {
          assert.ok(error instanceof QuantityError, bad);
          assert.match(error.message, /expected a mass such as/);
          return true;
        },
      );
    }
  });

  it('should round-trip any gram amount through pounds and ounces exactly', () => {
    // Property: the unit factors are exact, so conversion and back loses nothing at 40 digits.
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 10_000_000 }),
        fc.integer({ min: 0, max: 3 }),
        (units, places) => {
          const grams = new Decimal(units).div(10 ** places);
          const viaPounds = gramsToPounds(grams).times(GRAMS_PER_POUND);
          const viaOunces = gramsToOunces(grams).times(GRAMS_PER_OUNCE);
          assert.ok(viaPounds.minus(grams).abs().lessThan('1e-30'));
          assert.ok(viaOunces.minus(grams).abs().lessThan('1e-30'));
          assert.equal(parseMass(`${grams.toString()} g`).toString(), grams.toString());
        },
      ),
    );
  });
});
