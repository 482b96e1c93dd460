import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import fc from 'fast-check';
import { addDays } from '../../shared/calculation/dates.ts';
import { flipDays } from '../../shared/calculation/turn-days.ts';
import { dueReminders, localDate } from './reminder-schedule.ts';

// The demo belly at 4 cm: 2 days per cm = 8 days, flipped every 2 days (formulas/quillmoor-belly.yaml).
const BELLY = { start: '2026-12-02', ready: '2026-12-10', flipEveryDays: 2 };

describe('reminder schedule', () => {
  it('should flip on start + k × every, before the ready day', () => {
    assert.deepEqual(flipDays(BELLY), ['2026-12-04', '2026-12-06', '2026-12-08']);
  });

  it('should have no flip days without a flip rule', () => {
    assert.deepEqual(flipDays({ start: '2026-12-02', ready: '2026-12-10' }), []);
    assert.deepEqual(flipDays({ ...BELLY, flipEveryDays: null }), []);
  });

  it('should owe nothing on the start day or the day after', () => {
    assert.deepEqual(dueReminders(BELLY, '2026-12-02'), []);
    assert.deepEqual(dueReminders(BELLY, '2026-12-03'), []);
  });

  it('should owe the flip on a flip day, and the same one the day after', () => {
    assert.deepEqual(dueReminders(BELLY, '2026-12-04'), [{ kind: 'flip', dueOn: '2026-12-04' }]);
    assert.deepEqual(dueReminders(BELLY, '2026-12-05'), [{ kind: 'flip', dueOn: '2026-12-04' }]);
  });

  it('should owe only the latest missed flip day', () => {
    assert.deepEqual(dueReminders(BELLY, '2026-12-09'), [{ kind: 'flip', dueOn: '2026-12-08' }]);
  });

  it('should owe no flip for a batch already turned on or after its flip day', () => {
    const turned = (lastTurnedOn: string) => ({ ...BELLY, lastTurnedOn });
    assert.deepEqual(dueReminders(turned('2026-12-04'), '2026-12-04'), []);
    assert.deepEqual(dueReminders(turned('2026-12-05'), '2026-12-05'), []);
    // A turn the day before the flip day does not stand for it; nor an older flip's for a newer.
    assert.deepEqual(dueReminders(turned('2026-12-03'), '2026-12-04'), [
      { kind: 'flip', dueOn: '2026-12-04' },
    ]);
    assert.deepEqual(dueReminders(turned('2026-12-04'), '2026-12-06'), [
      { kind: 'flip', dueOn: '2026-12-06' },
    ]);
  });

  it('should owe ready on the ready day and no flip', () => {
    assert.deepEqual(dueReminders(BELLY, '2026-12-10'), [{ kind: 'ready', dueOn: '2026-12-10' }]);
  });

  it('should owe ready and overdue from the day after the ready day', () => {
    assert.deepEqual(dueReminders(BELLY, '2026-12-11'), [
      { kind: 'ready', dueOn: '2026-12-10' },
      { kind: 'overdue', dueOn: '2026-12-11' },
    ]);
    assert.deepEqual(dueReminders(BELLY, '2027-01-20'), [
      { kind: 'ready', dueOn: '2026-12-10' },
      { kind: 'overdue', dueOn: '2026-12-11' },
    ]);
  });

  it('should never owe a reminder for a day after today, nor a flip on or after the ready day', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 40 }),
        fc.integer({ min: 1, max: 10 }),
        fc.integer({ min: -5, max: 60 }),
        (days, every, offset) => {
          const hold = {
            start: '2026-12-02',
            ready: addDays('2026-12-02', days),
            flipEveryDays: every,
          };
          const today = addDays(hold.start, offset);
          for (const reminder of dueReminders(hold, today)) {
            assert.ok(reminder.dueOn <= today);
            if (reminder.kind === 'flip') assert.ok(reminder.dueOn < hold.ready);
          }
        },
      ),
    );
  });

  it('should owe a batch recorded after its ready day nothing for the days already past', () => {
    // Made on paper from 2 Dec, recorded on 20 Dec: ready (10 Dec) and overdue (11 Dec) had passed.
    const paper = { ...BELLY, recordedOn: '2026-12-20' };
    assert.deepEqual(dueReminders(paper, '2026-12-20'), []);
    assert.deepEqual(dueReminders(paper, '2027-01-20'), []);
  });

  it('should owe a backdated batch only what falls due from the day it was recorded on', () => {
    // Recorded on 7 Dec: the flips of 4 and 6 Dec are past; 8 Dec, ready and overdue are not.
    const paper = { ...BELLY, recordedOn: '2026-12-07' };
    assert.deepEqual(dueReminders(paper, '2026-12-07'), []);
    assert.deepEqual(dueReminders(paper, '2026-12-08'), [{ kind: 'flip', dueOn: '2026-12-08' }]);
    assert.deepEqual(dueReminders(paper, '2026-12-11'), [
      { kind: 'ready', dueOn: '2026-12-10' },
      { kind: 'overdue', dueOn: '2026-12-11' },
    ]);
    // Recorded on its ready day: that day's reminder still goes out.
    assert.deepEqual(dueReminders({ ...BELLY, recordedOn: '2026-12-10' }, '2026-12-10'), [
      { kind: 'ready', dueOn: '2026-12-10' },
    ]);
  });

  it('should never owe a reminder for a day before the batch was recorded', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 40 }),
        fc.integer({ min: 1, max: 10 }),
        fc.integer({ min: 0, max: 60 }),
        fc.integer({ min: 0, max: 60 }),
        (days, every, recordedAfter, todayAfter) => {
          const start = '2026-12-02';
          const recordedOn = addDays(start, recordedAfter);
          const hold = { start, ready: addDays(start, days), flipEveryDays: every, recordedOn };
          for (const reminder of dueReminders(hold, addDays(recordedOn, todayAfter))) {
            assert.ok(reminder.dueOn >= recordedOn, `${reminder.kind} ${reminder.dueOn}`);
          }
        },
      ),
    );
  });

  it('should read the local calendar date of an instant', () => {
    assert.equal(localDate(new Date(2026, 11, 4, 0, 5)), '2026-12-04');
    assert.equal(localDate(new Date(2026, 11, 4, 23, 55)), '2026-12-04');
  });
});
