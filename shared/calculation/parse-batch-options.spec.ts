import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { BatchError } from './batch-error.ts';
import { parseBatchOptions } from './parse-batch-options.ts';
import { BELLY } from './plan/plan-fixtures.ts';

const TODAY = { today: '2026-12-03' };

describe('batch options: the start day', () => {
  it('should take a start within a year of today', () => {
    const input = parseBatchOptions({ meat: '4kg', start: '2026-01-15' }, BELLY, TODAY);
    assert.equal(input.start, '2026-01-15');
  });

  it('should refuse a start far ahead or far back, naming --start', () => {
    for (const [start, side] of [
      ['9999-12-31', 'ahead'],
      ['2126-12-24', 'ahead'],
      ['1990-06-01', 'back'],
    ]) {
      assert.throws(
        () => parseBatchOptions({ meat: '4kg', start }, BELLY, TODAY),
        (error: unknown) =>
          error instanceof BatchError &&
          error.option === 'start' &&
          error.message.includes(`--start ${start} is more than a year ${side}`),
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
