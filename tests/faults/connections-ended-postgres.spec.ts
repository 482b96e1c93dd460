import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { BELLY } from '../helpers/api-calls.ts';
import { endPostgresConnections, testPostgresUrl } from '../helpers/test-database.ts';
import {
  call,
  databaseLocationOf,
  integrityCheck,
  makeDataDir,
  signIn,
  startServerProcess,
  type Answer,
  type ServerProcess,
} from './server-process.ts';

/** Records and reads in flight at once. */
const BURST = 40;
/** The connections are ended once this many records were answered 201: mid-burst. */
const END_AFTER = 6;
/** Longer than any request may take on a busy machine: past it, the request hangs. */
const HANG_MS = 60_000;

/**
 * One request, failing the test when it has no answer within HANG_MS. A request the server
 * never answered says why the client gave up and what the server printed, so that a failure on
 * a machine of CI's can be read from its log.
 */
async function answered(
  server: ServerProcess,
  request: Promise<Answer>,
  what: string,
): Promise<Answer> {
  let timer: NodeJS.Timeout | undefined;
  const hang = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error(`${what}: no answer in ${HANG_MS} ms`)), HANG_MS);
  });
  try {
    return await Promise.race([request, hang]);
  } catch (error) {
    const cause = error instanceof Error && error.cause instanceof Error ? error.cause : undefined;
    const state =
      server.child.exitCode === null && server.child.signalCode === null
        ? 'the server is still running'
        : `the server ended (${String(server.child.exitCode ?? server.child.signalCode)})`;
    throw new Error(
      `${what}: ${String(error)}${cause ? ` (${String(cause)})` : ''}; ${state}; it printed:\n` +
        server.output().slice(-4000),
      { cause: error },
    );
  } finally {
    clearTimeout(timer);
  }
}

/** An answer is either done (2xx) or a 503 that says the database could not be used. */
function assertDoneOrClear503(answer: Answer, what: string): void {
  if (answer.status >= 200 && answer.status < 300) return;
  assert.equal(answer.status, 503, `${what}: ${answer.status} ${answer.text}`);
  assert.match(answer.json?.error?.code ?? '', /^database-/, `${what}: ${answer.text}`);
  assert.match(answer.json.error.message, /nothing was saved/, what);
}

// Only PostgreSQL has connections to lose: a SQLite file is opened in the server's own process.
if (testPostgresUrl())
  describe('PostgreSQL ending the server’s connections mid-burst (a restart, a network cut)', () => {
    it('should answer every request 2xx or a clear 503, lose nothing it answered 201, and serve again at once', async (t) => {
      const data = makeDataDir(t);
      const server = await startServerProcess(t, data);
      const location = databaseLocationOf(data);
      const tobin = await signIn(server.url, 'tobin');

      const created: Answer[] = [];
      const refused: string[] = [];
      let ending: Promise<number> | undefined;
      const records = Array.from({ length: BURST }, async (_, i) => {
        const what = `record ${i}`;
        const answer = await answered(
          server,
          call(server.url, tobin, 'POST', '/api/batches', { ...BELLY, notes: `burst ${i}` }),
          what,
        );
        assertDoneOrClear503(answer, what);
        if (answer.status === 201) created.push(answer);
        else refused.push(answer.json.error.code as string);
        if (created.length === END_AFTER) ending ??= endPostgresConnections(location);
      });
      const reads = Array.from({ length: BURST }, async (_, i) => {
        const what = `read ${i}`;
        const answer = await answered(
          server,
          call(server.url, tobin, 'GET', '/api/batches?limit=5'),
          what,
        );
        assertDoneOrClear503(answer, what);
        if (answer.status !== 200) refused.push(answer.json.error.code as string);
      });
      await Promise.all([...records, ...reads]);
      const ended = await ending;
      assert.ok(ended !== undefined && ended > 0, 'connections were ended mid-burst');
      t.diagnostic(
        `${ended} connections ended; ${created.length} of ${BURST} records answered 201; ` +
          `503s: ${refused.join(', ') || 'none'}`,
      );

      // The same process, no restart: its pool has let the ended connections go.
      const next = await answered(
        server,
        call(server.url, tobin, 'POST', '/api/batches', { ...BELLY, notes: 'after' }),
        'record after',
      );
      assert.equal(next.status, 201, next.text);
      for (const answer of created) {
        const lot = answer.json.batch.lotCode as string;
        const read = await call(server.url, 'imke', 'GET', `/api/batches/${lot}`);
        assert.equal(read.status, 200, `${lot}: ${read.text}`);
        assert.deepEqual(read.json.batch.result, answer.json.batch.result, lot);
        assert.equal(read.json.batch.notes, answer.json.batch.notes, lot);
      }
      const all = await call(server.url, 'imke', 'GET', '/api/batches?limit=200');
      assert.equal(all.status, 200, all.text);
      const lots = (all.json.items as { lotCode: string }[]).map((batch) => batch.lotCode);
      assert.equal(new Set(lots).size, lots.length, 'lot codes repeat');
      assert.doesNotMatch(server.output(), /something went wrong|Unhandled|uncaught/i);
      await server.stop();
      assert.equal(await integrityCheck(location), 'ok');
    });
  });
