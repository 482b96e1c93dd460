// CSRF tokens that are not what the session holds, down to their bytes, are refused with 403:
// never a 500, and the same way on every route that checks them.
import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { cookieSession, type CookieSession } from '../helpers/api-calls.ts';
import { rawRequest } from '../helpers/raw-http.ts';
import { startTestServer, type TestServer } from '../helpers/test-server.ts';

// A session's token is 43 characters (32 random bytes, base64url). source: server/auth/csrf.ts
const TOKEN_LENGTH = 43;

/** Wrong tokens: as long as the real one in characters, though not in UTF-8 bytes, and others. */
function wrongTokens(real: string): Record<string, string> {
  return {
    'multibyte, as many characters': 'é'.repeat(TOKEN_LENGTH),
    'multibyte, as many UTF-8 bytes': 'é'.repeat(21) + real.slice(0, 1),
    'one character changed': real.slice(0, -1) + (real.endsWith('A') ? 'B' : 'A'),
    'one character short': real.slice(0, -1),
    'the token and more': real + 'A',
    empty: '',
  };
}

/** A calculation from a session, with a given X-CSRF-Token header (node:http sends it byte for byte). */
function calc(server: TestServer, session: CookieSession, token: string) {
  return rawRequest(server.url, {
    method: 'POST',
    path: '/api/calc',
    headers: { cookie: session.cookie, 'x-csrf-token': token },
    body: { formula: 'brisket-rub', batch: { base: '1kg' } },
  });
}

function signOut(server: TestServer, session: CookieSession, token: string) {
  return rawRequest(server.url, {
    method: 'DELETE',
    path: '/api/session',
    headers: { cookie: session.cookie, 'x-csrf-token': token },
  });
}

describe('CSRF tokens that do not match', () => {
  it('should refuse each with 403 csrf on a state-changing route, and take the right one', async (t) => {
    const server = await startTestServer(t);
    const session = await cookieSession(server, 'tobin');
    assert.equal(session.csrfToken.length, TOKEN_LENGTH);
    for (const [what, token] of Object.entries(wrongTokens(session.csrfToken))) {
      const response = await calc(server, session, token);
      assert.equal(response.status, 403, `${what}: ${response.text}`);
      assert.equal(response.json.error.code, 'csrf', what);
    }
    assert.equal((await calc(server, session, session.csrfToken)).status, 200);
  });

  it('should refuse each with 403 csrf on signing out, leaving the session signed in', async (t) => {
    const server = await startTestServer(t);
    const session = await cookieSession(server, 'tobin');
    for (const [what, token] of Object.entries(wrongTokens(session.csrfToken))) {
      const response = await signOut(server, session, token);
      assert.equal(response.status, 403, `${what}: ${response.text}`);
      assert.equal(response.json.error.code, 'csrf', what);
    }
    const still = await rawRequest(server.url, {
      path: '/api/session',
      headers: { cookie: session.cookie },
    });
    assert.equal(still.status, 200, 'still signed in');
    assert.equal((await signOut(server, session, session.csrfToken)).status, 204);
  });
});
