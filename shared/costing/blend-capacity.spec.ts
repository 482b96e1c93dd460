import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { dec } from '../decimal.ts';
import { maxGramsAtTarget } from './blend-capacity.ts';

const stock = (fat: string, kg: string) => ({
  fatPercent: dec(fat),
  availableGrams: dec(kg).times(1000),
});

describe('maxGramsAtTarget', () => {
  // hand-worked, 25 % target: 10 kg of 10 % lean is 150 kg·% short of fat; the 30 % trim brings
  // 5 a kg and goes in whole (10 kg, 50), the 50 % trim 25 a kg makes up the last 100: 4 kg.
  // 10 + 10 + 4 = 24 kg, plus the 5 kg already at 25 %: 29 kg.
  // (derived: the blend is on target when Σ mass × (fat − target) = 0)
  it('should fill the short side from the trims nearest the target first', () => {
    const most = maxGramsAtTarget(
      [stock('50', '10'), stock('10', '10'), stock('30', '10'), stock('25', '5')],
      dec('25'),
    );
    assert.ok(most.equals(dec('29000')));
  });

  // hand-worked: 10 kg of 50 % trim is 250 kg·% over 25 %; 15 a kg of 10 % lean takes it up in
  // 16.666… kg, so 26.666… kg in all
  it('should take part of the lean side when the fat side has less to give', () => {
    const most = maxGramsAtTarget([stock('10', '100'), stock('50', '10')], dec('25'));
    assert.equal(most.toFixed(3), '26666.667');
  });
});
