import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import fc from 'fast-check';
import { BatchError } from './batch-error.ts';
import { addDays } from './dates.ts';
import { START_DAYS_AHEAD, START_DAYS_BACK, checkStartDate, startWindow } from './start-window.ts';

const TODAY = '2026-12-03';

/** Whether a call throws a BatchError for --start whose message matches. */
function refuses(run: () => unknown, message: RegExp): void {
  assert.throws(
    run,
    (error: unknown) =>
      error instanceof BatchError && error.option === 'start' && message.test(error.message),
  );
}

describe('start-date window', () => {
  it('should reach a year either side of today', () => {
    // 365 days back and ahead of 2026-12-03: 2025-12-03 and 2027-12-03 (no 29 February between).
    // source: our own rule (start-window.ts), calendar arithmetic
    assert.deepEqual(startWindow(TODAY), { earliest: '2025-12-03', latest: '2027-12-03' });
    assert.equal(START_DAYS_BACK, 365);
    assert.equal(START_DAYS_AHEAD, 365);
  });

  it('should accept today and both ends of the window', () => {
    for (const day of [TODAY, '2025-12-03', '2027-12-03', '2026-01-01']) {
      assert.equal(checkStartDate(day, TODAY), day);
    }
  });

  it('should refuse 9999-12-31, naming the field and the days allowed', () => {
    refuses(
      () => checkStartDate('9999-12-31', TODAY),
      /^--start 31 Dec 9999 is more than a year ahead: a batch can start from 3 Dec 2025 to 3 Dec 2027 \(a year either side of today, 3 Dec 2026\)$/,
    );
  });

  it('should refuse a start a century ahead whose lot code would read as this year', () => {
    // 2126-12-24 would make a lot code 261224-…, the same as 2026-12-24.
    refuses(() => checkStartDate('2126-12-24', TODAY), /more than a year ahead/);
  });

  it('should refuse the day after the window and the day before it', () => {
    refuses(() => checkStartDate('2027-12-04', TODAY), /more than a year ahead/);
    refuses(
      () => checkStartDate('2025-12-02', TODAY),
      /^--start 2 Dec 2025 is more than a year back: a batch can start from 3 Dec 2025 to 3 Dec 2027/,
    );
    refuses(() => checkStartDate('1999-01-01', TODAY), /more than a year back/);
  });

  it('should name the option it is given', () => {
    assert.throws(
      () => checkStartDate('2200-01-01', TODAY, 'for'),
      (error: unknown) =>
        error instanceof BatchError && error.option === 'for' && /^--for /.test(error.message),
    );
  });

  it('should refuse a today that is not a date, as a fault of the caller', () => {
    assert.throws(
      () => checkStartDate(TODAY, 'yesterday'),
      (error: unknown) => error instanceof Error && !(error instanceof BatchError),
    );
  });

  it('should keep every accepted start within a year of today, so a two-digit year is never ambiguous', () => {
    const days = fc.integer({ min: -800, max: 800 });
    const todays = fc.integer({ min: 0, max: 365 * 70 }).map((n) => addDays('2000-01-01', n));
    fc.assert(
      fc.property(todays, days, (today, offset) => {
        const start = addDays(today, offset);
        let accepted = true;
        try {
          checkStartDate(start, today);
        } catch (error) {
          if (!(error instanceof BatchError)) throw error;
          accepted = false;
        }
        assert.equal(accepted, offset >= -365 && offset <= 365);
        if (accepted) {
          // Within the window, the start's year is at most one from today's.
          assert.ok(Math.abs(Number(start.slice(0, 4)) - Number(today.slice(0, 4))) <= 1);
        }
      }),
    );
  });
});
