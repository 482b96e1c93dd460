import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { Reading } from '../../shared/api/process-record.ts';
import { readingsShown } from './control-summary.ts';

const START = Date.parse('2026-12-02T00:00:00Z');

function reading(id: number, minute: number, value: string, extra: Partial<Reading> = {}): Reading {
  const at = new Date(START + minute * 60_000).toISOString();
  return {
    id,
    by: null,
    recordedAt: at,
    corrects: null,
    reason: null,
    correctedBy: null,
    control: 'hold',
    at,
    value,
    enteredAs: null,
    source: 'logger',
    ...extra,
  };
}

// A day of a walk-in logger, summed up; 5.6 °C is over 41 °F = 5 °C, so its reading opened a
// deviation. source: FDA Food Code 2022, §3-501.16(A)(2)
const DAY = {
  count: 1440,
  first: '2026-12-02T00:00:00.000Z',
  last: '2026-12-02T23:59:00.000Z',
  min: '3.2',
  max: '5.6',
};

describe("a control's readings as the HACCP report shows them", () => {
  it('should keep the figures of a logger and list each of its readings a deviation names', () => {
    const warm = reading(601, 600, '5.6');
    const shown = readingsShown([warm], DAY, new Set([601]));
    assert.deepEqual(shown.logger, { ...DAY, missed: [warm] });
    assert.deepEqual(shown.readings, []);
  });

  it('should list readings entered by hand, and a corrected logger reading beside its correction', () => {
    const corrected = reading(11, 10, '9.9', { correctedBy: 2000 });
    const correction = reading(2000, 10, '3.1', {
      source: 'console',
      corrects: 11,
      reason: 'probe on the door',
    });
    const byHand = reading(2001, 720, '4', { source: 'command' });
    // A deviation named the logger reading before it was corrected: it is listed as corrected.
    const shown = readingsShown([corrected, correction, byHand], DAY, new Set([11]));
    assert.deepEqual(shown.logger?.missed, []);
    assert.deepEqual(
      shown.readings.map((r) => r.id),
      [11, 2000, 2001],
    );
  });

  it('should show no logger summary for a control read only by hand', () => {
    const shown = readingsShown([reading(1, 0, '3', { source: 'console' })], undefined, new Set());
    assert.equal(shown.logger, null);
    assert.equal(shown.readings.length, 1);
  });
});
