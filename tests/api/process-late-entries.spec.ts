import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import {
  at,
  processOf,
  reading,
  recordControlled,
  scan,
  startProcessServer,
} from '../helpers/process-calls.ts';

// source: USDA FSIS, Appendix B, Compliance Guidelines for Cooling Heat-Treated Meat and Poultry
// Products (Stabilization) (1999), option 1: from 130 °F, 80 °F within 1.5 hours, then 40 °F
// within 5 hours more. The cool below starts at minute 1 and reaches 79 °F at minute 80 (stage 1
// by minute 91) and 40 °F at minute 300 (stage 2 by minute 80 + 300 = 380): met, on time.

/**
 * Ten hours after a cool began, the cook types its paper log in: the cook, then the chill at
 * 130 °F (minute 1) and 100 °F (minute 30), each answer asserted free of any deviation. Returns
 * the server, its clock, the cook and the lot.
 */
async function typedLate(t: Parameters<typeof startProcessServer>[0]) {
  const { server, clock } = await startProcessServer(t);
  const tobin = await server.signIn('tobin');
  const lot = await recordControlled(tobin);
  clock.set(new Date(at(600)));
  for (const [control, value, minute] of [
    ['cook', '160 °F', 0],
    ['chill', '130 °F', 1],
    // Cooling: stage 1's deadline (minute 91) passed long ago, but no reading says it was missed.
    ['chill', '100 °F', 30],
  ] as const) {
    const answer = await reading(tobin, lot, control, value, at(minute));
    assert.equal(answer.deviation, null, `not missed on a reading taken at minute ${minute}`);
  }
  return { server, clock, tobin, lot };
}

describe('readings taken on time and entered after the deadline', () => {
  it('should judge each by the time it was taken, and close a deadline deviation the readings show was met', async (t) => {
    const { server, clock, tobin, lot } = await typedLate(t);

    // The deadline scan comes by between two entries: on the record so far, stage 1 is missed.
    const scanned = await scan(server, clock);
    assert.equal(scanned.opened.filter((o) => o.lotCode === lot).length, 1);
    const [opened] = (await processOf(server, lot)).deviations;
    assert.equal(opened!.kind, 'deadline');
    assert.equal((await processOf(server, lot)).onHold, true);

    // The next line of the log: 79 °F at minute 80, stage 1 reached in time.
    const reached = await reading(tobin, lot, 'chill', '79 °F', at(80));
    assert.equal(reached.deviation, null, 'stage 2 is not missed either: its deadline is later');
    const done = await reading(tobin, lot, 'chill', '40 °F', at(300));
    assert.equal(done.deviation, null);
    assert.equal(done.state.status, 'met');

    // The deviation opened on the unfinished record stays on it, closed with the reason.
    const record = await processOf(server, lot);
    assert.equal(record.deviations.length, 1);
    const closed = record.deviations[0]!;
    assert.equal(closed.id, opened!.id);
    assert.equal(closed.what, opened!.what, 'kept as it was opened');
    assert.equal(closed.action?.disposition, 'unaffected');
    assert.equal(closed.action?.by, null, 'closed by the server, not by a person');
    assert.match(closed.action!.cause, /taken before the deadline/);
    assert.match(closed.action!.cause, /entered after it/);
    assert.match(
      closed.action!.restored,
      /show stage 1 of Chilling after the smoke reached by its deadline/,
    );
    assert.equal(record.onHold, false);
    assert.equal(record.nonconforming, false, 'no critical limit was missed');
    const audit = await server.as('rosa').get('/api/audit?action=corrective-action');
    const event = audit.json.events.find(
      (e: { subject: string }) => e.subject === lot.toUpperCase() || e.subject === lot,
    );
    assert.equal(event.actorId, null, 'recorded by the server');
    assert.equal(event.detail.disposition, 'unaffected');
  });

  it('should keep a deadline deviation open when the readings entered late show the stage was missed', async (t) => {
    const { server, clock, tobin, lot } = await typedLate(t);
    assert.equal((await scan(server, clock)).opened.filter((o) => o.lotCode === lot).length, 1);
    // 79 °F only at minute 120: stage 1 (by minute 91) was missed indeed.
    const late = await reading(tobin, lot, 'chill', '79 °F', at(120));
    assert.equal(late.state.status, 'missed');
    const record = await processOf(server, lot);
    assert.deepEqual(
      record.deviations.map((d) => [d.kind, d.action]),
      [['deadline', null]],
    );
    assert.equal(record.onHold, true);
    assert.equal(record.nonconforming, true);
  });

  it('should open the deadline miss a reading taken after the deadline shows', async (t) => {
    const { tobin, lot } = await typedLate(t);
    // Still 90 °F at minute 100, past stage 1's deadline: the reading itself shows the miss.
    const warm = await reading(tobin, lot, 'chill', '90 °F', at(100));
    assert.equal(warm.deviation?.kind, 'deadline');
  });
});
