import assert from 'node:assert/strict';
import { before, describe, it } from 'node:test';
import {
  BELLY,
  cookieSession,
  send,
  snapshot,
  suiteServer,
  type CookieSession,
} from '../helpers/api-calls.ts';
import {
  ROUTES,
  USER_OF,
  assertCell,
  makeFixture,
  outcomeOf,
  type Fixture,
  type Role,
} from '../helpers/api-routes.ts';

const SIGNED_IN: readonly Exclude<Role, 'anonymous'>[] = ['cook', 'reviewer', 'admin'];

describe('role matrix through cookie sessions: the same gates as HTTP Basic', () => {
  const server = suiteServer();
  let fx: Fixture;
  const sessions = new Map<Role, CookieSession>();
  before(async () => {
    fx = await makeFixture(server());
    for (const role of SIGNED_IN) sessions.set(role, await cookieSession(server(), USER_OF[role]));
  });

  // The routes some signed-in role may not use: where a session could slip past a gate.
  const gated = ROUTES.filter((route) => !route.sessionRoute && route.allowed.length < 3);
  for (const route of gated) {
    for (const role of SIGNED_IN) {
      it(`should answer ${route.method} ${route.route} for a ${role}'s session with ${outcomeOf(route, role)}`, async () => {
        const call = await route.prepare(fx, role);
        const stored = await snapshot(server());
        const response = await send(server(), call.as ?? sessions.get(role)!, call);
        assertCell(route, role, response, { before: stored, after: await snapshot(server()) });
      });
    }
  }
});

describe('CSRF: cookie-signed changes without X-CSRF-Token', () => {
  const server = suiteServer();
  let fx: Fixture;
  let admin: CookieSession;
  before(async () => {
    fx = await makeFixture(server());
    admin = await cookieSession(server(), 'rosa');
  });

  // An admin passes every role gate, so the token is the only thing that can refuse these.
  const changes = ROUTES.filter((route) => route.method !== 'GET' && !route.sessionRoute);
  for (const route of changes) {
    it(`should refuse ${route.method} ${route.route} without the token with 403 csrf, writing nothing`, async () => {
      const call = await route.prepare(fx, 'admin');
      const stored = await snapshot(server());
      const response = await send(server(), admin, call, { csrf: false });
      assert.equal(response.status, 403, response.text);
      assert.equal(response.json.error.code, 'csrf');
      assert.deepEqual(await snapshot(server()), stored);
      // The same request with the token goes through: the refusal was the token's.
      const allowed = await send(server(), admin, await route.prepare(fx, 'admin'));
      assert.ok(allowed.status < 300, allowed.text);
    });
  }

  it('should refuse another session’s token', async () => {
    const tobin = await cookieSession(server(), 'tobin');
    const stored = await snapshot(server());
    const call = { method: 'POST', path: '/api/batches', body: BELLY };
    const forged = { ...tobin, csrfToken: admin.csrfToken };
    const response = await send(server(), forged, call);
    assert.equal(response.status, 403, response.text);
    assert.equal(response.json.error.code, 'csrf');
    assert.deepEqual(await snapshot(server()), stored);
  });

  it('should refuse DELETE /api/session (sign-out) without the token', async () => {
    const tobin = await cookieSession(server(), 'tobin');
    const response = await send(
      server(),
      tobin,
      { method: 'DELETE', path: '/api/session' },
      { csrf: false },
    );
    assert.equal(response.status, 403, response.text);
    assert.equal(response.json?.error?.code, 'csrf');
    const still = await send(server(), tobin, { method: 'GET', path: '/api/session' });
    assert.equal(still.status, 200, still.text);
    assert.equal(
      still.json?.person?.username,
      'tobin',
      'the session must survive a refused sign-out',
    );
  });
});
