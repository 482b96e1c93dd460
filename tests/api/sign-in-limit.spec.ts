// What the limit of sign-in attempts per address counts: failed ones, over the form and HTTP Basic
// together; never the sign-ins that succeed.
import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { rawRequest } from '../helpers/raw-http.ts';
import { PASSWORDS, startTestServer, type TestServer } from '../helpers/test-server.ts';

// A small limit keeps the tests short. common practice, no source
const LIMIT = 4;

/** A sign-in through the form; its status. */
async function form(server: TestServer, username: string, password: string): Promise<number> {
  const response = await rawRequest(server.url, {
    method: 'POST',
    path: '/api/session',
    body: { username, password },
  });
  return response.status;
}

/** A read of the batch log signed with HTTP Basic; its status. */
async function basic(server: TestServer, username: string, password: string): Promise<number> {
  const response = await rawRequest(server.url, {
    path: '/api/batches?limit=1',
    headers: {
      authorization: `Basic ${Buffer.from(`${username}:${password}`).toString('base64')}`,
    },
  });
  return response.status;
}

describe('successful sign-ins and the limit of failed ones', () => {
  it('should not count successful form sign-ins: after limit − 1 failures and several successes one more failure is still checked', async (t) => {
    const server = await startTestServer(t, { LARDER_SIGN_IN_LIMIT: String(LIMIT) });
    for (let i = 1; i < LIMIT; i++) assert.equal(await form(server, 'rosa', `guess-${i}`), 401);
    for (const user of ['rosa', 'tobin', 'imke', 'rosa', 'tobin', 'imke'] as const)
      assert.equal(await form(server, user, PASSWORDS[user]), 201, `${user} signs in`);
    assert.equal(await form(server, 'rosa', 'guess-last'), 401, 'the last failure allowed');
    assert.equal(await form(server, 'rosa', 'guess-over'), 429);
    assert.equal(await form(server, 'rosa', PASSWORDS.rosa), 429, 'even the right password waits');
  });

  it('should not count successful Basic sign-ins: after limit − 1 failures and several successes one more failure is still checked', async (t) => {
    const server = await startTestServer(t, { LARDER_SIGN_IN_LIMIT: String(LIMIT) });
    for (let i = 1; i < LIMIT; i++) assert.equal(await basic(server, 'rosa', `guess-${i}`), 401);
    // Each person's first request has their password hashed; the repeats are remembered.
    for (const user of ['rosa', 'tobin', 'imke', 'rosa', 'tobin', 'imke'] as const)
      assert.equal(await basic(server, user, PASSWORDS[user]), 200, `${user} reads`);
    assert.equal(await basic(server, 'rosa', 'guess-last'), 401, 'the last failure allowed');
    assert.equal(await basic(server, 'rosa', 'guess-over'), 429);
    assert.equal(await basic(server, 'tobin', PASSWORDS.tobin), 429, 'even a known password waits');
  });

  it('should let a script’s 20 concurrent first requests with the right password all through', async (t) => {
    const server = await startTestServer(t, { LARDER_SIGN_IN_LIMIT: '2' });
    const statuses = await Promise.all(
      Array.from({ length: 20 }, () => basic(server, 'tobin', PASSWORDS.tobin)),
    );
    assert.deepEqual(
      statuses,
      Array.from({ length: 20 }, () => 200),
    );
  });

  it('should count failures over the form and over Basic from one address together', async (t) => {
    const server = await startTestServer(t, { LARDER_SIGN_IN_LIMIT: String(LIMIT) });
    assert.equal(await form(server, 'rosa', 'guess-1'), 401);
    assert.equal(await basic(server, 'rosa', 'guess-2'), 401);
    assert.equal(await form(server, 'tobin', 'guess-3'), 401);
    assert.equal(await basic(server, 'imke', 'guess-4'), 401);
    assert.equal(await form(server, 'rosa', PASSWORDS.rosa), 429);
    assert.equal(await basic(server, 'rosa', PASSWORDS.rosa), 429);
  });
});
