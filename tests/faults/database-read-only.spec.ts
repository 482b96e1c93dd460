import assert from 'node:assert/strict';
import { chmodSync } from 'node:fs';
import { describe, it } from 'node:test';
import { BELLY } from '../helpers/api-calls.ts';
import { openDatabase } from '../../server/db/database.ts';
import { PASSWORDS } from '../helpers/test-server.ts';
import {
  NOBODY,
  call,
  chownTree,
  databaseOf,
  integrityCheck,
  makeDataDir,
  query,
  startServerProcess,
  type Answer,
  type RunAs,
} from './server-process.ts';

/**
 * Who the server runs as. File modes do not stop root (CI often runs as root), so root runs the
 * server as nobody, for whom a mode of 0444 means what it says; anyone else runs it as themself.
 */
const SERVER_USER: RunAs | undefined = process.getuid?.() === 0 ? NOBODY : undefined;

/** What the log holds, read through the API: batches, audit entries, people. */
async function stored(url: string): Promise<{ batches: number; audit: number; people: number }> {
  const batches = await call(url, 'rosa', 'GET', '/api/batches?limit=1');
  const audit = await call(url, 'rosa', 'GET', '/api/audit?limit=1');
  const people = await call(url, 'rosa', 'GET', '/api/people');
  assert.equal(batches.status, 200, batches.text);
  return {
    batches: batches.json.total as number,
    audit: audit.json.events[0].id as number,
    people: people.json.people.length as number,
  };
}

function assertReadOnly(answer: Answer, what: string): void {
  assert.equal(answer.status, 503, `${what}: ${answer.status} ${answer.text}`);
  assert.equal(answer.json?.error?.code, 'database-read-only', what);
  assert.match(answer.json.error.message, /read-only/, what);
  assert.match(answer.json.error.message, /nothing was saved/, what);
}

describe('a read-only database file', () => {
  it('should serve reads and refuse every write with 503 database-read-only, storing nothing', async (t) => {
    const data = makeDataDir(t, SERVER_USER);
    const file = databaseOf(data);
    const first = await startServerProcess(t, data, { as: SERVER_USER });
    const recorded = await call(first.url, 'tobin', 'POST', '/api/batches', BELLY);
    assert.equal(recorded.status, 201, recorded.text);
    const lot = recorded.json.batch.lotCode as string;
    // Seen once, each formula's revision is on record: reading formulas needs no write later.
    assert.equal((await call(first.url, 'rosa', 'GET', '/api/formulas')).status, 200);
    const before = await stored(first.url);
    await first.stop();

    // As after restoring a backup with the wrong mode: the file read-only, its folder not.
    chmodSync(file, 0o444);
    const readOnly = await startServerProcess(t, data, { as: SERVER_USER });
    const { url } = readOnly;
    assertReadOnly(await call(url, 'tobin', 'POST', '/api/batches', BELLY), 'record');
    assertReadOnly(
      await call(url, 'tobin', 'POST', `/api/batches/${lot}/status`, { to: 'curing' }),
      'status move',
    );
    assertReadOnly(
      await call(url, 'rosa', 'POST', '/api/people', {
        username: 'wren',
        displayName: 'Wren',
        role: 'cook',
        password: 'long-enough-1',
      }),
      'add a person',
    );
    const signIn = await fetch(`${url}/api/session`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ username: 'imke', password: PASSWORDS.imke }),
    });
    assertReadOnly(
      { status: signIn.status, text: '', json: await signIn.json() },
      'sign-in (a session is a write)',
    );
    // Whatever cookie came with the refusal, no session was stored for it.
    const cookie = (signIn.headers.get('set-cookie') ?? '').split(';')[0];
    if (cookie) {
      const who = await fetch(`${url}/api/session`, { headers: { cookie } });
      const body = (await who.json()) as { person: unknown };
      assert.equal(body.person, null, 'a refused sign-in must not sign anyone in');
    }

    const batch = await call(url, 'imke', 'GET', `/api/batches/${lot}`);
    assert.equal(batch.status, 200, batch.text);
    assert.deepEqual(batch.json.batch.result, recorded.json.batch.result);
    assert.equal(batch.json.batch.status, 'in-progress');
    assert.equal((await call(url, 'imke', 'GET', '/api/formulas/pit-bun')).status, 200);
    const calc = await call(url, 'imke', 'POST', '/api/calc', {
      formula: 'brisket-rub',
      batch: { base: '1kg' },
    });
    assert.equal(calc.status, 200, calc.text);
    assert.deepEqual(await stored(url), before);
    assert.match(readOnly.output(), /SQLITE_READONLY/, 'the server log says why');
    await readOnly.stop();

    // Straight from the file: not a row more than before, and not a damaged page.
    const [after] = await query<{ batches: number; audit: number; people: number }>(
      file,
      `SELECT (SELECT COUNT(*) FROM batches) AS batches, (SELECT MAX(id) FROM audit_events) AS audit,
         (SELECT COUNT(*) FROM people) AS people`,
    );
    assert.deepEqual({ ...after }, before, 'a refused write left something behind');
    assert.equal(await integrityCheck(file), 'ok');
  });

  it('should refuse to start, naming the file, when neither the file nor its folder can be written', async (t) => {
    const data = makeDataDir(t);
    const file = databaseOf(data);
    // A database with every table, made here rather than by a first start of the server.
    await (await openDatabase(file)).close();
    if (SERVER_USER) chownTree(data, SERVER_USER);
    chmodSync(file, 0o444);
    chmodSync(data, 0o555);
    await assert.rejects(startServerProcess(t, data, { as: SERVER_USER }), (error: Error) => {
      assert.match(error.message, /exited \(1\) before listening/);
      assert.ok(error.message.includes(`cannot open the database ${file}`), error.message);
      assert.match(error.message, /SQLITE_READONLY|SQLITE_CANTOPEN/);
      return true;
    });
    chmodSync(data, 0o755);
  });
});
