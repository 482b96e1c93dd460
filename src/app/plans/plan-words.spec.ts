import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { plainNote, whenInWords } from './plan-words.ts';

describe('whenInWords', () => {
  it('should say a cure cures for its hold and then finishes before service', () => {
    // The demo belly: 8 days' hold, 2 lead days (formulas/quillmoor-belly.yaml).
    assert.equal(
      whenInWords({ holdDays: 8, leadDays: 2 }),
      'Cures 8 days, then 2 days to finish before service.',
    );
  });

  it('should say a dough with a sponge is made the day before, and a sauce on the day', () => {
    assert.equal(whenInWords({ holdDays: 0, leadDays: 1 }), 'Made 1 day before service.');
    assert.equal(whenInWords({ holdDays: 0, leadDays: 0 }), 'Made on the day of service.');
  });

  it('should count to the day a rub goes on, not to service', () => {
    const goesOn = [{ formula: { id: 'brisket', title: 'Brisket' }, date: '2026-12-10' }];
    assert.equal(whenInWords({ holdDays: 0, leadDays: 0, goesOn }), 'Made the day it goes on.');
    assert.equal(
      whenInWords({ holdDays: 0, leadDays: 2, goesOn }),
      'Made 2 days before it goes on.',
    );
  });
});

describe('plainNote', () => {
  it('should say what the loss allowance does instead of which convention it follows', () => {
    const core =
      'from the formula; loss taken out of the mixed dough: dough = pieces × piece ÷ (1 − loss/100), so the pieces are what is left after the loss';
    const plain = plainNote(core) ?? '';
    assert.match(plain, /^from the formula: extra dough is mixed/);
    assert.doesNotMatch(plain, /÷|convention|loss\/100/);
  });

  it('should keep every other note as it is', () => {
    assert.equal(plainNote('from the formula'), 'from the formula');
    assert.equal(plainNote(undefined), undefined);
  });
});
