import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { Decimal } from '../../decimal.ts';
import { SATURATED_BRINE_SALT_PCT, brineStrength, salinometerDegrees } from './brine-strength.ts';

describe('brine strength', () => {
  it('should put 100 °SAL at 26.395 % salt', () => {
    // source: "The Salometer and How to Use It" (B-2, B-3)
    assert.equal(SATURATED_BRINE_SALT_PCT.toString(), '26.395');
    assert.equal(salinometerDegrees(new Decimal('26.395')).toString(), '100');
  });

  it('should match the salinometer table on the 60 °F scale', () => {
    // source: B-3 formula, table derived in check-values section 3
    const table: [number, string][] = [
      [10, '2.640'],
      [20, '5.279'],
      [40, '10.558'],
      [60, '15.837'],
      [80, '21.116'],
    ];
    for (const [degrees, percent] of table) {
      assert.equal(
        salinometerDegrees(new Decimal(percent)).toDecimalPlaces(1).toNumber(),
        degrees,
        `${degrees} °SAL`,
      );
    }
  });

  it('should count strength as salt over salt plus water', () => {
    // source: B-5 definition (from memory, standard); WE-12: 2.5 salt, 65 water → 3.704 %
    assert.equal(brineStrength(new Decimal('2.5'), new Decimal(65)).toFixed(3), '3.704');
  });
});
