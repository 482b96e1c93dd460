import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { Decimal } from '../../decimal.ts';
import { BatchError } from '../batch-error.ts';
import {
  NEAR_SATURATION_DEGREES,
  SATURATED_BRINE_SALT_PCT,
  brineStrength,
  checkBrineStrength,
  salinometerDegrees,
} from './brine-strength.ts';

const SOURCE = { made: 'with 1 g of water', fix: 'use more water', option: 'water' };

describe('brine strength', () => {
  it('should put 100 °SAL at 26.395 % salt', () => {
    // source: "The Salometer and How to Use It", meat-processing equipment manual, section 14:
    // saturated brine 26.395 % NaCl; °SAL = % salt ÷ 26.395 × 100
    assert.equal(SATURATED_BRINE_SALT_PCT.toString(), '26.395');
    assert.equal(salinometerDegrees(new Decimal('26.395')).toString(), '100');
  });

  it('should match the salinometer table on the 60 °F scale', () => {
    // source: °SAL = % salt ÷ 26.395 × 100 ("The Salometer and How to Use It"); the table is
    // derived from it
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
    // from memory (the standard water-phase salt definition, salt ÷ (salt + water) × 100); own
    // worked example: 2.5 salt, 65 water → 3.704 %
    assert.equal(brineStrength(new Decimal('2.5'), new Decimal(65)).toFixed(3), '3.704');
  });

  describe('the one saturation rule for every brine', () => {
    it('should refuse a brine stronger than saturated, naming what made it and the fix', () => {
      // source: saturated brine is 26.395 % NaCl, 100 °SAL at 60 °F ("The Salometer and How to Use
      // It"); NaCl dissolves to about 36 g per 100 g water at 20–25 °C, 36 / 136 = 26.5 %
      // (from memory)
      for (const strength of ['26.396', '30', '99.29']) {
        assert.throws(
          () => checkBrineStrength(new Decimal(strength), SOURCE),
          (error: unknown) =>
            error instanceof BatchError &&
            error.option === 'water' &&
            error.message.startsWith(
              `with 1 g of water, the brine would be ${new Decimal(strength).toFixed(1)} % salt: more than water can dissolve (26.395 %, 100 °SAL at 60 °F); use more water`,
            ),
          strength,
        );
      }
    });

    it('should accept a saturated brine, with a warning', () => {
      const warnings = checkBrineStrength(new Decimal('26.395'), SOURCE);
      assert.equal(warnings.length, 1);
      assert.match(warnings[0], /^The brine is 26\.4 % salt \(100 °SAL\), close to saturated/);
    });

    it('should warn from 95 °SAL up, and not below', () => {
      // 95 °SAL = 0.95 × 26.395 = 25.07525 % ("The Salometer and How to Use It"); the 95 °SAL
      // threshold: common practice, no source
      assert.equal(NEAR_SATURATION_DEGREES.toString(), '95');
      assert.equal(checkBrineStrength(new Decimal('25.07525'), SOURCE).length, 1);
      assert.match(
        checkBrineStrength(new Decimal('25.5'), SOURCE)[0],
        /salt may be left undissolved.*check it with a salinometer/,
      );
      assert.deepEqual(checkBrineStrength(new Decimal('25.0752'), SOURCE), []);
      assert.deepEqual(checkBrineStrength(new Decimal('6.796'), SOURCE), []);
    });

    it('should refuse without an option when the formula made the brine', () => {
      assert.throws(
        () => checkBrineStrength(new Decimal(40), { made: 'at 5 % pump', fix: 'raise pump_pct' }),
        (error: unknown) => error instanceof BatchError && error.option === undefined,
      );
    });
  });
});
