import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import {
  BELLY,
  cookieSession,
  send,
  snapshot,
  type Call,
  type CookieSession,
} from '../helpers/api-calls.ts';
import { PASSWORDS, startTestServer, type ApiResponse } from '../helpers/test-server.ts';
import { holdWriteLock } from './lock-holder.ts';
import { databaseLocation } from '../../server/config.ts';
import { integrityCheck } from './server-process.ts';

/** How long a write waits for the lock in these tests (LARDER_BUSY_TIMEOUT_MS; 10 s by default). */
const BUSY_MS = 400;

/** The writes tried while the lock is held: a record, a move, a person, a preference, a sign-in. */
function writes(lot: string): Call[] {
  return [
    { method: 'POST', path: '/api/batches', body: { ...BELLY, notes: 'while locked' } },
    { method: 'POST', path: `/api/batches/${lot}/status`, body: { to: 'curing' } },
    {
      method: 'POST',
      path: '/api/people',
      body: { username: 'wren', displayName: 'Wren', role: 'cook', password: 'long-enough-1' },
    },
    {
      method: 'PUT',
      path: '/api/people/me/reminders',
      body: { flip: false, ready: true, overdue: false },
    },
  ];
}

function assertBusy(response: ApiResponse, what: string): void {
  assert.equal(response.status, 503, `${what}: ${response.status} ${response.text}`);
  assert.equal(response.json?.error?.code, 'database-busy', what);
  assert.match(response.json.error.message, /locked by another program/, what);
  assert.match(response.json.error.message, /nothing was saved/, what);
  assert.equal(response.headers.get('retry-after'), '5', what);
}

describe('another program holding the database write lock', () => {
  it('should answer writes 503 database-busy soon after the busy timeout, keep reads working and store nothing', async (t) => {
    const server = await startTestServer(t, { LARDER_BUSY_TIMEOUT_MS: String(BUSY_MS) });
    const rosa = await cookieSession(server, 'rosa');
    const recorded = await send(server, rosa, {
      method: 'POST',
      path: '/api/batches',
      body: BELLY,
    });
    assert.equal(recorded.status, 201, recorded.text);
    const lot = recorded.json.batch.lotCode as string;
    // The list records each file's revision the first time it is seen (a write); then a restart,
    // so that nothing about the formulas is remembered in memory when the lock is taken.
    assert.equal((await send(server, rosa, { method: 'GET', path: '/api/formulas' })).status, 200);
    await server.restart();
    const admin: CookieSession = await cookieSession(server, 'rosa');
    const before = await snapshot(server);

    const holder = await holdWriteLock(t, databaseLocation(server.context.config));
    const started = Date.now();
    const refused = await Promise.all(writes(lot).map((call) => send(server, admin, call)));
    const signIn = await send(server, 'anonymous', {
      method: 'POST',
      path: '/api/session',
      body: { username: 'tobin', password: PASSWORDS.tobin },
    });
    const waited = Date.now() - started;
    writes(lot).forEach((call, i) => assertBusy(refused[i], `${call.method} ${call.path}`));
    assertBusy(signIn, 'POST /api/session');
    // One after another, each waits about the busy timeout (2 s for all five): not the 45 busy
    // timeouts a write once waited through Sequelize's and our own retries (some 90 s here).
    assert.ok(waited < 15_000, `the writes took ${waited} ms to be answered`);

    // Reads go on from the last committed state (WAL): the log, one batch, formulas, a calculation.
    const reads: Call[] = [
      { method: 'GET', path: '/api/batches?limit=5' },
      { method: 'GET', path: `/api/batches/${lot}` },
      { method: 'GET', path: '/api/formulas' },
      { method: 'GET', path: '/api/formulas/pit-bun' },
      {
        method: 'POST',
        path: '/api/calc',
        body: { formula: 'brisket-rub', batch: { base: '1kg' } },
      },
      { method: 'GET', path: '/api/audit?limit=5' },
    ];
    for (const call of reads) {
      const response = await send(server, admin, call);
      assert.equal(response.status, 200, `${call.method} ${call.path}: ${response.text}`);
    }
    const batch = await send(server, admin, { method: 'GET', path: `/api/batches/${lot}` });
    assert.equal(batch.json.batch.status, 'in-progress');
    assert.deepEqual(await snapshot(server), before, 'a refused write left something behind');

    await holder.release();
    // The same writes go through once the lock is gone: the refusals were the lock's.
    for (const call of writes(lot)) {
      const response = await send(server, admin, call);
      assert.ok(response.status < 300, `${call.method} ${call.path}: ${response.text}`);
    }
    const moved = await send(server, admin, { method: 'GET', path: `/api/batches/${lot}` });
    assert.equal(moved.json.batch.status, 'curing');
    assert.equal(await integrityCheck(databaseLocation(server.context.config)), 'ok');
  });

  it('should wait for a lock held shorter than the busy timeout, and then store the write', async (t) => {
    const server = await startTestServer(t, { LARDER_BUSY_TIMEOUT_MS: '5000' });
    const admin = await cookieSession(server, 'rosa');
    const holder = await holdWriteLock(t, databaseLocation(server.context.config));
    const started = Date.now();
    const pending = send(server, admin, { method: 'POST', path: '/api/batches', body: BELLY });
    setTimeout(() => void holder.release(), 600);
    const response = await pending;
    assert.equal(response.status, 201, response.text);
    assert.ok(Date.now() - started >= 550, 'the write must have waited for the lock');
    const read = await send(server, admin, {
      method: 'GET',
      path: `/api/batches/${response.json.batch.lotCode}`,
    });
    assert.equal(read.status, 200);
  });
});
