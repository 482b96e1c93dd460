import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import fc from 'fast-check';
import { Decimal } from '../decimal.ts';
import {
  celsiusToFahrenheit,
  fahrenheitDifferenceToCelsius,
  fahrenheitToCelsius,
  parseTemperature,
  parseTemperatureDifference,
} from './temperature.ts';

describe('temperatures', () => {
  it('should convert the safe cooking temperatures of the USDA chart to Celsius', () => {
    // source: NIST SP 811 (2008), temperature conversion t/°C = (t/°F − 32) × 5/9; own
    // arithmetic
    const table: [string, string][] = [
      ['145', '62.78'],
      ['155', '68.33'],
      ['158', '70.00'],
      ['160', '71.11'],
      ['165', '73.89'],
      ['135', '57.22'],
      ['41', '5.00'],
      ['40', '4.44'],
    ];
    for (const [f, c] of table)
      assert.equal(fahrenheitToCelsius(new Decimal(f)).toFixed(2), c, `${f} °F`);
  });

  it('should read temperatures with either scale and with or without the degree sign', () => {
    // source: NIST SP 811 (2008), temperature conversion; 78 °F = 25.555… °C
    assert.equal(parseTemperature('26 °C').toString(), '26');
    assert.equal(parseTemperature('26C').toString(), '26');
    assert.equal(parseTemperature('78°F').toFixed(3), '25.556');
    assert.equal(parseTemperature('-4 F').toString(), '-20');
  });

  it('should convert a temperature difference without the 32 degree offset', () => {
    // derived from NIST SP 811 (2008), t/°C = (t/°F − 32) × 5/9: a difference such as a
    // friction factor takes only the 5/9 factor; 8 °F → 4.444 °C
    assert.equal(fahrenheitDifferenceToCelsius(new Decimal(8)).toFixed(3), '4.444');
    assert.equal(parseTemperatureDifference('14 °F').toFixed(3), '7.778');
    assert.notEqual(
      parseTemperatureDifference('14 F').toFixed(3),
      fahrenheitToCelsius(new Decimal(14)).toFixed(3),
    );
  });

  it('should refuse a temperature without a scale or below absolute zero', () => {
    assert.throws(() => parseTemperature('26'), /say °C or °F/);
    assert.throws(() => parseTemperature('-500 C'), /absolute zero/);
    assert.throws(() => parseTemperature('26 K'), /not °C or °F/);
  });

  it('should round-trip any temperature between the scales exactly', () => {
    // Property: the conversions are exact inverses at 40 significant digits.
    fc.assert(
      fc.property(fc.integer({ min: -400_00, max: 300_00 }), (hundredths) => {
        const celsius = new Decimal(hundredths).div(100);
        assert.ok(
          fahrenheitToCelsius(celsiusToFahrenheit(celsius)).minus(celsius).abs().lessThan('1e-30'),
        );
      }),
    );
  });
});
