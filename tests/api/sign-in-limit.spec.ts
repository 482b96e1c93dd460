// What the limit of sign-in attempts per address counts: failed ones, over the form and HTTP Basic
// together; never the sign-ins that succeed.
import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { basicRead, formSignIn } from '../helpers/sign-in-tries.ts';
import { PASSWORDS, startTestServer } from '../helpers/test-server.ts';

// A small limit keeps the tests short. common practice, no source
const LIMIT = 4;

describe('successful sign-ins and the limit of failed ones', () => {
  it('should not count successful form sign-ins: after limit − 1 failures and several successes one more failure is still checked', async (t) => {
    const server = await startTestServer(t, { LARDER_SIGN_IN_LIMIT: String(LIMIT) });
    for (let i = 1; i < LIMIT; i++)
      assert.equal(await formSignIn(server, 'rosa', `guess-${i}`), 401);
    for (const user of ['rosa', 'tobin', 'imke', 'rosa', 'tobin', 'imke'] as const)
      assert.equal(await formSignIn(server, user, PASSWORDS[user]), 201, `${user} signs in`);
    assert.equal(await formSignIn(server, 'rosa', 'guess-last'), 401, 'the last failure allowed');
    assert.equal(await formSignIn(server, 'rosa', 'guess-over'), 429);
    assert.equal(
      await formSignIn(server, 'rosa', PASSWORDS.rosa),
      429,
      'even the right password waits',
    );
  });

  it('should not count successful Basic sign-ins: after limit − 1 failures and several successes one more failure is still checked', async (t) => {
    const server = await startTestServer(t, { LARDER_SIGN_IN_LIMIT: String(LIMIT) });
    for (let i = 1; i < LIMIT; i++)
      assert.equal(await basicRead(server, 'rosa', `guess-${i}`), 401);
    // Each person's first request has their password hashed; the repeats are remembered.
    for (const user of ['rosa', 'tobin', 'imke', 'rosa', 'tobin', 'imke'] as const)
      assert.equal(await basicRead(server, user, PASSWORDS[user]), 200, `${user} reads`);
    assert.equal(await basicRead(server, 'rosa', 'guess-last'), 401, 'the last failure allowed');
    assert.equal(await basicRead(server, 'rosa', 'guess-over'), 429);
    assert.equal(
      await basicRead(server, 'tobin', PASSWORDS.tobin),
      429,
      'even a known password waits',
    );
  });

  it('should let a script’s 20 concurrent first requests with the right password all through', async (t) => {
    const server = await startTestServer(t, { LARDER_SIGN_IN_LIMIT: '2' });
    const statuses = await Promise.all(
      Array.from({ length: 20 }, () => basicRead(server, 'tobin', PASSWORDS.tobin)),
    );
    assert.deepEqual(
      statuses,
      Array.from({ length: 20 }, () => 200),
    );
  });

  it('should count failures over the form and over Basic from one address together', async (t) => {
    const server = await startTestServer(t, { LARDER_SIGN_IN_LIMIT: String(LIMIT) });
    assert.equal(await formSignIn(server, 'rosa', 'guess-1'), 401);
    assert.equal(await basicRead(server, 'rosa', 'guess-2'), 401);
    assert.equal(await formSignIn(server, 'tobin', 'guess-3'), 401);
    assert.equal(await basicRead(server, 'imke', 'guess-4'), 401);
    assert.equal(await formSignIn(server, 'rosa', PASSWORDS.rosa), 429);
    assert.equal(await basicRead(server, 'rosa', PASSWORDS.rosa), 429);
  });
});
