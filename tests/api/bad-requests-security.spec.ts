import assert from 'node:assert/strict';
import { readdirSync } from 'node:fs';
import { before, describe, it } from 'node:test';
import {
  BELLY,
  cookieSession,
  send,
  snapshot,
  suiteServer,
  type CookieSession,
} from '../helpers/api-calls.ts';
import { tableNames } from '../helpers/table-names.ts';
import { PASSWORDS, type TestServer } from '../helpers/test-server.ts';

/** The tables the server's database holds, by name. */
function tableNamesOf(server: TestServer): Promise<string[]> {
  return tableNames(server.context.db);
}

const SQL = [
  "' OR 1=1 --",
  "x'); DROP TABLE batches;--",
  "done' OR '1'='1",
  '1 OR 1=1',
  '"; DELETE FROM people; --',
];

describe('hostile input: paths, filters, markup', () => {
  const server = suiteServer();
  let rosa: CookieSession;
  before(async () => {
    rosa = await cookieSession(server(), 'rosa');
  });

  it('should refuse formula ids and lot codes that try to leave their folder or table', async () => {
    const before = await snapshot(server());
    const outside = readdirSync(server().dir).sort();
    const revision = '0'.repeat(64);
    const ids = [
      '..%2F..%2Fpackage',
      '%2e%2e%2f%2e%2e%2fpackage',
      '..%5C..%5Cpackage',
      'house-sauce%00',
      'house-sauce.yaml',
    ];
    const lots = ['..%2F..%2Fpackage', '261202-CG-01%2F..', 'a%2Fb', '%2e%2e', '240229-QB-01%00'];
    const calls = [
      ...ids.flatMap((id) => [
        { method: 'GET', path: `/api/formulas/${id}` },
        { method: 'GET', path: `/api/formulas/${id}/revisions/${revision}` },
        { method: 'GET', path: `/api/formulas/${id}/diff?from=${revision}` },
        { method: 'POST', path: `/api/formulas/${id}/preview`, body: { batch: { base: '1kg' } } },
        {
          method: 'PUT',
          path: `/api/formulas/${id}`,
          body: { yaml: 'formula: 1\n', message: 'escape' },
          headers: { 'if-match': `"${revision}"` },
        },
      ]),
      ...lots.flatMap((lot) => [
        { method: 'GET', path: `/api/batches/${lot}` },
        { method: 'POST', path: `/api/batches/${lot}/status`, body: { to: 'done' } },
        { method: 'POST', path: `/api/batches/${lot}/sign-off`, body: {} },
      ]),
      {
        method: 'POST',
        path: '/api/calc',
        body: { formula: '../package', batch: { base: '1kg' } },
      },
      { method: 'POST', path: '/api/batches', body: { ...BELLY, formula: '..%2Fpackage' } },
    ];
    for (const call of calls) {
      const response = await send(server(), rosa, call);
      const what = `${call.method} ${call.path}: ${response.status} ${response.text}`;
      assert.ok([400, 404].includes(response.status), what);
      assert.equal(typeof response.json?.error?.code, 'string', what);
    }
    assert.deepEqual(await snapshot(server()), before);
    assert.deepEqual(readdirSync(server().dir).sort(), outside);
  });

  it('should answer SQL-like filters with 200 and nothing, or 400, and keep every table', async () => {
    const before = await snapshot(server());
    const tables = await tableNamesOf(server());
    const total = (await send(server(), rosa, { method: 'GET', path: '/api/batches?limit=1' })).json
      .total;
    const queries = SQL.flatMap((text) => {
      const value = encodeURIComponent(text);
      return [
        ...['lot', 'formula', 'status', 'kind', 'operator', 'from', 'signedOff', 'sort'].flatMap(
          (key) => [`/api/batches?${key}=${value}`, `/api/batches.csv?${key}=${value}`],
        ),
        `/api/audit?action=${value}`,
        `/api/audit?before=${value}`,
        `/api/formulas?kind=${value}`,
      ];
    });
    for (const path of queries) {
      const response = await send(server(), rosa, { method: 'GET', path });
      const what = `${path}: ${response.status} ${response.text.slice(0, 200)}`;
      assert.ok([200, 400].includes(response.status), what);
      if (response.status === 400) assert.equal(response.json.error.code, 'bad-request', what);
      else if (path.startsWith('/api/batches.csv'))
        assert.equal(response.text.trim().split('\n').length, 1, `${what}: only the header`);
      else {
        const found = response.json.events ?? response.json.items ?? response.json.formulas;
        assert.deepEqual(found, [], `${what}: such a filter must match nothing`);
      }
    }
    assert.deepEqual(await tableNamesOf(server()), tables);
    assert.deepEqual(await snapshot(server()), before);
    const after = await send(server(), rosa, { method: 'GET', path: '/api/batches?limit=1' });
    assert.equal(after.json.total, total);
  });

  it('should store SQL-like text in a body as plain text', async () => {
    const notes = 'Robert\'); DROP TABLE batches;-- and " OR "1"="1';
    const recorded = await send(server(), rosa, {
      method: 'POST',
      path: '/api/batches',
      body: { ...BELLY, notes },
    });
    assert.equal(recorded.status, 201, recorded.text);
    const lot = recorded.json.batch.lotCode as string;
    const read = await send(server(), rosa, { method: 'GET', path: `/api/batches/${lot}` });
    assert.equal(read.json.batch.notes, notes);
    assert.ok((await tableNamesOf(server())).includes('batches'));
  });

  it('should return a script tag in a formula title as plain JSON text', async () => {
    const title = '<script>alert("x")</script><img src=x onerror=alert(1)>';
    const yaml = `formula: 1\nid: markup-rub\ntitle: ${JSON.stringify(title)}\nkind: mix\ningredients:\n  - { name: salt, pct: 100, base: true }\n`;
    const created = await send(server(), rosa, {
      method: 'POST',
      path: '/api/formulas',
      body: { yaml, message: 'Markup in a title' },
    });
    assert.equal(created.status, 201, created.text);
    const got = await send(server(), rosa, { method: 'GET', path: '/api/formulas/markup-rub' });
    assert.match(got.headers.get('content-type') ?? '', /^application\/json/);
    assert.equal(got.headers.get('x-content-type-options'), 'nosniff');
    assert.equal(got.json.formula.title, title);
    const list = await send(server(), rosa, { method: 'GET', path: '/api/formulas?kind=mix' });
    const listed = list.json.formulas.find((f: { id: string }) => f.id === 'markup-rub');
    assert.equal(listed.title, title);
    const batch = await send(server(), rosa, {
      method: 'POST',
      path: '/api/batches',
      body: { formula: 'markup-rub', batch: { base: '1kg' } },
    });
    assert.equal(batch.status, 201, batch.text);
    assert.equal(batch.json.batch.formula.title, title);
  });
});

describe('session fixation', () => {
  const server = suiteServer();
  const signIn = (user: 'rosa' | 'tobin', cookie?: string) =>
    fetch(`${server().url}/api/session`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', ...(cookie ? { cookie } : {}) },
      body: JSON.stringify({ username: user, password: PASSWORDS[user] }),
    });
  const cookieOf = (response: Response): string =>
    (response.headers.get('set-cookie') ?? '').split(';')[0];
  // Who a cookie signs in, by the session route (200 with no person when nobody is signed in).
  const whoIs = async (cookie: string): Promise<string | null> => {
    const response = await fetch(`${server().url}/api/session`, { headers: { cookie } });
    assert.equal(response.status, 200);
    const body = (await response.json()) as { person: { username: string } | null };
    return body.person?.username ?? null;
  };

  it('should give no session cookie before sign-in, so there is none to fix', async () => {
    const anonymous = await fetch(`${server().url}/api/health`);
    assert.equal(anonymous.headers.get('set-cookie'), null);
    const refused = await send(server(), 'anonymous', {
      method: 'POST',
      path: '/api/session',
      body: { username: 'rosa', password: 'wrong-password' },
    });
    assert.equal(refused.status, 401);
    assert.equal(refused.headers.get('set-cookie'), null);
  });

  it('should issue a new session id at sign-in and end the one sent with it', async () => {
    const first = cookieOf(await signIn('tobin'));
    assert.match(first, /^larder\.sid=/);
    const second = await signIn('rosa', first);
    assert.equal(second.status, 201);
    const renewed = cookieOf(second);
    assert.match(renewed, /^larder\.sid=/);
    assert.notEqual(renewed, first);
    assert.equal(await whoIs(first), null, 'the session from before sign-in must be gone');
    assert.equal(await whoIs(renewed), 'rosa');
  });

  it('should ignore a session id the client made up', async () => {
    const forged = 'larder.sid=s%3Aattacker-chosen-id.bm90LWEtc2lnbmF0dXJl';
    assert.equal(await whoIs(forged), null);
    const response = await signIn('rosa', forged);
    assert.equal(response.status, 201);
    const issued = cookieOf(response);
    assert.notEqual(issued, forged);
    assert.ok(!issued.includes('attacker-chosen-id'));
    assert.equal(await whoIs(forged), null);
  });

  it('should end the session at sign-out, so its cookie no longer signs anyone in', async () => {
    const session = await cookieSession(server(), 'tobin');
    const out = await send(server(), session, { method: 'DELETE', path: '/api/session' });
    assert.equal(out.status, 204);
    assert.equal(await whoIs(session.cookie), null);
    const change = await send(server(), session, {
      method: 'POST',
      path: '/api/batches',
      body: BELLY,
    });
    assert.equal(change.status, 401);
  });
});
