import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { Reading } from '../../shared/api/process-record.ts';
import { resolveControl } from '../../shared/process/resolve-control.ts';
import {
  controlClosed,
  deadlinesNowMet,
  deviationsToOpen,
  judgeBatch,
  missKey,
} from './judge-batch.ts';

const COOK = resolveControl({
  id: 'cook',
  title: 'Cooking',
  step: 'smoke',
  measure: 'internal-temperature',
  rule: 'fsis-lethality-instant',
});
const HOLD = resolveControl({
  id: 'hold',
  title: 'Cold holding',
  step: 'hold',
  measure: 'internal-temperature',
  rule: 'cold-holding',
  every: '1 h',
});
const CHILL = resolveControl({
  id: 'chill',
  title: 'Chilling',
  step: 'chill',
  measure: 'internal-temperature',
  rule: 'fsis-cooling-option-1',
});
const CLOCK = { now: '2026-03-02T18:00:00.000Z', timeZone: 'UTC' };

let serial = 0;
function reading(control: string, at: string, value: string, more: Partial<Reading> = {}): Reading {
  return {
    id: ++serial,
    by: null,
    recordedAt: at,
    corrects: null,
    reason: null,
    correctedBy: null,
    control,
    at,
    value,
    enteredAs: null,
    source: 'console',
    ...more,
  };
}

describe('judging a batch', () => {
  it('keeps a cook in progress until a later control has a reading, then misses it', () => {
    // source: FSIS Appendix A (1999) instant lethality for meat other than poultry, 158 °F = 70 °C
    const cook = [reading('cook', '2026-03-02T12:00:00.000Z', '65')];
    const before = judgeBatch([COOK, HOLD], cook, 'in-progress', CLOCK);
    assert.equal(before[0]!.state.status, 'in-progress');
    const after = judgeBatch(
      [COOK, HOLD],
      [...cook, reading('hold', '2026-03-02T13:00:00.000Z', '4')],
      'in-progress',
      CLOCK,
    );
    assert.equal(after[0]!.state.status, 'missed');
    assert.deepEqual(
      after[0]!.state.misses.map((m) => m.key),
      ['not-reached'],
    );
  });

  it('misses a cook with no reading at all once the batch has moved on', () => {
    const judged = judgeBatch([COOK, HOLD], [reading('hold', CLOCK.now, '4')], 'curing', CLOCK);
    assert.deepEqual(
      deviationsToOpen({ id: 7, lotCode: '260302-QB-01' }, judged).map((d) => d.key),
      ['batch 7/cook/not-reached'],
    );
  });

  it('counts the step over once the batch is done, with no later reading', () => {
    const cook = [reading('cook', '2026-03-02T12:00:00.000Z', '65')];
    assert.equal(judgeBatch([COOK, HOLD], cook, 'done', CLOCK)[0]!.state.status, 'missed');
  });

  it('judges the correction, not the reading it replaced, and lists both', () => {
    // source: FDA Food Code 2022 §3-501.16(A)(2), cold holding at 41 °F = 5 °C or below
    const wrong = reading('hold', '2026-03-02T13:00:00.000Z', '9', { correctedBy: 99 });
    const right = reading('hold', '2026-03-02T13:00:00.000Z', '4', { id: 99, corrects: wrong.id });
    const [, hold] = judgeBatch([COOK, HOLD], [wrong, right], 'in-progress', CLOCK);
    assert.deepEqual(hold!.state.misses, []);
    assert.equal(hold!.readings.length, 2);
  });

  it('opens one deviation per miss, keyed by batch, control and miss, naming the reading', () => {
    const warm = reading('hold', '2026-03-02T13:00:00.000Z', '9');
    const judged = judgeBatch([HOLD], [warm], 'in-progress', CLOCK);
    const open = deviationsToOpen({ id: 12, lotCode: '260302-QB-01' }, judged);
    assert.deepEqual(
      open.map((d) => [d.key, d.kind, d.readingId, d.control]),
      [['batch 12/hold/2026-03-02T13:00:00.000Z', 'reading', warm.id, 'hold']],
    );
    assert.match(open[0]!.what, /^Cold holding: /);
  });

  it('lets a finished batch go only when each control is met or its misses are closed', () => {
    const warm = reading('hold', '2026-03-02T13:00:00.000Z', '9');
    const hot = reading('cook', '2026-03-02T12:00:00.000Z', '71');
    const judged = judgeBatch([COOK, HOLD], [hot, warm], 'done', CLOCK);
    assert.equal(controlClosed(12, judged[0]!, new Set()), true);
    assert.equal(controlClosed(12, judged[1]!, new Set()), false);
    const key = missKey(12, 'hold', judged[1]!.state.misses[0]!);
    assert.equal(controlClosed(12, judged[1]!, new Set([key])), true);
    const waiting = judgeBatch([COOK, HOLD], [hot], 'done', CLOCK)[1]!;
    assert.equal(controlClosed(12, waiting, new Set()), false);
  });

  // source: FSIS Appendix B (1999) option 1: 54.4 °C (130 °F) to 26.7 °C (80 °F) within 1.5 h
  const cooling = [
    reading('chill', '2026-03-02T12:00:00.000Z', '55'),
    reading('chill', '2026-03-02T12:30:00.000Z', '40'),
  ];

  it('opens a deadline miss on the readings only once one was taken after the deadline', () => {
    const judged = judgeBatch([CHILL], cooling, 'in-progress', CLOCK);
    assert.equal(judged[0]!.state.misses[0]!.kind, 'deadline', 'missed at the clock');
    assert.deepEqual(deviationsToOpen({ id: 1, lotCode: 'L' }, judged, 'readings'), []);
    assert.equal(deviationsToOpen({ id: 1, lotCode: 'L' }, judged, 'clock').length, 1);
    const after = [...cooling, reading('chill', '2026-03-02T13:40:00.000Z', '30')];
    const shown = judgeBatch([CHILL], after, 'in-progress', CLOCK);
    assert.deepEqual(
      deviationsToOpen({ id: 1, lotCode: 'L' }, shown, 'readings').map((d) => d.kind),
      ['deadline'],
    );
  });

  it('finds an open deadline deviation the readings now show was met, and keeps a late one', () => {
    const key = 'batch 1/chill/stage-1';
    const open = { kind: 'deadline' as const, control: 'chill', action: null, key };
    const inTime = [...cooling, reading('chill', '2026-03-02T13:15:00.000Z', '26')];
    const met = judgeBatch([CHILL], inTime, 'in-progress', CLOCK);
    assert.deepEqual(
      deadlinesNowMet(1, met, [open]).map((m) => m.deviation.key),
      [key],
    );
    const late = [...cooling, reading('chill', '2026-03-02T13:45:00.000Z', '26')];
    assert.deepEqual(
      deadlinesNowMet(1, judgeBatch([CHILL], late, 'in-progress', CLOCK), [open]),
      [],
    );
  });
});
