import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { Decimal } from '../decimal.ts';
import { QuantityError } from '../units/quantity-error.ts';
import { baseAmount, baseMeasureOf, gramsToBase } from './base-measure.ts';

describe('a received quantity in its base measure', () => {
  it('counts weight in grams, volume in millilitres and pieces each', () => {
    assert.equal(baseMeasureOf('kg'), 'g');
    assert.equal(baseMeasureOf('l'), 'ml');
    assert.equal(baseMeasureOf('each'), 'each');
  });

  it('converts pounds and gallons exactly', () => {
    // source: NIST SP 811 (2008), Appendix B.8: 1 lb = 453.59237 g; 1 gal (US) = 3.785411784 L
    assert.ok(baseAmount('10', 'lb', 'kg').equals('4535.9237'));
    assert.ok(baseAmount('2', 'gal', 'l').equals('7570.823568'));
    assert.ok(baseAmount('12.5', 'kg', 'kg').equals(new Decimal('12500')));
    assert.ok(baseAmount('180', 'each', 'each').equals(180));
  });

  it('refuses a unit of another measure, nothing, and part of a piece', () => {
    assert.throws(() => baseAmount('4', 'l', 'kg'), QuantityError);
    assert.throws(() => baseAmount('4', 'kg', 'each'), QuantityError);
    assert.throws(() => baseAmount('0', 'kg', 'kg'), QuantityError);
    assert.throws(() => baseAmount('2.5', 'each', 'each'), QuantityError);
    assert.throws(() => baseAmount('lots', 'kg', 'kg'), QuantityError);
  });
});

describe("a formula's grams in an item's base measure", () => {
  // The demo catalogue's figures. source: USDA FoodData Central, SR Legacy, "Egg, whole, raw,
  // fresh", 1 large = 50 g; "Milk, whole, 3.25% milkfat, with added vitamin D", 1 cup = 244 g
  // (both from memory)
  const EGGS = { unit: 'each', weighs: '50 g' } as const;
  const MILK = { unit: 'l', weighs: '244 g per cup' } as const;

  it('should count whole pieces, rounding part of one up', () => {
    // by hand: 500 g ÷ 50 g = 10 eggs; 510 g ÷ 50 g = 10.2, so 11 eggs are cracked
    assert.equal(gramsToBase(new Decimal(500), EGGS, false)?.toString(), '10');
    assert.equal(gramsToBase(new Decimal(510), EGGS, false)?.toString(), '11');
  });

  it('should measure a liquid through its weight per volume, exactly', () => {
    // by hand: a US cup is 3.785411784 L ÷ 16 = 236.5882365 ml (NIST SP 811 (2008), Appendix
    // B.8), so 1 500 g of milk is 1 500 × 236.5882365 ÷ 244 = 1 454.4358801229… ml, to the
    // project's 40 digits
    assert.equal(
      gramsToBase(new Decimal(1500), MILK, false)?.toString(),
      '1454.435880122950819672131147540983606557',
    );
  });

  it('should keep grams, count water 1 ml a gram, and know nothing without a weight per unit', () => {
    assert.equal(gramsToBase(new Decimal(250), { unit: 'kg' }, false)?.toString(), '250');
    // the project's water convention, 1 000 g a litre (shared/units/volume.ts)
    assert.equal(gramsToBase(new Decimal(1400), { unit: 'l' }, true)?.toString(), '1400');
    assert.equal(gramsToBase(new Decimal(500), { unit: 'each' }, false), undefined);
    assert.equal(gramsToBase(new Decimal(1500), { unit: 'l' }, false), undefined);
  });
});
