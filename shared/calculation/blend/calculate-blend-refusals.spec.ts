import { describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { dec } from '../../decimal.ts';
import { calculateBlend } from './calculate-blend.ts';
import { batchError, grams, we25 } from './blend-spec-helpers.ts';

describe('calculateBlend, refusals', () => {
  it('should refuse 20 % fat from trimmings at 15 % and 18 % fat', () => {
    // derived (a blend is a weighted mean): the target must lie between the component fats
    const formula = we25({
      components: [
        { key: 'a', name: 'chuck trim', fat: 18 },
        { key: 'b', name: 'round trim', fat: 15 },
      ],
    });
    assert.throws(
      () => calculateBlend(formula, { total: dec('1000') }),
      batchError(undefined, /^20 % fat cannot be made from trimmings at 15 % and 18 % fat/),
    );
  });

  it('should name --target-fat when that is what cannot be made', () => {
    assert.throws(
      () => calculateBlend(we25(), { total: dec('1000'), targetFat: dec('55') }),
      batchError('target-fat', /55 % fat cannot be made from trimmings at 10 % and 50 % fat/),
    );
    assert.throws(
      () => calculateBlend(we25(), { total: dec('1000'), targetFat: dec('101') }),
      batchError('target-fat', /between 0 and 100/),
    );
  });

  it('should refuse a different target from two trimmings of equal fat', () => {
    const formula = we25({
      components: [
        { key: 'a', name: 'chuck trim', fat: 15 },
        { key: 'b', name: 'round trim', fat: 15 },
      ],
    });
    assert.throws(
      () => calculateBlend(formula, { total: dec('1000') }),
      batchError(undefined, /20 % fat cannot be made from trimmings at 15 % and 15 % fat/),
    );
  });

  it('should take all of one trimming when both are at the target', () => {
    const formula = we25({
      components: [
        { key: 'a', name: 'chuck trim', fat: 20 },
        { key: 'b', name: 'round trim', fat: 20 },
      ],
    });
    assert.deepEqual(grams(calculateBlend(formula, { total: dec('1000') }), 'Meat'), [
      '1000.000',
      '0.000',
    ]);
  });

  it('should ask for a size naming --total, --on-hand and --want when none is given', () => {
    assert.throws(
      () => calculateBlend(we25(), {}),
      batchError(undefined, /--total.*--on-hand.*--want/),
    );
  });

  it('should refuse a meat weight and a finished weight at once', () => {
    assert.throws(
      () => calculateBlend(we25(), { total: dec('1000'), want: dec('800') }),
      batchError('want', /only one of --total or --want/),
    );
  });

  it('should list the formula keys for an unknown on-hand key', () => {
    assert.throws(
      () => calculateBlend(we25(), { onHand: [{ key: 'belly', grams: dec('1000') }] }),
      batchError('on-hand', /"belly".*lean and fat/),
    );
  });

  it('should refuse an on-hand trimming when the target is the other trimming’s own fat', () => {
    assert.throws(
      () =>
        calculateBlend(we25(), {
          onHand: [{ key: 'lean', grams: dec('1000') }],
          targetFat: dec('50'),
        }),
      batchError('on-hand', /unlimited/),
    );
  });

  it('should refuse sizes that are not more than 0 g', () => {
    assert.throws(
      () => calculateBlend(we25(), { total: dec('0') }),
      batchError('total', /more than 0/),
    );
    assert.throws(
      () => calculateBlend(we25(), { want: dec('-1') }),
      batchError('want', /more than 0/),
    );
    assert.throws(
      () => calculateBlend(we25(), { total: dec('1000'), portion: dec('0') }),
      batchError('portion', /more than 0/),
    );
  });
});
