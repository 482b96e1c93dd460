import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { Reading } from '../../shared/api/process-record.ts';
import { evaluateControl } from '../../shared/process/evaluate-control.ts';
import { resolveControl } from '../../shared/process/resolve-control.ts';
import { readingsShown } from './control-summary.ts';

// A walk-in held at or below 41 °F = 5 °C. source: FDA Food Code 2022, §3-501.16(A)(2)
const WALK_IN = resolveControl({
  id: 'hold',
  title: 'Walk-in',
  step: 'hold',
  measure: 'internal-temperature',
  rule: 'cold-holding',
  every: '1 min',
});

const START = Date.parse('2026-12-02T00:00:00Z');

function reading(id: number, minute: number, value: string, extra: Partial<Reading> = {}): Reading {
  return {
    id,
    by: null,
    recordedAt: new Date(START + minute * 60_000).toISOString(),
    corrects: null,
    reason: null,
    correctedBy: null,
    control: 'hold',
    at: new Date(START + minute * 60_000).toISOString(),
    value,
    enteredAs: null,
    source: 'logger',
    ...extra,
  };
}

/** A day of a logger, one reading a minute at 3.2 °C, but for a warm spell and an exact 5 °C. */
function loggerDay(): Reading[] {
  return Array.from({ length: 1440 }, (_, minute) =>
    reading(
      minute + 1,
      minute,
      minute === 600 || minute === 601 ? '5.6' : minute === 700 ? '5' : '3.2',
    ),
  );
}

function shown(readings: Reading[]) {
  const standing = readings
    .filter((r) => r.correctedBy === null)
    .map((r) => ({ at: r.at, value: r.value }));
  const state = evaluateControl(WALK_IN, standing, {
    now: '2026-12-03T00:00:00Z',
    timeZone: 'UTC',
  });
  return readingsShown(readings, state);
}

describe("a control's readings as the HACCP report shows them", () => {
  it("should sum a logger's 1,440 readings up and keep each that missed the limit", () => {
    const { logger, readings } = shown(loggerDay());
    assert.ok(logger);
    assert.equal(logger.count, 1440);
    assert.equal(logger.first, '2026-12-02T00:00:00.000Z');
    assert.equal(logger.last, '2026-12-02T23:59:00.000Z');
    assert.deepEqual([logger.min, logger.max], ['3.2', '5.6']);
    // 5.6 °C is over 5 °C; exactly 5 °C is "41 °F or less" and keeps to the limit.
    assert.deepEqual(
      logger.missed.map((r) => r.at),
      ['2026-12-02T10:00:00.000Z', '2026-12-02T10:01:00.000Z'],
    );
    assert.equal(readings.length, 0);
  });

  it('should list every reading entered by hand, and a corrected logger reading with its correction', () => {
    const day = loggerDay();
    day[10] = { ...day[10], correctedBy: 2000 };
    const correction = reading(2000, 10, '3.1', {
      source: 'console',
      corrects: day[10].id,
      reason: 'probe touched the door',
    });
    const byHand = reading(2001, 720, '4', { source: 'command' });
    const { logger, readings } = shown([...day, correction, byHand]);
    assert.equal(logger?.count, 1439);
    assert.deepEqual(
      readings.map((r) => r.id),
      [day[10].id, 2000, 2001],
    );
  });

  it('should show no logger summary for a control read only by hand', () => {
    const { logger, readings } = shown([reading(1, 0, '3', { source: 'console' })]);
    assert.equal(logger, null);
    assert.equal(readings.length, 1);
  });
});
