import assert from 'node:assert/strict';
import { afterEach, beforeEach, describe, it } from 'node:test';
import { processAlertMessage, type ProcessAlertFacts } from './process-alert-message.ts';
import type { ProcessAlert } from './process-alerts.ts';

const FACTS: Omit<ProcessAlertFacts, 'alert'> = {
  now: '2026-12-03T13:50:00Z',
  recipientName: 'Imke Thornbury',
  url: 'http://127.0.0.1:4310/batches/QB-261203-01',
  consoleUrl: 'http://127.0.0.1:4310',
  kitchen: 'Quillmoor Smokehouse',
};

const ALERT = {
  key: 'k',
  batchId: 12,
  equipmentId: null,
  subject: 'QB-261203-01',
  title: 'Quillmoor belly, dry equilibrium cure',
} as const;

/** The text of an alert's e-mail. */
function textOf(kind: ProcessAlert['kind'], what: string, at: string): string {
  return processAlertMessage({ ...FACTS, alert: { ...ALERT, kind, what, at } }).text;
}

describe('processAlertMessage says its times as the product writes moments', () => {
  let zone: string | undefined;
  beforeEach(() => {
    zone = process.env.TZ;
    // source: IANA tz database, Europe/Berlin (CET, UTC+1, in December)
    process.env.TZ = 'Europe/Berlin';
  });
  afterEach(() => {
    if (zone === undefined) delete process.env.TZ;
    else process.env.TZ = zone;
  });

  it('should give a cooling deadline its day and the kitchen’s clock, even when it is today', () => {
    const text = textOf('stage-deadline', 'Chilling: stage 1 not reached', '2026-12-03T14:32:00Z');
    // 14:32 UTC is 15:32 in Berlin; 3 Dec 2026 is a Thursday (the calendar).
    assert.match(text, /The deadline is Thu 3 Dec, 15:32\./);
    assert.doesNotMatch(text, /\d{4}-\d{2}-\d{2}/);
  });

  it('should say when a limit was missed on the day it was', () => {
    const text = textOf('deviation', 'Cooking: 61.2 °C is under 63 °C.', '2026-12-02T23:10:00Z');
    // 23:10 UTC on 2 Dec is 00:10 on 3 Dec in Berlin.
    assert.match(text, /a critical limit was missed at Thu 3 Dec, 00:10\./);
  });
});
