import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { Reading } from '../../shared/api/process-record.ts';
import type { ReadingPoint } from '../../shared/process/control-types.ts';
import { readingAtMinuteF, START } from '../../shared/process/judge-spec-helpers.ts';
import { resolveControl } from '../../shared/process/resolve-control.ts';
import { judgeBatch } from './judge-batch.ts';
import { batchAlerts } from './process-alerts.ts';

const BATCH = { id: 7, lotCode: '260302-TB-01', formulaTitle: 'Test belly' };

// Chilling under FSIS option 1: 130 °F to 80 °F within 1.5 h, each stage timed from its own
// start. source: USDA FSIS, Appendix B, Compliance Guidelines for Cooling Heat-Treated Meat and
// Poultry Products (Stabilization) (1999), option 1
const CHILL = resolveControl({
  id: 'chill',
  title: 'Chilling',
  step: 'chill',
  measure: 'internal-temperature',
  rule: 'fsis-cooling-option-1',
  every: '30 min',
});

const minutes = (n: number): string => new Date(Date.parse(START) + n * 60_000).toISOString();

function reading(id: number, point: ReadingPoint): Reading {
  return {
    id,
    by: null,
    recordedAt: point.at,
    corrects: null,
    reason: null,
    correctedBy: null,
    control: 'chill',
    at: point.at,
    value: point.value,
    enteredAs: null,
    source: 'console',
  };
}

/** The alerts owed at `minute` after START, for a cool that read 130 °F at 0 and 100 °F at 30. */
function alertsAt(minute: number) {
  const readings = [
    reading(1, readingAtMinuteF('0', '130')),
    reading(2, readingAtMinuteF('30', '100')),
  ];
  const now = minutes(minute);
  const judged = judgeBatch([CHILL], readings, 'in-progress', { now, timeZone: 'UTC' });
  return batchAlerts(BATCH, judged, now).map((a) => `${a.kind} ${a.at}`);
}

describe('process alerts a batch is owed', () => {
  it('should owe nothing while readings are on time and the deadline is more than 30 minutes away', () => {
    // Next reading due at 60 min; stage 1's deadline is 90 min after the 130 °F reading.
    assert.deepEqual(alertsAt(45), []);
  });

  it('should give a reading ten minutes late its alert, named by the time it was due', () => {
    // Due at 60 min: at 69 it is still within the grace, at 70 it is chased.
    assert.deepEqual(alertsAt(69), [`stage-deadline ${minutes(90)}`]);
    assert.deepEqual(alertsAt(70), [`reading-due ${minutes(60)}`, `stage-deadline ${minutes(90)}`]);
  });

  it('should warn of a cooling stage 30 minutes before its deadline, and not after it passed', () => {
    assert.ok(!alertsAt(59).some((a) => a.startsWith('stage-deadline')));
    assert.ok(alertsAt(60).includes(`stage-deadline ${minutes(90)}`));
    assert.ok(!alertsAt(90).some((a) => a.startsWith('stage-deadline')));
  });

  it('should key each alert so that the same lateness is one alert however often it is decided', () => {
    const readings = [reading(1, readingAtMinuteF('0', '130'))];
    const keys = [75, 80].map((m) => {
      const now = minutes(m);
      const judged = judgeBatch([CHILL], readings, 'in-progress', { now, timeZone: 'UTC' });
      return batchAlerts(BATCH, judged, now).map((a) => a.key);
    });
    assert.deepEqual(keys[0], keys[1]);
  });
});
