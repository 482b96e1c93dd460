import assert from 'node:assert/strict';
import { chmodSync, existsSync } from 'node:fs';
import { describe, it } from 'node:test';
import { BELLY } from '../helpers/api-calls.ts';
import { openDatabase } from '../../server/db/database.ts';
import { PASSWORDS } from '../helpers/test-server.ts';
import { setPostgresReadOnly, testPostgresUrl } from '../helpers/test-database.ts';
import {
  NOBODY,
  call,
  chownTree,
  databaseLocationOf,
  databaseOf,
  dataQuery,
  integrityCheck,
  makeDataDir,
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

/** Whether the suites run on PostgreSQL (`npm run test:pg`) rather than SQLite files. */
const onPostgres = testPostgresUrl() !== undefined;

/**
 * Takes writes away from a data folder's database, or gives them back: on SQLite the file's mode
 * (as after restoring a backup with the wrong mode: the file read-only, its folder not); on
 * PostgreSQL the database takes no writes, as a hot standby does (25006 to every write).
 */
async function allowWrites(dataDir: string, allowed: boolean): Promise<void> {
  if (onPostgres) await setPostgresReadOnly(databaseLocationOf(dataDir), !allowed);
  else if (!allowed) chmodSync(databaseOf(dataDir), 0o444);
  else
    // SQLite made its -wal and -shm files with the database file's mode: they are put right too.
    for (const suffix of ['', '-wal', '-shm'])
      if (existsSync(databaseOf(dataDir) + suffix)) chmodSync(databaseOf(dataDir) + suffix, 0o644);
}

/** What the server's log must name as the reason: SQLite's code, or PostgreSQL's words. */
const READ_ONLY_IN_LOG = onPostgres ? /read-only transaction/ : /SQLITE_READONLY/;

describe('a read-only database (a file of mode 0444, a PostgreSQL standby)', () => {
  it('should serve reads and refuse every write with 503 database-read-only, storing nothing', async (t) => {
    const data = makeDataDir(t, SERVER_USER);
    const first = await startServerProcess(t, data, { as: SERVER_USER });
    const recorded = await call(first.url, 'tobin', 'POST', '/api/batches', BELLY);
    assert.equal(recorded.status, 201, recorded.text);
    const lot = recorded.json.batch.lotCode as string;
    // Seen once, each formula's revision is on record: reading formulas needs no write later.
    assert.equal((await call(first.url, 'rosa', 'GET', '/api/formulas')).status, 200);
    const before = await stored(first.url);
    await first.stop();

    await allowWrites(data, false);
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
    assert.match(readOnly.output(), READ_ONLY_IN_LOG, 'the server log says why');
    await readOnly.stop();

    // Straight from the database: not a row more than before, and not a damaged page.
    const [after] = await dataQuery<{ batches: number; audit: number; people: number }>(
      data,
      // Cast: PostgreSQL's COUNT is a 64-bit integer, which pg hands over as a string.
      `SELECT CAST((SELECT COUNT(*) FROM batches) AS INTEGER) AS batches,
         CAST((SELECT MAX(id) FROM audit_events) AS INTEGER) AS audit,
         CAST((SELECT COUNT(*) FROM people) AS INTEGER) AS people`,
    );
    assert.deepEqual({ ...after }, before, 'a refused write left something behind');

    // Writes allowed again (PostgreSQL's check installs amcheck first): no damaged page, and the
    // server records as before.
    await allowWrites(data, true);
    assert.equal(await integrityCheck(databaseLocationOf(data)), 'ok');
    const again = await startServerProcess(t, data, { as: SERVER_USER });
    const next = await call(again.url, 'tobin', 'POST', '/api/batches', BELLY);
    assert.equal(next.status, 201, next.text);
    assert.equal((await stored(again.url)).batches, before.batches + 1);
    await again.stop();
  });

  // A PostgreSQL server becomes writable under a running server (a standby promoted); a SQLite
  // file's connection keeps the read-only open it had, so only PostgreSQL has this test.
  if (onPostgres)
    it('should take writes again without a restart once the PostgreSQL database does', async (t) => {
      const data = makeDataDir(t);
      const first = await startServerProcess(t, data);
      await first.stop();
      await allowWrites(data, false);
      const server = await startServerProcess(t, data);
      // Reads on several connections first: each one opened while the database took no writes.
      await Promise.all(
        Array.from({ length: 6 }, () => call(server.url, 'imke', 'GET', '/api/batches?limit=1')),
      );
      assertReadOnly(await call(server.url, 'tobin', 'POST', '/api/batches', BELLY), 'record');
      await allowWrites(data, true);
      const recorded = await call(server.url, 'tobin', 'POST', '/api/batches', BELLY);
      assert.equal(recorded.status, 201, recorded.text);
      const added = await call(server.url, 'rosa', 'POST', '/api/people', {
        username: 'wren',
        displayName: 'Wren',
        role: 'cook',
        password: 'long-enough-1',
      });
      assert.equal(added.status, 201, added.text);
      await server.stop();
    });

  if (onPostgres)
    it('should refuse to start, naming the database, when it has migrations to apply and takes no writes', async (t) => {
      const data = makeDataDir(t);
      // The database exists and is empty: the server's first start would create every table.
      const first = await startServerProcess(t, data);
      await first.stop();
      const location = databaseLocationOf(data);
      await dataQuery(data, 'DROP SCHEMA public CASCADE; CREATE SCHEMA public');
      await allowWrites(data, false);
      await assert.rejects(startServerProcess(t, data), (error: Error) => {
        assert.match(error.message, /exited \(1\) before listening/);
        const where = new URL(location);
        assert.ok(
          error.message.includes(
            `cannot open the database ${where.hostname}:${where.port}${where.pathname}`,
          ),
          error.message,
        );
        assert.match(error.message, /read-only transaction/);
        return true;
      });
    });
  else
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
