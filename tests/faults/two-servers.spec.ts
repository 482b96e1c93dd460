import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { PASSWORDS } from '../helpers/test-server.ts';
import { call, makeDataDir, startServerProcess, type AfterHook } from './server-process.ts';

/** Two server processes on one data folder: the second started once the first has seeded it. */
async function twoServers(t: AfterHook, env: Record<string, string> = {}) {
  const data = makeDataDir(t);
  const one = await startServerProcess(t, data, { env });
  const other = await startServerProcess(t, data, { env });
  return { one, other };
}

/** A sign-in through the form with a wrong password; its status. */
async function wrongSignIn(url: string): Promise<number> {
  const response = await fetch(`${url}/api/session`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ username: 'tobin', password: 'not-the-password' }),
  });
  await response.arrayBuffer();
  return response.status;
}

/** Saves a formula's YAML as rosa (HTTP Basic) over the revision it was changed from. */
async function save(url: string, revision: string, yaml: string, message: string) {
  const response = await fetch(`${url}/api/formulas/house-sauce`, {
    method: 'PUT',
    headers: {
      'content-type': 'application/json',
      authorization: `Basic ${Buffer.from(`rosa:${PASSWORDS.rosa}`).toString('base64')}`,
      'if-match': `"${revision}"`,
    },
    body: JSON.stringify({ yaml, message }),
  });
  return { status: response.status, json: (await response.json()) as { revision: string } };
}

describe('two server processes on one database and one formulas folder', () => {
  it('should hold an address to one sign-in limit across both', async (t) => {
    const { one, other } = await twoServers(t, { LARDER_SIGN_IN_LIMIT: '4' });
    // Two wrong guesses at each: four in all, the limit.
    const guesses = [];
    for (const url of [one.url, other.url, one.url, other.url])
      guesses.push(await wrongSignIn(url));
    assert.deepEqual(guesses, [401, 401, 401, 401]);
    // Each process alone has seen two; together they have seen four, and both refuse the fifth.
    assert.equal(await wrongSignIn(one.url), 429);
    assert.equal(await wrongSignIn(other.url), 429);
    const right = await fetch(`${other.url}/api/session`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ username: 'tobin', password: PASSWORDS.tobin }),
    });
    assert.equal(right.status, 429, 'the right password too, until the window ends');
  });

  it('should serve a formula saved through one from the other, and refuse a stale save there', async (t) => {
    const { one, other } = await twoServers(t);
    // The other process has read the formula before the save, twice: its folder watch starts on
    // the second read, and from then on it serves the folder as read until the watch tells.
    await call(other.url, 'rosa', 'GET', '/api/formulas/house-sauce');
    const before = await call(other.url, 'rosa', 'GET', '/api/formulas/house-sauce');
    assert.equal(before.status, 200);
    const yaml = (before.json.yaml as string).replace('pct: 25 }', 'pct: 30 }');
    assert.notEqual(yaml, before.json.yaml);
    const saved = await save(one.url, before.json.revision as string, yaml, 'More chili');
    assert.equal(saved.status, 200);
    // The folder watch tells the other process; it may take a moment.
    let seen = before;
    for (let tries = 0; tries < 40 && seen.json.revision !== saved.json.revision; tries++) {
      await new Promise((resolve) => setTimeout(resolve, 250));
      seen = await call(other.url, 'rosa', 'GET', '/api/formulas/house-sauce');
    }
    assert.equal(seen.json.revision, saved.json.revision);
    assert.equal(seen.json.yaml, yaml);
    // A save through the other process from the old revision is stale there too.
    const stale = await save(
      other.url,
      before.json.revision as string,
      before.json.yaml as string,
      'Stale',
    );
    assert.equal(stale.status, 409);
  });
});
