// What the audit log keeps of refused calculations and throttled sign-ins, the names it gives, and
// its filters by person, object and time.
import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { AuditAction, AuditEvent } from '../../shared/api/audit-event.ts';
import { basicRead, formSignIn } from '../helpers/sign-in-tries.ts';
import { startTestServer, type TestServer } from '../helpers/test-server.ts';

/** The audit entries of one action, newest first. */
async function entries(server: TestServer, query: string) {
  const response = await server.as('rosa').get(`/api/audit?${query}`);
  assert.equal(response.status, 200, response.text);
  return response.json.events as {
    action: string;
    actorName: string | null;
    actorDisplayName: string | null;
    subject: string | null;
    subjectDisplayName: string | null;
    detail: Record<string, unknown>;
    at: string;
  }[];
}

/** The audit entries of one action read from the repository, past any limit of sign-ins. */
async function logged(server: TestServer, action: AuditAction) {
  return server.context.audit.list({ limit: 50, action }) as Promise<
    (AuditEvent & { detail: Record<string, unknown> })[]
  >;
}

describe('throttled sign-ins in the audit log', () => {
  it('should note the first refusal of an address past its limit once, with the name tried', async (t) => {
    // A small limit keeps the test short. common practice, no source
    const server = await startTestServer(t, { LARDER_SIGN_IN_LIMIT: '2' });
    assert.equal(await formSignIn(server, 'tobin', 'guess-1'), 401);
    assert.equal(await formSignIn(server, 'tobin', 'guess-2'), 401);
    assert.equal(await formSignIn(server, 'tobin', 'guess-3'), 429);
    assert.equal(await formSignIn(server, 'tobin', 'guess-4'), 429);
    assert.equal(await basicRead(server, 'tobin', 'guess-5'), 429);
    // This address may not sign in now, the admin's reads included: read the log directly.
    const throttled = await logged(server, 'sign-in-throttled');
    assert.equal(throttled.length, 1, 'one entry for the window, not one per refused request');
    assert.equal(throttled[0].actorName, 'tobin');
    assert.equal(throttled[0].actorDisplayName, 'Tobin Marrowfeld (cook)');
    assert.equal(throttled[0].detail.via, 'form');
    // The window is 15 minutes (server/auth/sign-in-attempts.ts). common practice, no source
    const wait = Number(throttled[0].detail.retryAfterSeconds);
    assert.ok(wait > 0 && wait <= 15 * 60, `a wait of ${wait} s`);
    assert.equal((await logged(server, 'sign-in-failed')).length, 2);
  });

  it('should note a refusal of HTTP Basic sign-ins too', async (t) => {
    const server = await startTestServer(t, { LARDER_SIGN_IN_LIMIT: '1' });
    assert.equal(await basicRead(server, 'someone', 'guess-1'), 401);
    assert.equal(await basicRead(server, 'someone', 'guess-2'), 429);
    const [throttled, ...more] = await logged(server, 'sign-in-throttled');
    assert.equal(more.length, 0);
    assert.equal(throttled.actorName, 'someone');
    assert.equal(throttled.actorDisplayName, null, 'nobody has that username');
    assert.equal(throttled.detail.via, 'basic');
  });
});

describe('refused calculations in the audit log', () => {
  it('should keep a refused batch with who tried it, by name', async (t) => {
    const server = await startTestServer(t);
    // 5 kg pumped to 5.6 kg is a 12 % pump: 144 ppm ingoing nitrite, over the 120 ppm ceiling
    // for pumped bacon. source: 9 CFR 424.22(b); FSIS Directive 7620.3 ch. 3 (pumped formula)
    const response = await server.as('tobin').post('/api/batches', {
      formula: 'maple-pump-belly',
      batch: { meat: '5kg', pumpedWeight: '5.6kg' },
    });
    assert.equal(response.status, 422, response.text);
    const [refused, ...more] = await entries(server, 'action=calculation-refused');
    assert.equal(more.length, 0);
    assert.equal(refused.actorName, 'tobin');
    assert.equal(refused.actorDisplayName, 'Tobin Marrowfeld (cook)');
    assert.equal(refused.subject, 'maple-pump-belly');
    assert.match(String((refused.detail.failed as string[])[0]), /over the 120 ppm limit/);
  });
});

describe('the audit log’s names and filters', () => {
  it('should name the person an entry is about, and filter by person, object and time', async (t) => {
    const server = await startTestServer(t);
    const start = new Date().toISOString();
    const added = await server.as('rosa').post('/api/people', {
      username: 'wren',
      displayName: 'Wren Ollivane',
      role: 'cook',
      password: 'hickory-bench-42',
    });
    assert.equal(added.status, 201, added.text);
    const [add] = await entries(server, 'action=person-add');
    assert.equal(add.actorDisplayName, 'Rosa Quennick (head cook)');
    assert.equal(add.subject, 'wren');
    assert.equal(add.subjectDisplayName, 'Wren Ollivane');

    const byRosa = await entries(server, 'actor=rosa');
    assert.ok(byRosa.length > 0);
    assert.ok(byRosa.every((event) => event.actorName === 'rosa'));
    const aboutWren = await entries(server, 'subject=WREN');
    assert.deepEqual(
      aboutWren.map((event) => event.action),
      ['person-add'],
      'the object matches whatever its case',
    );

    const since = await entries(server, `from=${encodeURIComponent(start)}`);
    assert.ok(since.some((event) => event.action === 'person-add'));
    assert.ok(since.every((event) => event.at >= start));
    const until = await entries(server, `to=${encodeURIComponent(start)}`);
    assert.ok(until.every((event) => event.at < start));
    assert.ok(!until.some((event) => event.action === 'person-add'));
    const zoned = await entries(
      server,
      `from=${encodeURIComponent(start.replace('Z', '+00:00'))}&action=person-add`,
    );
    assert.equal(zoned.length, 1, 'an instant with an offset is read as the same time');

    for (const bad of ['from=yesterday', 'to=2026-12-03', 'actor=', 'subject=%20'])
      assert.equal((await server.as('rosa').get(`/api/audit?${bad}`)).status, 400, bad);
  });
});

describe('whom to ask about a page for admins', () => {
  it('should tell anyone signed in the names of the active admins, and nothing more', async (t) => {
    const server = await startTestServer(t);
    const made = await server.as('rosa').post('/api/people', {
      username: 'odile',
      displayName: 'Odile Farrant',
      role: 'admin',
      password: 'smokehouse-ledger-7',
    });
    assert.equal(made.status, 201, made.text);
    const id = made.json.person.id as number;
    for (const user of ['tobin', 'imke'] as const) {
      const response = await server.as(user).get('/api/people/admins');
      assert.equal(response.status, 200, response.text);
      assert.deepEqual(response.json.admins, [
        { displayName: 'Odile Farrant' },
        { displayName: 'Rosa Quennick (head cook)' },
      ]);
    }
    await server.as('rosa').request('PATCH', `/api/people/${id}`, { active: false });
    const after = await server.as('tobin').get('/api/people/admins');
    assert.deepEqual(after.json.admins, [{ displayName: 'Rosa Quennick (head cook)' }]);
    assert.equal((await server.as('anonymous').get('/api/people/admins')).status, 401);
    assert.equal((await server.as('tobin').get('/api/people')).status, 403);
  });
});
