import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { clockWords } from './control-words.ts';

// The forms are the product's own (DEVELOPERS.md, "Dates go through one place"): a time alone
// today, the short moment of a board or a log "Thu 3 Dec, 14:32" on another day, the whole
// moment "3 Dec 2025, 14:32" in another year. 3 Dec 2026 is a Thursday (the calendar).
describe('clockWords, the process record’s times', () => {
  const today = '2026-12-03T15:00:00Z';

  it('should say a time of today as the clock alone', () => {
    assert.equal(clockWords('2026-12-03T14:32:00Z', 'UTC', today), '14:32');
  });

  it('should say a time of another day as the short moment of a log, with its weekday', () => {
    assert.equal(clockWords('2026-12-02T02:10:00Z', 'UTC', today), 'Wed 2 Dec, 02:10');
    assert.equal(clockWords('2026-12-04T09:05:00Z', 'UTC', today), 'Fri 4 Dec, 09:05');
  });

  it('should say a time of another year with its year', () => {
    assert.equal(clockWords('2025-12-31T23:59:00Z', 'UTC', today), '31 Dec 2025, 23:59');
  });

  it('should judge today on the kitchen’s wall clock, not in UTC', () => {
    // 23:30 UTC on 2 Dec is 00:30 on 3 Dec in Berlin (UTC+1 in winter): today there.
    // source: IANA tz database, Europe/Berlin (CET, UTC+1, in December)
    assert.equal(clockWords('2026-12-02T23:30:00Z', 'Europe/Berlin', today), '00:30');
    assert.equal(clockWords('2026-12-02T22:30:00Z', 'Europe/Berlin', today), 'Wed 2 Dec, 23:30');
  });
});
