import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { dec } from '../decimal.ts';
import { lotAmountWords } from './lot-amount-words.ts';

describe('lotAmountWords', () => {
  // hand-worked: 3 354 ml is 3.354 L, to 0.01 L 3.35 L; 1 lb = 453.59237 g (NIST SP 811, 2008,
  // Appendix B.8), so 2 267.96 g is 5 lb 0.0 oz
  it('should say stock in the measure a cook reads it in', () => {
    assert.equal(lotAmountWords(dec('2500'), 'g', 'kg'), '2.5 kg');
    // hand-worked: 5 952.380 95… g to the gram is 5.952 kg; 225 g stays in grams
    assert.equal(lotAmountWords(dec('5952.38095'), 'g', 'kg'), '5.952 kg');
    assert.equal(lotAmountWords(dec('225'), 'g', 'kg'), '225 g');
    assert.equal(lotAmountWords(dec('2267.96185'), 'g', 'lb'), '5 lb 0.0 oz');
    assert.equal(lotAmountWords(dec('3354'), 'ml', 'l'), '3.35 L');
    assert.equal(lotAmountWords(dec('750'), 'ml', 'l'), '750 ml');
    assert.equal(lotAmountWords(dec('12'), 'each', 'each'), '12');
  });
});
