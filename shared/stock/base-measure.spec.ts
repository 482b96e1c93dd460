import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { Decimal } from '../decimal.ts';
import { QuantityError } from '../units/quantity-error.ts';
import { baseAmount, baseMeasureOf } from './base-measure.ts';

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
