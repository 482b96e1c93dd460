import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { startTestServer } from '../helpers/test-server.ts';

describe('sign-in and people', () => {
  it('should sign in with the form, keep a session cookie and sign out', async (t) => {
    const server = await startTestServer(t);
    const response = await fetch(`${server.url}/api/session`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ username: 'rosa', password: 'quillmoor-admin' }),
    });
    assert.equal(response.status, 201);
    const cookie = response.headers.get('set-cookie') ?? '';
    assert.match(cookie, /HttpOnly/i);
    assert.match(cookie, /SameSite=Strict/i);
    const body = (await response.json()) as { person: Record<string, unknown>; csrfToken: string };
    assert.equal(body.person.username, 'rosa');
    assert.equal(body.person.passwordHash, undefined);
    assert.equal(JSON.stringify(body).includes('scrypt'), false);
    const rosa = await server.signIn('rosa');
    assert.equal((await rosa.get('/api/session')).json.person.role, 'admin');
    assert.equal((await rosa.request('DELETE', '/api/session')).status, 204);
  });

  it('should refuse a wrong password and audit the attempt', async (t) => {
    const server = await startTestServer(t);
    const wrong = await server
      .as('anonymous')
      .post('/api/session', { username: 'rosa', password: 'nope-nope' });
    assert.equal(wrong.status, 401);
    const audit = await server.as('rosa').get('/api/audit?action=sign-in-failed');
    assert.equal(audit.status, 200);
    assert.equal(audit.json.events[0].actorName, 'rosa');
  });

  it('should refuse a cookie-signed change without the CSRF token', async (t) => {
    const server = await startTestServer(t);
    const rosa = await server.signIn('rosa');
    const add = {
      username: 'wren',
      displayName: 'Wren Test',
      role: 'cook',
      password: 'long-enough-1',
    };
    const forged = await rosa.post('/api/people', add, { 'x-csrf-token': 'forged' });
    assert.equal(forged.status, 403);
    assert.equal(forged.json.error.code, 'csrf');
    assert.equal((await rosa.post('/api/people', add)).status, 201);
  });

  it('should end a deactivated person’s session at once', async (t) => {
    const server = await startTestServer(t);
    const tobin = await server.signIn('tobin');
    assert.equal((await tobin.get('/api/session')).status, 200);
    const people = (await server.as('rosa').get('/api/people')).json.people as {
      id: number;
      username: string;
    }[];
    const id = people.find((p) => p.username === 'tobin')?.id;
    assert.equal(
      (await server.as('rosa').request('PATCH', `/api/people/${id}`, { active: false })).status,
      200,
    );
    assert.equal(
      (await tobin.post('/api/calc', { formula: 'brisket-rub', batch: { base: '1kg' } })).status,
      401,
    );
    assert.equal(
      (
        await server
          .as('tobin')
          .post('/api/calc', { formula: 'brisket-rub', batch: { base: '1kg' } })
      ).status,
      401,
    );
  });

  it('should end sessions signed in before a password reset, but keep the one that changed its own', async (t) => {
    const server = await startTestServer(t);
    const phone = await server.signIn('tobin');
    const tablet = await server.signIn('tobin');
    const changed = await tablet.request('PUT', '/api/people/me/password', {
      current: 'quillmoor-cook',
      password: 'new-cook-pass-1',
    });
    assert.equal(changed.status, 204);
    assert.equal((await tablet.get('/api/batches?limit=1')).status, 200);
    assert.equal((await phone.get('/api/batches?limit=1')).status, 401);

    const people = (await server.as('rosa').get('/api/people')).json.people as {
      id: number;
      username: string;
    }[];
    const imke = people.find((p) => p.username === 'imke')?.id;
    const reviewer = await server.signIn('imke');
    assert.equal(
      (
        await server
          .as('rosa')
          .post(`/api/people/${imke}/password`, { password: 'reset-by-admin-1' })
      ).status,
      200,
    );
    assert.equal((await reviewer.get('/api/batches?limit=1')).status, 401);
  });

  it('should never demote or deactivate the last active admin', async (t) => {
    const server = await startTestServer(t);
    const people = (await server.as('rosa').get('/api/people')).json.people as {
      id: number;
      username: string;
    }[];
    const rosa = people.find((p) => p.username === 'rosa')?.id;
    const response = await server
      .as('rosa')
      .request('PATCH', `/api/people/${rosa}`, { role: 'cook' });
    assert.equal(response.status, 409);
    assert.equal(response.json.error.code, 'last-admin');
  });

  it('should throttle repeated sign-in attempts', async (t) => {
    const server = await startTestServer(t, { LARDER_SIGN_IN_LIMIT: '3' });
    const statuses: number[] = [];
    for (let i = 0; i < 5; i++) {
      statuses.push(
        (
          await server
            .as('anonymous')
            .post('/api/session', { username: 'rosa', password: `wrong-${i}` })
        ).status,
      );
    }
    assert.deepEqual(statuses, [401, 401, 401, 429, 429]);
  });
});
