// A session read by a second server process on the same database: signing in on one, then a
// sign-out, a deactivation, a role change or a new password made on the first shows on the
// second's very next request; and a change another program writes straight into the database
// shows on both. On SQLite each process keeps what it read of a session until anything is
// committed (server/auth/session-cache.ts); both processes are warmed up before each change, so
// a kept session that outlived a commit would fail here.
import assert from 'node:assert/strict';
import { spawn } from 'node:child_process';
import path from 'node:path';
import { describe, it } from 'node:test';
import { REPO_ROOT } from '../helpers/run-larder.ts';
import { Sequelize } from 'sequelize';
import {
  PASSWORDS,
  startTestServer,
  type DemoUser,
  type TestServer,
} from '../helpers/test-server.ts';

interface Session {
  cookie: string;
  csrf: string;
}

/** Starts server/main.ts as a process of its own on the test server's data and formulas. */
async function secondProcess(
  t: { after(fn: () => unknown): void },
  dir: string,
  databaseUrl: string | null | undefined,
): Promise<string> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
    cwd: REPO_ROOT,
    env: {
      ...process.env,
      LARDER_MODE: 'demo',
      LARDER_DATA: path.join(dir, 'data'),
      LARDER_FORMULAS: path.join(dir, 'formulas'),
      LARDER_CONSOLE: path.join(dir, 'no-console'),
      LARDER_SIGN_IN_LIMIT: '1000',
      LARDER_PORT: '0',
      // On the PostgreSQL cluster of `npm run test:pg`, the first server's database.
      ...(databaseUrl ? { LARDER_DB_URL: databaseUrl } : {}),
    },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  t.after(async () => {
    const exited = new Promise((resolve) => child.once('exit', resolve));
    child.kill('SIGTERM');
    await exited;
  });
  return new Promise<string>((resolve, reject) => {
    let seen = '';
    child.stdout.on('data', (chunk: Buffer) => {
      seen += chunk.toString();
      const match = /at (http:\/\/[\d.]+:\d+)\//.exec(seen);
      if (match) resolve(match[1]);
    });
    child.once('exit', (code) => reject(new Error(`the second server exited (${code}):\n${seen}`)));
  });
}

/** Runs one statement on a database connection of its own, as another program would. */
async function writeElsewhere(server: TestServer, sql: string): Promise<void> {
  const { databaseUrl, databaseFile } = server.context.config;
  const sequelize = databaseUrl
    ? new Sequelize(databaseUrl, { logging: false })
    : new Sequelize({ dialect: 'sqlite', storage: databaseFile, logging: false });
  try {
    await sequelize.query(sql);
  } finally {
    await sequelize.close();
  }
}

async function signIn(url: string, user: DemoUser): Promise<Session> {
  const response = await fetch(`${url}/api/session`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ username: user, password: PASSWORDS[user] }),
  });
  assert.equal(response.status, 201, `sign-in as ${user}`);
  const body = (await response.json()) as { csrfToken: string };
  return { cookie: (response.headers.get('set-cookie') ?? '').split(';')[0], csrf: body.csrfToken };
}

/** The status of a calculation (any signed-in person) or a people list (admins) with a session. */
async function statusOf(url: string, session: Session, what: 'calc' | 'people'): Promise<number> {
  const headers = { cookie: session.cookie, 'x-csrf-token': session.csrf };
  const response =
    what === 'calc'
      ? await fetch(`${url}/api/calc`, {
          method: 'POST',
          headers: { ...headers, 'content-type': 'application/json' },
          body: JSON.stringify({ formula: 'brisket-rub', batch: { base: '1kg' } }),
        })
      : await fetch(`${url}/api/people`, { headers });
  await response.arrayBuffer();
  return response.status;
}

describe('a session seen by another server process on the same database', () => {
  it('should follow a sign-out, a deactivation, a role change and a new password at once', async (t) => {
    const server = await startTestServer(t);
    const other = await secondProcess(t, server.dir, server.context.config.databaseUrl);
    const people = (await server.as('rosa').get('/api/people')).json.people as {
      id: number;
      username: string;
    }[];
    const idOf = (name: string): number | undefined => people.find((p) => p.username === name)?.id;

    // Signed in on the first process, used on the second; then signed out on the first.
    const leaving = await signIn(server.url, 'tobin');
    assert.equal(await statusOf(other, leaving, 'calc'), 200);
    const out = await fetch(`${server.url}/api/session`, {
      method: 'DELETE',
      headers: { cookie: leaving.cookie, 'x-csrf-token': leaving.csrf },
    });
    assert.equal(out.status, 204);
    assert.equal(await statusOf(other, leaving, 'calc'), 401, 'signed out elsewhere');

    // A reviewer made admin on the first process is an admin on the second at once.
    const reviewer = await signIn(server.url, 'imke');
    assert.equal(await statusOf(other, reviewer, 'people'), 403);
    const promoted = await server
      .as('rosa')
      .request('PATCH', `/api/people/${idOf('imke')}`, { role: 'admin' });
    assert.equal(promoted.status, 200);
    assert.equal(await statusOf(other, reviewer, 'people'), 200, 'made admin elsewhere');

    // A new password set on the first process ends the older session on the second.
    assert.equal(
      (
        await server
          .as('rosa')
          .post(`/api/people/${idOf('imke')}/password`, { password: 'reset-by-admin-1' })
      ).status,
      200,
    );
    assert.equal(await statusOf(other, reviewer, 'calc'), 401, 'password reset elsewhere');

    // A cook deactivated on the first process is refused on the second.
    const cook = await signIn(server.url, 'tobin');
    assert.equal(await statusOf(other, cook, 'calc'), 200);
    const deactivated = await server
      .as('rosa')
      .request('PATCH', `/api/people/${idOf('tobin')}`, { active: false });
    assert.equal(deactivated.status, 200);
    assert.equal(await statusOf(other, cook, 'calc'), 401, 'deactivated elsewhere');

    // An admin made a cook by another program, writing on a connection of its own.
    const admin = await signIn(server.url, 'rosa');
    assert.equal(await statusOf(server.url, admin, 'people'), 200);
    assert.equal(await statusOf(other, admin, 'people'), 200);
    await writeElsewhere(server, "UPDATE people SET role = 'cook' WHERE username = 'rosa'");
    assert.equal(await statusOf(server.url, admin, 'people'), 403, 'changed by another program');
    assert.equal(await statusOf(other, admin, 'people'), 403, 'on both processes');
  });
});
