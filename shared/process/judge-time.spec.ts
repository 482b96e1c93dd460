import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { isoMs } from './judge-time.ts';

// The reference is the language's own reading of an ISO time, Date.parse. source: ECMA-262,
// ECMAScript Language Specification, Date.parse and the Date Time String Format
describe('reading an ISO time', () => {
  it('should read the form the records write as Date.parse does', () => {
    // source: IEEE Std 1003.1 (POSIX), Base Definitions, 4.16 Seconds Since the Epoch:
    // 2000-01-01T00:00:00Z is 946,684,800 s after the Epoch
    assert.equal(isoMs('2000-01-01T00:00:00.000Z'), 946_684_800_000);
    // Every 7,919 s and 7 ms across four years, a leap day among them: all hours, days and months.
    const start = Date.parse('2023-01-01T00:00:00.000Z');
    const end = Date.parse('2027-01-01T00:00:00.000Z');
    let checked = 0;
    for (let ms = start; ms < end; ms += 7_919_007) {
      const iso = new Date(ms).toISOString();
      assert.equal(isoMs(iso), Date.parse(iso), iso);
      checked++;
    }
    assert.ok(checked > 15_000);
  });

  it('should give what Date.parse gives for every other text, NaN included', () => {
    const texts = [
      '2024-02-29T23:59:59.999Z',
      '2026-02-29T00:00:00.000Z',
      '2026-02-30T00:00:00.000Z',
      '2026-04-31T12:00:00.000Z',
      '2026-01-31T12:00:00.000Z',
      '2026-01-01T24:00:00.000Z',
      '2026-01-01T23:59:60.000Z',
      '2026-01-01T23:60:00.000Z',
      '2026-13-01T00:00:00.000Z',
      '2026-00-01T00:00:00.000Z',
      '2026-01-00T00:00:00.000Z',
      '0099-01-01T00:00:00.000Z',
      '0000-01-01T00:00:00.000Z',
      '1969-12-31T23:59:59.999Z',
      '2026-03-02T12:00:00.00aZ',
      '2026-03-02t12:00:00.000z',
      '2026-03-02T12:00:00.000+',
      '2026-03-02 12:00:00.000Z',
      '2026-03-02T12:00:00Z',
      '2026-03-02T12:00:00.000+01:00',
      '2026-03-02T12:00',
      '+002026-03-02T12:00:00.000Z',
      '２０２６-03-02T12:00:00.000Z',
      '',
    ];
    for (const text of texts) assert.equal(isoMs(text), Date.parse(text), text);
  });
});
