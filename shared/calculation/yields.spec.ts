import { describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { dec } from '../decimal.ts';
import {
  BEFORE_TRIM,
  YIELD_STEPS,
  finishedFraction,
  referenceFromFinished,
  yieldPercent,
  yieldStages,
} from './yields.ts';

describe('YIELD_STEPS', () => {
  it('should list the steps in process order', () => {
    assert.deepEqual([...YIELD_STEPS], ['trim', 'cure', 'smoke', 'cook', 'slice']);
  });
});

describe('yieldPercent', () => {
  it('should give 82.0 % for 8.2 kg usable from a 10.0 kg primal', () => {
    // own worked example; trim yield = usable ÷ starting weight × 100 (a definition, derived)
    assert.equal(yieldPercent(dec('8200'), dec('10000')).toFixed(1), '82.0');
  });

  it('should give 72 % for 72 kg cooked from 100 kg raw', () => {
    // own worked example; cooking yield = cooked ÷ raw × 100 as in USDA ARS, USDA Table of
    // Cooking Yields for Meat and Poultry, 2012, Release 2 2014
    assert.ok(yieldPercent(dec('72000'), dec('100000')).equals(dec('72')));
  });
});

describe('yieldStages', () => {
  it('should give no stages when the formula has no yields', () => {
    assert.deepEqual(yieldStages(dec('1000'), undefined), []);
    assert.deepEqual(yieldStages(dec('1000'), {}), []);
  });

  it('should say to buy 12.195 kg to get 10 kg usable at an 82 % trim yield', () => {
    // own worked example (trim yield = usable ÷ starting weight): 10 / 0.82 = 12.195 kg
    const stages = yieldStages(dec('10000'), { trim: 82 });
    assert.equal(stages.length, 1);
    assert.equal(stages[0].step, BEFORE_TRIM);
    assert.ok(stages[0].percent.equals(dec('82')));
    assert.equal(stages[0].grams.div(1000).toFixed(3), '12.195');
  });

  it('should give 72 kg cooked from 100 kg raw at a 72 % cook yield', () => {
    // own worked example; cooking yield as in USDA ARS, USDA Table of Cooking Yields for Meat
    // and Poultry
    const stages = yieldStages(dec('100000'), { cook: 72 });
    assert.deepEqual(
      stages.map((s) => s.step),
      ['cook'],
    );
    assert.ok(stages[0].grams.equals(dec('72000')));
  });

  it('should carry the weight forward through every step in process order', () => {
    // own example, derived: 10 kg green belly, trimmed at 90 %, cured at 104 %, smoked at 90 %,
    // sliced at 95 %. Buy 10 / 0.9 = 11.111 kg; cured 10 × 1.04 = 10.4 kg; smoked 10.4 × 0.9 =
    // 9.36 kg; sliced 9.36 × 0.95 = 8.892 kg. Keys are given out of order on purpose.
    const stages = yieldStages(dec('10000'), { slice: 95, smoke: 90, cure: 104, trim: 90 });
    assert.deepEqual(
      stages.map((s) => s.step),
      [BEFORE_TRIM, 'cure', 'smoke', 'slice'],
    );
    assert.equal(stages[0].grams.toFixed(3), '11111.111');
    assert.ok(stages[1].grams.equals(dec('10400')));
    assert.ok(stages[2].grams.equals(dec('9360')));
    assert.ok(stages[3].grams.equals(dec('8892')));
  });

  it('should refuse a yield of zero', () => {
    assert.throws(() => yieldStages(dec('1000'), { cook: 0 }), RangeError);
  });
});

describe('referenceFromFinished', () => {
  it('should start from 69.444 kg raw for 50 kg cooked at a 72 % cook yield', () => {
    // own worked example (cooking yield, USDA Table of Cooking Yields): 50 / 0.72 = 69.444 kg
    assert.equal(referenceFromFinished(dec('50000'), { cook: 72 }).div(1000).toFixed(3), '69.444');
  });

  it('should give the finished weight back when there are no yields', () => {
    assert.ok(referenceFromFinished(dec('6000'), undefined).equals(dec('6000')));
    assert.ok(referenceFromFinished(dec('6000'), {}).equals(dec('6000')));
  });

  it('should leave out the trim yield, which lies before the reference weight', () => {
    assert.ok(referenceFromFinished(dec('6000'), { trim: 80 }).equals(dec('6000')));
  });

  it('should work back through every yield after the reference', () => {
    // own example, derived: for 8.892 kg sliced bacon with the yields of the example above,
    // green weight = 8.892 / (1.04 × 0.90 × 0.95) = 8.892 / 0.8892 = 10 kg.
    const yields = { trim: 90, cure: 104, smoke: 90, slice: 95 };
    assert.ok(finishedFraction(yields).equals(dec('0.8892')));
    assert.ok(referenceFromFinished(dec('8892'), yields).equals(dec('10000')));
  });

  it('should undo yieldStages for the last stage', () => {
    // own example, derived: 6 kg sliced bacon at cure 104 %, smoke 88 %, slice 93 %.
    const yields = { cure: 104, smoke: 88, slice: 93 };
    const green = referenceFromFinished(dec('6000'), yields);
    const stages = yieldStages(green, yields);
    assert.equal(stages[stages.length - 1].grams.toFixed(9), '6000.000000000');
  });
});
