import { describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { dec } from '../../decimal.ts';
import { blendFatPercent, isReachable, partnerForFixed, pearsonSquare } from './pearson-square.ts';

describe('pearsonSquare', () => {
  it('should split 100 kg at 20 % fat into 75 kg of 10 % trim and 25 kg of 50 % trim', () => {
    // own worked example of the Pearson square as in meat-evaluation training material (issuer
    // not identified): parts lean = 50 − 20 = 30, parts fat trim = 20 − 10 = 10;
    // lean = 100 × 30/40 = 75.000 kg, 50/50 = 25.000 kg.
    const { first, second } = pearsonSquare(dec('10'), dec('50'), dec('20'), dec('100000'));
    assert.ok(first.equals(dec('75000')));
    assert.ok(second.equals(dec('25000')));
  });

  it('should give a blend whose fat, computed back, is 20 kg in 100 kg', () => {
    // own worked example, checked back: 7.5 + 12.5 = 20.0 kg fat = 20 %
    const { first, second } = pearsonSquare(dec('10'), dec('50'), dec('20'), dec('100000'));
    assert.ok(first.times('0.10').plus(second.times('0.50')).equals(dec('20000')));
    const fat = blendFatPercent([
      { grams: first, fat: dec('10') },
      { grams: second, fat: dec('50') },
    ]);
    assert.ok(fat.equals(dec('20')));
  });

  it('should not depend on which component is the leaner one', () => {
    // the same own example, components swapped
    const { first, second } = pearsonSquare(dec('50'), dec('10'), dec('20'), dec('100000'));
    assert.ok(first.equals(dec('25000')));
    assert.ok(second.equals(dec('75000')));
  });

  it('should add the two masses up to the batch exactly when the split is a repeating decimal', () => {
    // own example, derived: 10 % and 40 % to 20 %: parts 20 and 10, so the lean share is 2/3,
    // which no decimal holds exactly; the rest must still make up the 0.23 g batch to the digit.
    const { first, second } = pearsonSquare(dec('10'), dec('40'), dec('20'), dec('0.23'));
    assert.ok(first.plus(second).equals(dec('0.23')));
    assert.equal(first.toFixed(30), dec('0.23').times(2).div(3).toFixed(30));
  });

  it('should take all of one component when the target equals its fat', () => {
    const { first, second } = pearsonSquare(dec('10'), dec('50'), dec('50'), dec('8000'));
    assert.ok(first.isZero());
    assert.ok(second.equals(dec('8000')));
  });

  it('should take all of the first component when both fats equal the target', () => {
    const { first, second } = pearsonSquare(dec('20'), dec('20'), dec('20'), dec('8000'));
    assert.ok(first.equals(dec('8000')));
    assert.ok(second.isZero());
  });

  it('should refuse a target outside the two fats', () => {
    // derived: a blend's fat is a weighted mean, so it lies between the two
    assert.throws(() => pearsonSquare(dec('15'), dec('18'), dec('20'), dec('1000')), RangeError);
    assert.throws(() => pearsonSquare(dec('15'), dec('15'), dec('20'), dec('1000')), RangeError);
  });
});

describe('isReachable', () => {
  it('should accept a target between the fats, both ends included', () => {
    // derived: a blend's fat is a weighted mean, so it lies between the two
    assert.equal(isReachable(dec('10'), dec('50'), dec('20')), true);
    assert.equal(isReachable(dec('50'), dec('10'), dec('10')), true);
    assert.equal(isReachable(dec('10'), dec('50'), dec('50')), true);
    assert.equal(isReachable(dec('20'), dec('20'), dec('20')), true);
  });

  it('should refuse a target outside the fats', () => {
    // derived: a blend's fat is a weighted mean, so it lies between the two
    assert.equal(isReachable(dec('15'), dec('18'), dec('20')), false);
    assert.equal(isReachable(dec('15'), dec('18'), dec('14.9')), false);
    assert.equal(isReachable(dec('15'), dec('15'), dec('20')), false);
  });
});

describe('partnerForFixed', () => {
  it('should add 4 kg of 50 % trim to 12 kg of 10 % trim on hand for 20 % fat', () => {
    // own example, derived from the fat balance on the own Pearson example's trims:
    // 12 × 0.10 + X × 0.50 = (12 + X) × 0.20 → X = 12 × (10 − 20) ÷ (20 − 50) = 12 × 10/30 = 4 kg;
    // total 16 kg; check 1.2 + 2.0 = 3.2 kg fat = 20 % of 16 kg.
    const added = partnerForFixed(dec('10'), dec('50'), dec('20'), dec('12000'));
    assert.ok(added.equals(dec('4000')));
    const fat = blendFatPercent([
      { grams: dec('12000'), fat: dec('10') },
      { grams: added, fat: dec('50') },
    ]);
    assert.ok(fat.equals(dec('20')));
  });

  it('should add 15 kg of 10 % trim to 5 kg of 50 % trim on hand for 20 % fat', () => {
    // own example, derived: X = 5 × (50 − 20) ÷ (20 − 10) = 15 kg; 0.5 × 5 + 0.1 × 15 = 4 kg fat
    // in 20 kg = 20 %.
    assert.ok(partnerForFixed(dec('50'), dec('10'), dec('20'), dec('5000')).equals(dec('15000')));
  });

  it('should add nothing when the fixed component is already at the target', () => {
    assert.ok(partnerForFixed(dec('20'), dec('50'), dec('20'), dec('5000')).isZero());
    assert.ok(partnerForFixed(dec('20'), dec('20'), dec('20'), dec('5000')).isZero());
  });

  it('should refuse a target equal to the other fat, which no finite amount reaches', () => {
    assert.throws(() => partnerForFixed(dec('10'), dec('50'), dec('50'), dec('5000')), RangeError);
  });

  it('should refuse a target outside the two fats', () => {
    assert.throws(() => partnerForFixed(dec('10'), dec('15'), dec('20'), dec('5000')), RangeError);
  });
});

describe('blendFatPercent', () => {
  it('should refuse a blend that weighs nothing', () => {
    assert.throws(() => blendFatPercent([{ grams: dec('0'), fat: dec('10') }]), RangeError);
  });
});
