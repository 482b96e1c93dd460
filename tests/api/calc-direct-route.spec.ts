// POST /api/calc as sent is answered without the router's walk (server/http/direct-route.ts);
// the same route spelled otherwise (a trailing slash, a query string) goes through the router.
// Both must run the same checks in the same order: each case below is asked both ways and must
// be answered alike, status, error code, security headers and answer.
import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { cookieSession } from '../helpers/api-calls.ts';
import { rawRequest, type RawResponse } from '../helpers/raw-http.ts';
import { startTestServer } from '../helpers/test-server.ts';

const BELLY = { formula: 'quillmoor-belly', batch: { meat: '4.5kg', thickness: '4cm' } };

/** What must be alike both ways: status, error code, the policy header and the answer. */
function seen(response: RawResponse): unknown {
  return {
    status: response.status,
    code: response.json?.error?.code,
    policy: response.headers['content-security-policy'],
    frames: response.headers['x-frame-options'],
    answer: response.status === 200 ? response.json : undefined,
  };
}

describe('the calculation route, with and without the router', () => {
  it('should answer and refuse alike whichever way it is reached', async (t) => {
    const server = await startTestServer(t);
    const session = await cookieSession(server, 'tobin');
    const signedIn = { cookie: session.cookie, 'x-csrf-token': session.csrfToken };
    const cases: Record<string, { headers?: Record<string, string>; body?: unknown }> = {
      'a calculation': { headers: signedIn, body: BELLY },
      'kept, asked again': { headers: signedIn, body: BELLY },
      'no CSRF token': { headers: { cookie: session.cookie }, body: BELLY },
      'signed out': { body: BELLY },
      'from another site': {
        headers: { ...signedIn, origin: 'https://elsewhere.example' },
        body: BELLY,
      },
      'a body not valid': { headers: signedIn, body: { formula: 'quillmoor-belly' } },
      'a formula not there': { headers: signedIn, body: { formula: 'no-such', batch: {} } },
      'a site not theirs': { headers: { ...signedIn, 'x-larder-site': 'nowhere' }, body: BELLY },
      'a batch refused': { headers: signedIn, body: { ...BELLY, batch: { meat: 'lots' } } },
    };
    for (const [what, { headers, body }] of Object.entries(cases)) {
      const direct = await rawRequest(server.url, {
        method: 'POST',
        path: '/api/calc',
        headers,
        body,
      });
      const routed = await rawRequest(server.url, {
        method: 'POST',
        path: '/api/calc/',
        headers,
        body,
      });
      assert.deepEqual(seen(direct), seen(routed), what);
    }
    // The cases are not all alike: the checks did run.
    const statuses = new Set<number>();
    for (const { headers, body } of Object.values(cases))
      statuses.add(
        (await rawRequest(server.url, { method: 'POST', path: '/api/calc', headers, body })).status,
      );
    assert.deepEqual([...statuses].sort(), [200, 400, 401, 403, 404]);
  });
});
