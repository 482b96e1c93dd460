import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { startTestServer } from '../helpers/test-server.ts';

// A production install needs a real secret of at least 32 characters (server/config.ts).
const PRODUCTION = { LARDER_MODE: 'production', LARDER_SESSION_SECRET: 'x'.repeat(40) };

describe('asking who is signed in, and the demo’s sign-ins', () => {
  it('should answer 200 with no person when nobody is signed in, and after signing out', async (t) => {
    const server = await startTestServer(t);
    const anonymous = await server.as('anonymous').get('/api/session');
    assert.equal(anonymous.status, 200, anonymous.text);
    assert.deepEqual(anonymous.json, { person: null, csrfToken: null });
    const rosa = await server.signIn('rosa');
    assert.equal((await rosa.get('/api/session')).json.person.username, 'rosa');
    assert.equal((await rosa.request('DELETE', '/api/session')).status, 204);
    const after = await rosa.get('/api/session');
    assert.equal(after.status, 200);
    assert.equal(after.json.person, null);
  });

  it('should still refuse the rest of the API with 401 when nobody is signed in', async (t) => {
    const server = await startTestServer(t);
    const formulas = await server.as('anonymous').get('/api/formulas');
    assert.equal(formulas.status, 401);
    assert.equal(formulas.json.error.code, 'unauthenticated');
  });

  it('should give the demo’s three sign-ins, with the passwords the demo sets', async (t) => {
    const server = await startTestServer(t);
    const demo = await server.as('anonymous').get('/api/session/demo');
    assert.equal(demo.status, 200);
    assert.equal(demo.json.demo, true);
    assert.equal(demo.json.kitchen, 'Quillmoor Smokehouse');
    assert.deepEqual(
      demo.json.signIns.map((p: Record<string, string>) => `${p.username}/${p.role}/${p.password}`),
      ['rosa/admin/quillmoor-admin', 'tobin/cook/quillmoor-cook', 'imke/reviewer/quillmoor-review'],
    );
    // The passwords shown are the ones that sign in.
    for (const { username, password } of demo.json.signIns as Record<string, string>[]) {
      const signIn = await server.as('anonymous').post('/api/session', { username, password });
      assert.equal(signIn.status, 201, `${username}: ${signIn.text}`);
    }
  });

  it('should tell no sign-ins on an install that is not the demo, whoever is in its database', async (t) => {
    // The test server seeds the demo people in every mode: the answer must not list them.
    const server = await startTestServer(t, PRODUCTION);
    const demo = await server.as('anonymous').get('/api/session/demo');
    assert.equal(demo.status, 200);
    assert.deepEqual(demo.json, { demo: false, kitchen: null, signIns: [] });
    assert.doesNotMatch(demo.text, /quillmoor|rosa|password/i);
  });
});
