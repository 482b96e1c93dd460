import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { BELLY } from '../helpers/api-calls.ts';
import {
  call,
  dataQuery,
  databaseLocationOf,
  integrityCheck,
  makeDataDir,
  signIn,
  startServerProcess,
  type Answer,
} from './server-process.ts';

/** Records in flight at once: far more than the server finishes before the kill. */
const BURST = 60;
/** The kill comes once this many records were answered 201, so it lands mid-burst. */
const KILL_AFTER = 8;

/** A batch as recorded, without its event list (the single-batch read adds it). */
function withoutEvents(batch: Record<string, unknown>): Record<string, unknown> {
  const { events: _events, ...rest } = batch;
  return rest;
}

describe('the server killed in the middle of a burst of records', () => {
  it('should come back with an intact database holding every batch it answered 201, complete', async (t) => {
    const data = makeDataDir(t);
    const first = await startServerProcess(t, data);
    // A session, not HTTP Basic: a password check per request would pace the burst, not the writes.
    const tobin = await signIn(first.url, 'tobin');

    // Every record is the same belly with its own note, so each answer names its own request.
    const created: Answer[] = [];
    let killing: Promise<void> | undefined;
    const burst = Array.from({ length: BURST }, (_, i) =>
      call(first.url, tobin, 'POST', '/api/batches', { ...BELLY, notes: `burst ${i}` }).then(
        (answer) => {
          if (answer.status === 201) created.push(answer);
          else assert.fail(`record ${i} answered ${answer.status} before the kill: ${answer.text}`);
          if (created.length === KILL_AFTER) killing = first.kill();
        },
        // A request cut off by the kill has no answer: the server promised nothing.
        () => undefined,
      ),
    );
    await Promise.all(burst);
    await killing;
    assert.equal(first.child.signalCode, 'SIGKILL');
    const answered = created.length;
    assert.ok(answered >= KILL_AFTER, `${answered} records answered 201`);
    assert.ok(answered < BURST, 'the kill must land before the burst has finished');

    // The next start recovers the write-ahead log on the same file (on PostgreSQL, the same
    // database: the server process died, not the database).
    const second = await startServerProcess(t, data);
    for (const answer of created) {
      const lot = answer.json.batch.lotCode as string;
      const read = await call(second.url, 'imke', 'GET', `/api/batches/${lot}`);
      assert.equal(read.status, 200, `${lot}: ${read.text}`);
      // The same batch to the last digit: inputs, result with every quantity, status, notes.
      assert.deepEqual(withoutEvents(read.json.batch), withoutEvents(answer.json.batch), lot);
      assert.ok(
        read.json.batch.events.some((event: { type: string }) => event.type === 'recorded'),
        `${lot} has its recorded event`,
      );
    }
    await second.stop();

    assert.equal(await integrityCheck(databaseLocationOf(data)), 'ok');
    // Nothing half-written: each burst batch has its one recorded event and its audit entry.
    // The counts as integers: PostgreSQL's COUNT is a bigint, which pg gives as text.
    const rows = await dataQuery<{
      lot_code: string;
      events: number;
      audits: number;
      result: string;
    }>(
      data,
      `SELECT b.lot_code, b.result,
         CAST((SELECT COUNT(*) FROM batch_events e WHERE e.batch_id = b.id AND e.type = 'recorded') AS INTEGER) AS events,
         CAST((SELECT COUNT(*) FROM audit_events a WHERE a.subject = b.lot_code) AS INTEGER) AS audits
       FROM batches b WHERE b.notes LIKE 'burst %'`,
    );
    assert.ok(rows.length >= answered, `${rows.length} burst batches stored`);
    for (const row of rows) {
      assert.equal(row.events, 1, `${row.lot_code}: recorded events`);
      assert.ok(row.audits >= 1, `${row.lot_code}: audit entries`);
      assert.doesNotThrow(() => JSON.parse(row.result), `${row.lot_code}: result`);
    }
    t.diagnostic(`${answered} answered 201 of ${BURST}; ${rows.length} stored`);
    assert.equal(new Set(rows.map((row) => row.lot_code)).size, rows.length, 'lot codes repeat');
  });
});
