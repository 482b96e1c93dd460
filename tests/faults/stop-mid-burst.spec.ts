import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { BELLY } from '../helpers/api-calls.ts';
import {
  call,
  dataQuery,
  makeDataDir,
  signIn,
  startServerProcess,
  type Answer,
} from './server-process.ts';

/** Records in flight at once: far more than the server finishes before the stop. */
const BURST = 40;
/** SIGTERM comes once this many records were answered 201, so it lands mid-burst. */
const STOP_AFTER = 5;

describe('a server of two processes stopped in the middle of a burst of records', () => {
  it('should finish every request it accepted, store exactly what it answered 201, and close cleanly', async (t) => {
    const data = makeDataDir(t);
    const server = await startServerProcess(t, data, { env: { LARDER_PROCESSES: '2' } });
    const tobin = await signIn(server.url, 'tobin');
    const created: Answer[] = [];
    const refused: string[] = [];
    const burst = Array.from({ length: BURST }, (_, i) =>
      call(server.url, tobin, 'POST', '/api/batches', { ...BELLY, notes: `burst ${i}` }).then(
        (answer) => {
          assert.equal(answer.status, 201, `record ${i}: ${answer.text}`);
          created.push(answer);
          if (created.length === STOP_AFTER) server.child.kill('SIGTERM');
        },
        // Refused before it was accepted (the port closed): the server promised nothing.
        (error: Error) =>
          refused.push(String((error.cause as Error | undefined)?.message ?? error)),
      ),
    );
    await Promise.all(burst);
    assert.equal(await server.exited, 0, 'a clean exit');
    assert.ok(created.length >= STOP_AFTER);
    t.diagnostic(`${created.length} answered 201 of ${BURST}; ${refused.length} refused`);
    // A refusal is a connection the server never took; a request cut off once taken would end
    // with the socket closed under it instead.
    for (const reason of refused) assert.match(reason, /ECONNREFUSED/);
    // Nothing acknowledged lost, and nothing stored that no one was told of: no request was cut
    // off between its commit and its answer.
    const stored = await dataQuery<{ lot_code: string }>(
      data,
      "SELECT lot_code FROM batches WHERE notes LIKE 'burst %'",
    );
    assert.deepEqual(
      stored.map((row) => row.lot_code).sort(),
      created.map((answer) => answer.json.batch.lotCode as string).sort(),
    );
    assert.doesNotMatch(
      server.output(),
      /connection manager was closed|SQLITE_MISUSE|Database handle is closed/,
    );
  });
});
