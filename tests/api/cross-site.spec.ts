// The API's answer to forged requests: a change marked by the browser as coming from another
// site is refused whatever it signs in with, a password-signed change must come from a script
// (JSON body or X-Larder-Client), and no answer asks a browser for a password. The same attack
// in a real browser is tests/e2e/cross-site.e2e.ts.
import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { cookieSession, suiteServer } from '../helpers/api-calls.ts';
import { PASSWORDS, type TestServer } from '../helpers/test-server.ts';

const ROSA = `Basic ${Buffer.from(`rosa:${PASSWORDS.rosa}`).toString('base64')}`;

/** A batch recorded by the cook today, waiting for a sign-off. */
async function unsignedBatch(server: TestServer): Promise<string> {
  const response = await server.as('tobin').post('/api/batches', {
    formula: 'brisket-rub',
    batch: { base: '1kg', start: new Date().toISOString().slice(0, 10) },
  });
  assert.equal(response.status, 201, response.text);
  return response.json.batch.lotCode as string;
}

async function signOff(
  server: TestServer,
  lot: string,
  headers: Record<string, string>,
  body?: string,
): Promise<{ status: number; code?: string }> {
  const response = await fetch(`${server.url}/api/batches/${lot}/sign-off`, {
    method: 'POST',
    headers,
    body,
  });
  const json = (await response.json().catch(() => ({}))) as { error?: { code?: string } };
  return { status: response.status, code: json.error?.code };
}

async function signedOff(server: TestServer, lot: string): Promise<boolean> {
  const response = await server.as('rosa').get(`/api/batches/${lot}`);
  return response.json.batch.signedOff !== null;
}

describe('changes a page of another site asks for', () => {
  const server = suiteServer();

  for (const [what, headers] of [
    ['Sec-Fetch-Site: cross-site', { 'sec-fetch-site': 'cross-site' }],
    ['Sec-Fetch-Site: same-site (another port or sub-domain)', { 'sec-fetch-site': 'same-site' }],
    ['an Origin of another site (older browsers)', { origin: 'http://elsewhere.example' }],
    ['Origin: null (a sandboxed page)', { origin: 'null' }],
  ] as const) {
    it(`should refuse a Basic-signed JSON sign-off sent with ${what}: 403 cross-site`, async () => {
      const lot = await unsignedBatch(server());
      const answer = await signOff(
        server(),
        lot,
        { authorization: ROSA, 'content-type': 'application/json', ...headers },
        '{}',
      );
      assert.deepEqual(answer, { status: 403, code: 'cross-site' });
      assert.equal(await signedOff(server(), lot), false);
    });

    it(`should refuse a session-signed sign-off with its CSRF token sent with ${what}`, async () => {
      const lot = await unsignedBatch(server());
      const session = await cookieSession(server(), 'imke');
      const answer = await signOff(server(), lot, {
        cookie: session.cookie,
        'x-csrf-token': session.csrfToken,
        ...headers,
      });
      assert.deepEqual(answer, { status: 403, code: 'cross-site' });
      assert.equal(await signedOff(server(), lot), false);
    });
  }

  it('should refuse a sign-in form posted from another site, so nobody is signed in unawares', async () => {
    const response = await fetch(`${server().url}/api/session`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'sec-fetch-site': 'cross-site' },
      body: JSON.stringify({ username: 'imke', password: PASSWORDS.imke }),
    });
    assert.equal(response.status, 403);
    assert.equal(response.headers.get('set-cookie'), null);
  });

  it("should take the console's own changes (same-origin) and reading from anywhere", async () => {
    const lot = await unsignedBatch(server());
    const session = await cookieSession(server(), 'imke');
    const answer = await signOff(server(), lot, {
      cookie: session.cookie,
      'x-csrf-token': session.csrfToken,
      'sec-fetch-site': 'same-origin',
      origin: server().url,
    });
    assert.equal(answer.status, 200);
    const read = await fetch(`${server().url}/api/batches/${lot}`, {
      headers: { authorization: ROSA, 'sec-fetch-site': 'cross-site' },
    });
    // Reading is harmless: another site's page cannot see the answer without CORS consent.
    assert.equal(read.status, 200);
    assert.equal(read.headers.get('access-control-allow-origin'), null);
  });
});

describe('changes signed with a password (HTTP Basic)', () => {
  const server = suiteServer();

  it('should refuse a body-less sign-off that names no script, as a plain web form sends it: 403 not-a-script', async () => {
    const lot = await unsignedBatch(server());
    const answer = await signOff(server(), lot, { authorization: ROSA });
    assert.deepEqual(answer, { status: 403, code: 'not-a-script' });
    assert.equal(await signedOff(server(), lot), false);
  });

  it('should refuse a form-encoded or multipart sign-off that names no script', async () => {
    const lot = await unsignedBatch(server());
    const encoded = await signOff(
      server(),
      lot,
      { authorization: ROSA, 'content-type': 'application/x-www-form-urlencoded' },
      'note=ok',
    );
    // A form-encoded body is no API's body at all (415); a multipart one is an upload's kind.
    assert.equal(encoded.status, 415);
    const form = new FormData();
    form.set('note', 'ok');
    const multipart = await fetch(`${server().url}/api/batches/${lot}/sign-off`, {
      method: 'POST',
      headers: { authorization: ROSA },
      body: form,
    });
    assert.equal(multipart.status, 403);
    assert.equal(await signedOff(server(), lot), false);
  });

  it('should take a sign-off from a script that sends JSON, or that names itself', async () => {
    const first = await unsignedBatch(server());
    const json = await signOff(
      server(),
      first,
      { authorization: ROSA, 'content-type': 'application/json' },
      '{"note":"checked"}',
    );
    assert.equal(json.status, 200);
    const second = await unsignedBatch(server());
    const named = await signOff(server(), second, {
      authorization: ROSA,
      'x-larder-client': 'nightly-review',
    });
    assert.equal(named.status, 200);
  });

  it('should take an upload from a script that names itself, and refuse it otherwise', async () => {
    const upload = (headers: Record<string, string>, id: string): Promise<Response> => {
      const form = new FormData();
      const yaml = `formula: 1\nid: ${id}\ntitle: Script upload\nkind: mix\ningredients:\n  - { name: kosher salt, pct: 100, base: true }\n`;
      form.set('file', new Blob([yaml]), `${id}.yaml`);
      return fetch(`${server().url}/api/formulas/upload`, {
        method: 'POST',
        headers: { authorization: ROSA, ...headers },
        body: form,
      });
    };
    assert.equal((await upload({}, 'unnamed-upload')).status, 403);
    const named = await upload({ 'x-larder-client': 'formula-sync' }, 'named-upload');
    assert.equal(named.status, 201, await named.text());
    const missing = await server().as('rosa').get('/api/formulas/unnamed-upload');
    assert.equal(missing.status, 404);
  });
});

describe('answers to requests that are not signed in', () => {
  const server = suiteServer();

  it('should never ask a browser for a password: no Basic challenge, anonymous or wrong', async () => {
    const anonymous = await fetch(`${server().url}/api/people`);
    assert.equal(anonymous.status, 401);
    assert.equal(anonymous.headers.get('www-authenticate'), null);
    const wrong = await fetch(`${server().url}/api/people`, {
      headers: { authorization: `Basic ${Buffer.from('rosa:not-it').toString('base64')}` },
    });
    assert.equal(wrong.status, 401);
    assert.equal(wrong.headers.get('www-authenticate'), null);
  });
});
