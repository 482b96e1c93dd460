import { describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { dec } from '../../decimal.ts';
import { GRAMS_PER_POUND, parseMass } from '../../units/mass.ts';
import { portionsOf } from './portion.ts';

describe('portionsOf', () => {
  it('should weigh a quarter-pound portion at exactly 113.3980925 g', () => {
    // derived from the pound of NIST SP 811 (2008), App. B.8: 453.59237 / 4
    assert.ok(GRAMS_PER_POUND.div(4).equals(dec('113.3980925')));
    assert.ok(parseMass('4 oz').equals(dec('113.3980925')));
  });

  it('should cut 176 quarter-pound portions from 20 kg with 41.93572 g left over', () => {
    // the portion: 453.59237 / 4 (NIST SP 811); own arithmetic, derived:
    // 20000 ÷ 113.3980925 = 176.37…; 176 × 113.3980925 = 19958.06428 g; 20000 − 19958.06428 =
    // 41.93572 g.
    const portions = portionsOf(dec('20000'), dec('113.3980925'));
    assert.equal(portions.count, 176);
    assert.ok(portions.remainderGrams.equals(dec('41.93572')));
    assert.ok(portions.pieceGrams.equals(dec('113.3980925')));
  });

  it('should leave nothing over when the portions divide the batch', () => {
    // own example, derived: 10 200 g ÷ 150 g = 68 exactly
    const portions = portionsOf(dec('10200'), dec('150'));
    assert.equal(portions.count, 68);
    assert.ok(portions.remainderGrams.isZero());
  });

  it('should give no portion and the whole batch over when the batch is under one portion', () => {
    const portions = portionsOf(dec('100'), dec('113.3980925'));
    assert.equal(portions.count, 0);
    assert.ok(portions.remainderGrams.equals(dec('100')));
  });

  it('should never round the count up past the batch', () => {
    // A quotient of 2.999…9994 (50 digits) rounds to 3 at 40 digits; the count must stay 2.
    const portion = dec('0.33333333333333333333333333333333333333333333333334');
    const portions = portionsOf(dec('1'), portion);
    assert.equal(portions.count, 2);
    assert.ok(portions.remainderGrams.greaterThan(0));
  });

  it('should refuse a portion that is not more than 0 g', () => {
    assert.throws(() => portionsOf(dec('1000'), dec('0')), RangeError);
    assert.throws(() => portionsOf(dec('1000'), dec('-5')), RangeError);
  });
});
