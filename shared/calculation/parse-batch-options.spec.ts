import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { BatchError } from './batch-error.ts';
import { parseBatchOptions } from './parse-batch-options.ts';
import { BELLY, GRIND } from './plan/plan-fixtures.ts';

const TODAY = { today: '2026-12-03' };

describe('batch options: the start day', () => {
  it('should take a start within a year of today', () => {
    const input = parseBatchOptions({ meat: '4kg', start: '2026-01-15' }, BELLY, TODAY);
    assert.equal(input.start, '2026-01-15');
  });

  it('should refuse a start far ahead or far back, naming --start', () => {
    // The day as the product writes it. source: the calendar
    for (const [start, side, words] of [
      ['9999-12-31', 'ahead', '31 Dec 9999'],
      ['2126-12-24', 'ahead', '24 Dec 2126'],
      ['1990-06-01', 'back', '1 Jun 1990'],
    ]) {
      assert.throws(
        () => parseBatchOptions({ meat: '4kg', start }, BELLY, TODAY),
        (error: unknown) =>
          error instanceof BatchError &&
          error.option === 'start' &&
          error.message.includes(`--start ${words} is more than a year ${side}`),
        start,
      );
    }
  });

  it('should still refuse a start that is no date at all before looking at the window', () => {
    assert.throws(
      () => parseBatchOptions({ meat: '4kg', start: '2026-02-30' }, BELLY, TODAY),
      /--start takes a date written YYYY-MM-DD, not "2026-02-30"/,
    );
  });
});

describe('batch options: several trimmings on hand, fat tests', () => {
  it('should read several KEY=WEIGHT entries, keeping a decimal comma inside its own', () => {
    const input = parseBatchOptions({ onHand: 'lean=12kg, fat = 3 kg' }, GRIND, TODAY);
    assert.deepEqual(
      input.onHand?.map((e) => [e.key, e.grams.toString()]),
      [
        ['lean', '12000'],
        ['fat', '3000'],
      ],
    );
    // A decimal comma is not taken for a second entry (lean=1 and "5kg"): the mass refuses it.
    assert.throws(
      () => parseBatchOptions({ onHand: 'lean=1,5kg' }, GRIND, TODAY),
      /got "1,5kg": write decimals with a point/,
    );
  });

  it('should read fat tests as percentages and refuse one over 100 %', () => {
    const input = parseBatchOptions({ fatTest: 'lean=18.5,fat=48' }, GRIND, TODAY);
    assert.deepEqual(
      input.fatTest?.map((e) => [e.key, e.fat.toString()]),
      [
        ['lean', '18.5'],
        ['fat', '48'],
      ],
    );
    assert.throws(
      () => parseBatchOptions({ fatTest: 'lean=101' }, GRIND, TODAY),
      (error: unknown) => error instanceof BatchError && error.option === 'fat-test',
    );
    assert.throws(
      () => parseBatchOptions({ fatTest: '18.5' }, GRIND, TODAY),
      /--fat-test takes KEY=VALUE, such as "lean=18.5"/,
    );
  });

  it('should refuse a fat test for a formula that is not a blend', () => {
    assert.throws(
      () => parseBatchOptions({ meat: '4kg', fatTest: 'lean=18' }, BELLY, TODAY),
      /--fat-test does not apply to a cure formula/,
    );
  });
});
