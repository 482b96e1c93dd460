import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { Decimal } from '../decimal.ts';
import { baseMeasureOf, costOfAmount, isMassUnit, isReceivedUnit } from './stock-measure.ts';

describe('pricing a lot received by the gallon', () => {
  it('should price half a gallon at half the gallon price', () => {
    // source: NIST SP 811 (2008), Appendix B.8: 1 US gallon = 231 in³ = 3.785411784 l exactly,
    // so half a gallon is 1892.705892 ml; at 6.40 a gallon it costs 3.20.
    assert.equal(
      costOfAmount(new Decimal('1892.705892'), 'gal', new Decimal('6.40')).toFixed(),
      '3.2',
    );
  });

  it('should keep a gallon lot in millilitres, not weigh it', () => {
    assert.equal(isReceivedUnit('gal'), true);
    assert.equal(baseMeasureOf('gal'), 'ml');
    assert.equal(isMassUnit('gal'), false);
    assert.equal(isReceivedUnit('cup'), false);
  });
});
