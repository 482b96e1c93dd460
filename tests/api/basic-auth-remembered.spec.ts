import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { startTestServer, type TestServer } from '../helpers/test-server.ts';

const CALC = { formula: 'brisket-rub', batch: { base: '1kg' } };

/** The status of a calculation signed with HTTP Basic as this username and password. */
async function calcAs(server: TestServer, username: string, password: string): Promise<number> {
  const response = await fetch(`${server.url}/api/calc`, {
    method: 'POST',
    headers: {
      'content-type': 'application/json',
      authorization: `Basic ${Buffer.from(`${username}:${password}`).toString('base64')}`,
    },
    body: JSON.stringify(CALC),
  });
  await response.arrayBuffer();
  return response.status;
}

async function idOf(server: TestServer, username: string): Promise<number> {
  const people = (await server.as('rosa').get('/api/people')).json.people as {
    id: number;
    username: string;
  }[];
  const id = people.find((p) => p.username === username)?.id;
  assert.ok(id);
  return id;
}

// HTTP Basic remembers a password proved right for a minute (server/auth/verified-credentials.ts);
// none of that may outlive a change of the password or of the person.
describe('HTTP Basic with remembered passwords', () => {
  it('should refuse the old password at once after an admin resets it', async (t) => {
    const server = await startTestServer(t);
    assert.equal(await calcAs(server, 'tobin', 'quillmoor-cook'), 200);
    assert.equal(await calcAs(server, 'tobin', 'quillmoor-cook'), 200);
    const id = await idOf(server, 'tobin');
    const reset = await server.as('rosa').post(`/api/people/${id}/password`, {
      password: 'reset-by-admin-1',
    });
    assert.equal(reset.status, 200);
    assert.equal(await calcAs(server, 'tobin', 'quillmoor-cook'), 401);
    assert.equal(await calcAs(server, 'tobin', 'reset-by-admin-1'), 200);
  });

  it('should refuse the old password at once after the person changes their own', async (t) => {
    const server = await startTestServer(t);
    assert.equal(await calcAs(server, 'tobin', 'quillmoor-cook'), 200);
    const changed = await server.as('tobin').request('PUT', '/api/people/me/password', {
      current: 'quillmoor-cook',
      password: 'new-cook-pass-1',
    });
    assert.equal(changed.status, 204);
    assert.equal(await calcAs(server, 'tobin', 'quillmoor-cook'), 401);
    assert.equal(await calcAs(server, 'tobin', 'new-cook-pass-1'), 200);
  });

  it('should refuse the old password at once when it is changed in the database directly (larder users)', async (t) => {
    const server = await startTestServer(t);
    assert.equal(await calcAs(server, 'tobin', 'quillmoor-cook'), 200);
    const id = await idOf(server, 'tobin');
    await server.context.db.write((transaction) =>
      server.context.people.setPassword(id, 'set-from-the-cli-1', transaction),
    );
    assert.equal(await calcAs(server, 'tobin', 'quillmoor-cook'), 401);
    assert.equal(await calcAs(server, 'tobin', 'set-from-the-cli-1'), 200);
  });

  it('should refuse a deactivated person at once, and take them back when reactivated', async (t) => {
    const server = await startTestServer(t);
    assert.equal(await calcAs(server, 'tobin', 'quillmoor-cook'), 200);
    const id = await idOf(server, 'tobin');
    const off = await server.as('rosa').request('PATCH', `/api/people/${id}`, { active: false });
    assert.equal(off.status, 200);
    assert.equal(await calcAs(server, 'tobin', 'quillmoor-cook'), 401);
    const on = await server.as('rosa').request('PATCH', `/api/people/${id}`, { active: true });
    assert.equal(on.status, 200);
    assert.equal(await calcAs(server, 'tobin', 'quillmoor-cook'), 200);
  });

  it('should refuse a wrong password every time, and audit each attempt', async (t) => {
    const server = await startTestServer(t);
    assert.equal(await calcAs(server, 'tobin', 'quillmoor-cook'), 200);
    for (let i = 0; i < 2; i++) assert.equal(await calcAs(server, 'tobin', 'quillmoor-cooK'), 401);
    const audit = await server.as('rosa').get('/api/audit?action=sign-in-failed');
    assert.equal(audit.status, 200);
    const failed = (audit.json.events as { actorName: string | null; action: string }[]).filter(
      (event) => event.action === 'sign-in-failed',
    );
    assert.equal(failed.length, 2);
  });
});
