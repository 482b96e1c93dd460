import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { QuantityError } from '../units/quantity-error.ts';
import { icePointCheck } from './ice-point.ts';

// The ice-point check: a thermometer in ice water reads 0 °C / 32 °F (the freezing point of
// water); within ±1 °C or ±2 °F it passes. common practice, no source
describe('ice-point check', () => {
  it('should pass readings within 1 °C of 0 °C, the edges included', () => {
    for (const text of ['0 °C', '0.5 °C', '1 °C', '-1 °C', '-0.9 C']) {
      assert.equal(icePointCheck(text).passes, true, text);
    }
  });

  it('should fail readings more than 1 °C off, and say by how much', () => {
    const result = icePointCheck('1.5 °C');
    assert.equal(result.passes, false);
    assert.equal(
      result.words,
      'reads 1.5 °C in ice water: 1.5 °C off 0 °C, more than the 1 °C allowed',
    );
    assert.equal(icePointCheck('-1.1 °C').passes, false);
  });

  it('should judge a °F thermometer by ±2 °F of 32 °F', () => {
    assert.equal(icePointCheck('34 °F').passes, true);
    assert.equal(icePointCheck('30 °F').passes, true);
    assert.equal(icePointCheck('34.5 °F').passes, false);
    // 33.9 °F is 1.06 °C: within the °F rule a thermometer showing °F is held to.
    assert.equal(icePointCheck('33.9 °F').passes, true);
  });

  it('should give the reading in °C', () => {
    // source: NIST SP 811 (2008), t/°C = (t/°F − 32) × 5/9: 33.8 °F = 1 °C
    assert.equal(icePointCheck('33.8 °F').celsius.toString(), '1');
  });

  it('should refuse a reading that is not a temperature', () => {
    assert.throws(() => icePointCheck('0.5'), QuantityError);
  });
});
