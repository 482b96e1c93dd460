import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { Decimal } from '../decimal.ts';
import { fahrenheitToCelsius } from '../units/temperature.ts';
import { appendixAHoldRows } from './lethality-table.ts';

function rowAt(column: '6.5-log' | '7-log', degreesF: string): string | undefined {
  const tempC = fahrenheitToCelsius(new Decimal(degreesF)).toString();
  return appendixAHoldRows(column).find((row) => row.tempC === tempC)?.holdS;
}

describe('the FSIS Appendix A table', () => {
  // source: USDA FSIS, Compliance Guidelines for Meeting Lethality Performance Standards for
  // Certain Meat and Poultry Products, Appendix A (1999), table for cooked beef, roast beef and
  // cooked corned beef
  it('needs 112 min at 130 °F for 6.5-log and 121 min for 7-log', () => {
    assert.equal(rowAt('6.5-log', '130'), String(112 * 60));
    assert.equal(rowAt('7-log', '130'), String(121 * 60));
  });

  it('needs 12 min at 140 °F in both columns', () => {
    assert.equal(rowAt('6.5-log', '140'), '720');
    assert.equal(rowAt('7-log', '140'), '720');
  });

  it('needs 169 s at 146 °F, 22 s at 155 °F, and nothing at 158 °F', () => {
    assert.equal(rowAt('6.5-log', '146'), '169');
    assert.equal(rowAt('6.5-log', '155'), '22');
    assert.equal(rowAt('7-log', '157'), '15');
    assert.equal(rowAt('6.5-log', '158'), '0');
  });

  it('has one row for each whole degree from 130 °F to 158 °F, times falling as it warms', () => {
    const rows = appendixAHoldRows('6.5-log');
    assert.equal(rows.length, 29);
    for (let i = 1; i < rows.length; i++) {
      assert.ok(new Decimal(rows[i].holdS).lessThan(rows[i - 1].holdS));
    }
  });
});
