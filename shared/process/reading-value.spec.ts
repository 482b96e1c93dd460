import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { Decimal } from '../decimal.ts';
import { QuantityError } from '../units/quantity-error.ts';
import { parseLimitValue, parseReadingValue } from './reading-value.ts';

describe('reading a typed value', () => {
  it('reads temperatures in °C, °F, C, F and bare °C', () => {
    assert.equal(parseReadingValue('71.5 °C', 'internal-temperature').toString(), '71.5');
    // source: FDA Food Code 2022 §3-401.11 and FSIS Appendix A print 158 °F; (158 − 32) × 5/9 = 70
    assert.equal(parseReadingValue('158 °F', 'internal-temperature').toString(), '70');
    assert.equal(parseReadingValue('158F', 'chamber-temperature').toString(), '70');
    assert.equal(parseReadingValue('4.4 C', 'chamber-temperature').toString(), '4.4');
    assert.equal(parseReadingValue('-18', 'chamber-temperature').toString(), '-18');
    // source: FDA Food Code 2022 §3-501.16: 135 °F; (135 − 32) × 5/9 = 57.222…
    assert.equal(
      parseReadingValue('135 °F', 'internal-temperature').toFixed(2),
      new Decimal('57.22').toFixed(2),
    );
  });

  it('reads times, weights, pH and water activity', () => {
    assert.equal(parseReadingValue('1 h 30 min', 'time').toString(), '5400');
    assert.equal(parseReadingValue('17', 'time').toString(), '17');
    // source: NIST SP 811 (2008), Appendix B.8: 1 lb = 453.59237 g exactly
    assert.equal(parseReadingValue('2 lb', 'weight').toString(), '907.18474');
    assert.equal(parseReadingValue('950', 'weight').toString(), '950');
    assert.equal(parseReadingValue('pH 5.2', 'ph').toString(), '5.2');
    assert.equal(parseReadingValue('0.92 aw', 'water-activity').toString(), '0.92');
  });

  it('refuses what is not the measure, with words', () => {
    const refused = (text: string, measure: Parameters<typeof parseReadingValue>[1], why: RegExp) =>
      assert.throws(
        () => parseReadingValue(text, measure),
        (error: unknown) => error instanceof QuantityError && why.test(error.message),
      );
    refused('71,5', 'internal-temperature', /point/);
    refused('70 kg', 'internal-temperature', /not °C or °F/);
    refused('-300', 'internal-temperature', /absolute zero/);
    refused('15', 'ph', /between 0 and 14/);
    refused('1.2', 'water-activity', /between 0 and 1/);
    refused('3 °C', 'weight', /not a mass unit/);
    refused('-5', 'time', /negative/);
    refused('', 'time', /empty/);
  });

  it('wants the unit on a temperature in a formula’s limit', () => {
    assert.throws(() => parseLimitValue('60', 'chamber-temperature'), /unit/);
    assert.equal(parseLimitValue('5.2', 'ph').toString(), '5.2');
  });
});
