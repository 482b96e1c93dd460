import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { ReminderScheduler } from '../../server/reminders/reminder-scheduler.ts';
import { giveDemoAddresses, handClock, localNoon, readOutbox } from '../helpers/mail.ts';
import { startTestServer } from '../helpers/test-server.ts';

// The demo belly (formulas/quillmoor-belly.yaml) at 4 cm from Thu 29 Feb 2024: ready Fri 8 Mar,
// turned every 2 days, on 2, 4 and 6 Mar.
// source: the formula's own hold rule (days_per_cm: 2, min_days: 7, flip_every_days: 2)
const START = '2024-02-29';
const BELLY = {
  formula: 'quillmoor-belly',
  batch: { meat: '4.26kg', thickness: '4cm', start: START },
} as const;

describe('turn reminders and recorded turns', () => {
  it('should send no turn reminder for a batch already turned for that turning day', async (t) => {
    const clock = handClock(localNoon(START));
    const server = await startTestServer(t, {}, { now: clock.now });
    await giveDemoAddresses(server);
    const tobin = server.as('tobin');
    const lots: string[] = [];
    for (let i = 0; i < 2; i++) {
      const recorded = await tobin.post('/api/batches', BELLY);
      assert.equal(recorded.status, 201, recorded.text);
      lots.push(recorded.json.batch.lotCode);
      await tobin.post(`/api/batches/${recorded.json.batch.lotCode}/status`, { to: 'curing' });
    }
    const [turned, untouched] = lots;
    const runAt = async (instant: Date) => {
      clock.set(instant);
      return new ReminderScheduler(server.context, { now: clock.now }).runOnce();
    };

    // The first turning day: the cook turns one belly at 08:00, before the run at noon.
    const morning = localNoon('2024-03-02');
    morning.setHours(8);
    clock.set(morning);
    assert.equal((await tobin.post(`/api/batches/${turned}/turns`)).status, 201);
    const first = await runAt(localNoon('2024-03-02'));
    assert.deepEqual(
      first.sent.map((s) => [s.lotCode, s.kind, s.dueOn]),
      [[untouched, 'flip', '2024-03-02']],
    );
    // The day after, the turn still stands for the turning day; none is sent late.
    assert.deepEqual((await runAt(localNoon('2024-03-03'))).sent, []);
    // The next turning day owes a new turn, so its reminder goes to both.
    const next = await runAt(localNoon('2024-03-04'));
    assert.deepEqual(next.sent.map((s) => [s.lotCode, s.kind, s.dueOn]).sort(), [
      [turned, 'flip', '2024-03-04'],
      [untouched, 'flip', '2024-03-04'],
    ]);
    const outbox = await readOutbox(server);
    assert.equal(outbox.filter((m) => m.related === turned).length, 2);
    assert.equal(outbox.filter((m) => m.related === untouched).length, 4);
  });
});
