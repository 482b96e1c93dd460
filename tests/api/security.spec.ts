// Security checks bad-requests-security.spec.ts, role-matrix-session.spec.ts, bad-requests.spec.ts
// and session-people.spec.ts do not make yet: Basic sign-in throttling, CSRF and body limits on
// the plan, reminder and invitation routes, upload names that point elsewhere, response headers.
import assert from 'node:assert/strict';
import { existsSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { before, describe, it } from 'node:test';
import { QueryTypes } from 'sequelize';
import {
  BELLY,
  cookieSession,
  send,
  snapshot,
  suiteServer,
  type CookieSession,
  type Snapshot,
} from '../helpers/api-calls.ts';
import { makeFixture, type Fixture } from '../helpers/api-routes.ts';
import { EXTRA_ROUTES } from '../helpers/extra-routes.ts';
import { PASSWORDS, startTestServer, type TestServer } from '../helpers/test-server.ts';

const basic = (user: string, password: string): Record<string, string> => ({
  authorization: `Basic ${Buffer.from(`${user}:${password}`).toString('base64')}`,
});

/** snapshot() with the tables of mail, invitations and reminders as well. */
async function stored(server: TestServer): Promise<Snapshot & { more: Record<string, number> }> {
  const more: Record<string, number> = {};
  for (const table of ['outbox', 'invitations', 'reminder_prefs']) {
    const [row] = await server.context.db.sequelize.query<{ n: number }>(
      `SELECT COUNT(*) AS n FROM ${table}`,
      { type: QueryTypes.SELECT },
    );
    more[table] = row.n;
  }
  return { ...(await snapshot(server)), more };
}

describe('password guessing over HTTP Basic and the form', () => {
  it('should answer 429 after LARDER_SIGN_IN_LIMIT wrong Basic passwords, even to the right one, and leave sessions alone', async (t) => {
    const server = await startTestServer(t, { LARDER_SIGN_IN_LIMIT: '3' });
    const read = (headers: Record<string, string>) =>
      fetch(`${server.url}/api/batches?limit=1`, { headers });
    const session = await cookieSession(server, 'tobin');
    // Only failures count: a script signing every request correctly is never held up.
    for (let i = 0; i < 6; i++)
      assert.equal((await read(basic('rosa', PASSWORDS.rosa))).status, 200, `right password ${i}`);

    const wrong: number[] = [];
    for (let i = 0; i < 5; i++) wrong.push((await read(basic('rosa', `guess-${i}`))).status);
    assert.deepEqual(wrong, [401, 401, 401, 429, 429]);
    const right = await read(basic('rosa', PASSWORDS.rosa));
    assert.equal(right.status, 429, 'a right guess must not be told apart while throttled');
    assert.equal(
      ((await right.json()) as { error: { code: string } }).error.code,
      'too-many-attempts',
    );
    const retry = Number(right.headers.get('retry-after'));
    assert.ok(retry > 0 && retry <= 15 * 60, `Retry-After ${retry}`);
    // Another person's password from the same address is refused too: it is the address that waits.
    assert.equal((await read(basic('imke', PASSWORDS.imke))).status, 429);
    // Signing in is what is limited; a session signed in before goes on.
    assert.equal((await read({ cookie: session.cookie })).status, 200);
  });

  it('should refuse the right password on the form too once the address is throttled', async (t) => {
    const server = await startTestServer(t, { LARDER_SIGN_IN_LIMIT: '2' });
    const signIn = (password: string) =>
      send(server, 'anonymous', {
        method: 'POST',
        path: '/api/session',
        body: { username: 'rosa', password },
      });
    assert.equal((await signIn('guess-1')).status, 401);
    assert.equal((await signIn('guess-2')).status, 401);
    const right = await signIn(PASSWORDS.rosa);
    assert.equal(right.status, 429, right.text);
    assert.equal(right.headers.get('set-cookie'), null, 'no session for a throttled sign-in');
  });
});

describe('CSRF and body limits on the routes of plans, reminders and invitations', () => {
  const server = suiteServer();
  let fx: Fixture;
  let admin: CookieSession;
  before(async () => {
    fx = await makeFixture(server());
    admin = await cookieSession(server(), 'rosa');
  });

  // An invitation link needs no session, so it has no CSRF token to show: the token is the proof.
  const changes = EXTRA_ROUTES.filter(
    (route) => route.method !== 'GET' && route.anonymous === undefined,
  );
  for (const route of changes) {
    it(`should refuse ${route.method} ${route.route} from a session without X-CSRF-Token with 403 csrf, storing nothing`, async () => {
      const call = await route.prepare(fx, 'admin');
      const before = await stored(server());
      const refused = await send(server(), admin, call, { csrf: false });
      assert.equal(refused.status, 403, refused.text);
      assert.equal(refused.json.error.code, 'csrf');
      const forged = await send(server(), { ...admin, csrfToken: 'forged' }, call);
      assert.equal(forged.status, 403, forged.text);
      assert.deepEqual(await stored(server()), before);
      const allowed = await send(server(), admin, call);
      assert.ok(allowed.status < 300, `${allowed.status} ${allowed.text.slice(0, 300)}`);
    });
  }

  for (const route of EXTRA_ROUTES.filter((r) => r.method !== 'GET')) {
    it(`should refuse a 2 MB body to ${route.method} ${route.route} with 413 too-large, storing nothing`, async () => {
      const call = await route.prepare(fx, 'admin');
      const body = { ...(call.body as object), padding: 'x'.repeat(2 * 1024 * 1024) };
      const before = await stored(server());
      const sender = route.anonymous === undefined ? admin : 'anonymous';
      const response = await send(server(), sender, { ...call, body });
      assert.equal(response.status, 413, response.text.slice(0, 300));
      assert.equal(response.json.error.code, 'too-large');
      assert.deepEqual(await stored(server()), before);
    });
  }
});

describe('text holding a NUL character', () => {
  const server = suiteServer();

  // SQLite reads a statement up to its first NUL: such text used to end in a 500.
  it('should be refused with 400 naming the field, storing nothing', async () => {
    const rosa = await cookieSession(server(), 'rosa');
    const recorded = await send(server(), rosa, {
      method: 'POST',
      path: '/api/batches',
      body: BELLY,
    });
    assert.equal(recorded.status, 201, recorded.text);
    const lot = recorded.json.batch.lotCode as string;
    const calls = [
      { path: '/api/batches', body: { ...BELLY, notes: 'rind\u0000on' }, field: 'notes' },
      {
        path: `/api/batches/${lot}/status`,
        body: { to: 'discarded', reason: 'dropped\u0000' },
        field: 'reason',
      },
      {
        path: '/api/people',
        body: { username: 'wren', displayName: 'Wren\u0000', role: 'cook' },
        field: 'displayName',
      },
      {
        path: '/api/calc',
        body: { formula: 'brisket-rub', batch: { base: '1\u0000kg' } },
        field: 'batch.base',
      },
    ];
    for (const { path: route, body, field } of calls) {
      const before = await stored(server());
      const response = await send(server(), rosa, { method: 'POST', path: route, body });
      assert.equal(response.status, 400, `${route}: ${response.text}`);
      assert.equal(response.json.error.code, 'bad-request');
      assert.equal(
        response.json.error.message,
        `${field} holds a NUL character (U+0000); delete it`,
      );
      assert.deepEqual(await stored(server()), before, route);
    }
    const signIn = await send(server(), 'anonymous', {
      method: 'POST',
      path: '/api/session',
      body: { username: 'rosa\u0000', password: PASSWORDS.rosa },
    });
    assert.equal(signIn.status, 400, signIn.text);
  });
});

describe('uploads whose file name points elsewhere', () => {
  const server = suiteServer();
  const names = [
    '../../escape-up.yaml',
    '..\\..\\escape-back.yaml',
    `${tmpdir()}/escape-absolute.yaml`,
    'nested/dir/escape-nested.yaml',
  ];
  it('should store each under the id inside the file, in the formulas folder, and nowhere else', async () => {
    const outside = readdirSync(server().dir).sort();
    const parent = readdirSync(path.dirname(server().dir)).filter((n) => n.startsWith('escape'));
    for (const [i, name] of names.entries()) {
      const id = `upload-name-${i}`;
      const form = new FormData();
      const yaml = `formula: 1\nid: ${id}\ntitle: Upload name ${i}\nkind: mix\ningredients:\n  - { name: salt, pct: 100, base: true }\n`;
      form.append('file', new Blob([yaml]), name);
      const response = await send(server(), 'rosa', {
        method: 'POST',
        path: '/api/formulas/upload',
        body: form,
      });
      assert.equal(response.status, 201, `${name}: ${response.text}`);
      assert.equal(response.json.file, `${id}.yaml`);
      assert.ok(existsSync(path.join(server().formulasDir, `${id}.yaml`)));
    }
    const files = readdirSync(server().formulasDir);
    assert.ok(
      files.every((file) => !file.startsWith('escape')),
      files.join(', '),
    );
    assert.ok(!existsSync(path.join(server().formulasDir, 'nested')));
    assert.deepEqual(readdirSync(server().dir).sort(), outside);
    assert.deepEqual(
      readdirSync(path.dirname(server().dir)).filter((n) => n.startsWith('escape')),
      parent,
    );
    assert.ok(!existsSync(path.join(tmpdir(), 'escape-absolute.yaml')));
  });
});

describe('headers that keep stored text from running as a page', () => {
  const server = suiteServer();

  /** The policy helmet sends with every response (server/app.ts). */
  function assertPolicy(headers: Headers, what: string): void {
    const csp = headers.get('content-security-policy') ?? '';
    const directives = new Map(
      csp.split(';').map((part) => {
        const [name, ...values] = part.trim().split(/\s+/);
        return [name, values] as const;
      }),
    );
    assert.deepEqual(directives.get('default-src'), ["'self'"], `${what}: ${csp}`);
    assert.deepEqual(directives.get('script-src'), ["'self'"], `${what}: ${csp}`);
    assert.deepEqual(directives.get('object-src'), ["'none'"], `${what}: ${csp}`);
    assert.deepEqual(directives.get('frame-ancestors'), ["'none'"], `${what}: ${csp}`);
    assert.deepEqual(directives.get('base-uri'), ["'self'"], `${what}: ${csp}`);
    assert.equal(headers.get('x-content-type-options'), 'nosniff', what);
    assert.equal(headers.get('x-powered-by'), null, what);
  }

  it('should send the policy and a JSON type with API answers, errors included', async () => {
    const calls = [
      { method: 'GET', path: '/api/formulas/house-sauce' },
      { method: 'GET', path: '/api/formulas/no-such-formula' },
      { method: 'POST', path: '/api/calc', body: '{"broken": ' },
      { method: 'GET', path: '/api/no-such-route' },
    ];
    for (const call of calls) {
      const response = await send(server(), 'imke', call);
      const what = `${call.method} ${call.path}`;
      assert.equal(response.headers.get('content-type'), 'application/json; charset=utf-8', what);
      assertPolicy(response.headers, what);
    }
    const anonymous = await fetch(`${server().url}/api/batches`);
    assert.equal(anonymous.status, 401);
    assertPolicy(anonymous.headers, 'a refused anonymous call');
  });

  it('should send exports and sheets as attachments, and the console page with the policy', async () => {
    const csv = await send(server(), 'imke', { method: 'GET', path: '/api/batches.csv?kind=cure' });
    assert.equal(csv.status, 200);
    assert.match(csv.headers.get('content-disposition') ?? '', /^attachment; filename="/);
    assertPolicy(csv.headers, 'the CSV export');
    const page = await fetch(`${server().url}/batches/some-lot`);
    assertPolicy(page.headers, 'a console page');
  });
});
