import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import {
  clockMomentWords,
  dayWords,
  momentWords,
  dayMonthWords,
  shortDayWords,
  shortMomentWords,
  weekdayDayWords,
} from './date-words.ts';

// The expected weekdays are from the Gregorian calendar: 3 Dec 2026 is a Thursday, 29 Feb 2024
// a Thursday, 1 Jan 2027 a Friday. from memory
describe('dates and times in words, one form each', () => {
  it('should write a calendar day as "3 Dec 2026", in any time zone', () => {
    assert.equal(dayWords('2026-12-03'), '3 Dec 2026');
    assert.equal(dayWords('2024-02-29'), '29 Feb 2024');
    assert.equal(dayWords('2026-09-30'), '30 Sep 2026');
    assert.equal(dayWords('2026-12-03', 'Pacific/Kiritimati'), '3 Dec 2026');
    assert.equal(dayWords('2026-12-03', 'Pacific/Pago_Pago'), '3 Dec 2026');
  });

  it('should write a moment as "3 Dec 2026, 14:32" on the kitchen’s wall clock', () => {
    assert.equal(momentWords('2026-12-03T14:32:10Z', 'UTC'), '3 Dec 2026, 14:32');
    assert.equal(momentWords('2026-12-03T14:32:10Z', 'Europe/London'), '3 Dec 2026, 14:32');
    // Berlin is an hour ahead of UTC in winter (CET, UTC+1). from memory
    assert.equal(momentWords('2026-12-03T23:05:00Z', 'Europe/Berlin'), '4 Dec 2026, 00:05');
    assert.equal(momentWords('2026-12-03T00:00:00Z', 'UTC'), '3 Dec 2026, 00:00');
    assert.equal(dayWords('2026-12-03T23:05:00Z', 'Europe/Berlin'), '4 Dec 2026');
  });

  it('should write the short form of a board as "Thu 3 Dec, 14:32"', () => {
    assert.equal(shortMomentWords('2026-12-03T14:32:00Z', 'UTC'), 'Thu 3 Dec, 14:32');
    assert.equal(shortMomentWords('2024-02-29T07:05:00Z', 'UTC'), 'Thu 29 Feb, 07:05');
    assert.equal(shortMomentWords('2026-12-31T23:30:00Z', 'Europe/Berlin'), 'Fri 1 Jan, 00:30');
  });

  it('should head a page with the day and its weekday: "Thu 3 Dec 2026"', () => {
    // 3 Dec 2026 is a Thursday; 29 Feb 2028 a Tuesday. from memory
    assert.equal(weekdayDayWords('2026-12-03'), 'Thu 3 Dec 2026');
    assert.equal(weekdayDayWords('2028-02-29T23:30:00Z', 'Europe/Berlin'), 'Wed 1 Mar 2028');
  });

  it('should write the short day of a board as "Wed 2 Dec", a calendar day in any zone', () => {
    // 2 Dec 2026 is a Wednesday (a day before Thursday 3 Dec, above). from memory
    assert.equal(shortDayWords('2026-12-02'), 'Wed 2 Dec');
    assert.equal(shortDayWords('2024-02-29', 'Pacific/Kiritimati'), 'Thu 29 Feb');
    assert.equal(shortDayWords('2026-12-31T23:30:00Z', 'Europe/Berlin'), 'Fri 1 Jan');
  });

  it('should write the short day of a chart’s axis as "3 Dec", a calendar day in any zone', () => {
    assert.equal(dayMonthWords('2026-12-03'), '3 Dec');
    assert.equal(dayMonthWords('2026-09-30', 'Pacific/Kiritimati'), '30 Sep');
    assert.equal(dayMonthWords('2026-12-03T23:05:00Z', 'Europe/Berlin'), '4 Dec');
  });

  it('should write a time of a record against today: the clock, the short form, or the whole', () => {
    const today = '2026-12-03T09:00:00Z';
    assert.equal(clockMomentWords('2026-12-03T14:32:00Z', today, 'UTC'), '14:32');
    assert.equal(clockMomentWords('2026-12-01T14:32:00Z', today, 'UTC'), 'Tue 1 Dec, 14:32');
    assert.equal(clockMomentWords('2025-12-03T14:32:00Z', today, 'UTC'), '3 Dec 2025, 14:32');
  });

  it('should give back text that is no date as it is', () => {
    assert.equal(dayWords('soon'), 'soon');
    assert.equal(momentWords('not a time'), 'not a time');
  });
});
