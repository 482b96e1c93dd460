import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { clockTicks } from './clock-ticks.ts';

const MIN = 60_000;
const at = (hhmm: string): number => Date.parse(`2026-03-02T${hhmm}:00Z`);
const clock = (ms: number): string => new Date(ms).toISOString().slice(11, 16);

describe('clockTicks', () => {
  it('should put the ticks of a cooling on whole hours', () => {
    // 12:50 to 20:00: hourly would be 7 ticks, 13:00 … 19:00, and 20:00 makes 8; two-hourly fits.
    assert.deepEqual(clockTicks(at('12:50'), at('20:00'), 0).map(clock), [
      '14:00',
      '16:00',
      '18:00',
      '20:00',
    ]);
  });

  it('should use five minutes over half an hour, quarter hours over an hour and a half', () => {
    assert.deepEqual(clockTicks(at('12:46'), at('13:16'), 0).map(clock), [
      '12:50',
      '12:55',
      '13:00',
      '13:05',
      '13:10',
      '13:15',
    ]);
    assert.deepEqual(clockTicks(at('12:46'), at('14:16'), 0).map(clock), [
      '13:00',
      '13:15',
      '13:30',
      '13:45',
      '14:00',
      '14:15',
    ]);
  });

  it('should fall on the hour of a zone half an hour off UTC', () => {
    // 13:30 UTC is 19:00 in a zone 5 h 30 min east.
    const ticks = clockTicks(at('12:10'), at('15:50'), 330 * MIN);
    assert.deepEqual(ticks.map(clock), ['12:30', '13:30', '14:30', '15:30']);
  });

  it('should give one tick when there is no span', () => {
    assert.deepEqual(clockTicks(at('12:00'), at('12:00'), 0), [at('12:00')]);
  });
});
