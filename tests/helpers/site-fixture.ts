import assert from 'node:assert/strict';
import { send, type Call } from './api-calls.ts';
import type { ApiResponse, TestServer } from './test-server.ts';

/** A password every person the site tests add is given. */
export const SITE_PASSWORD = 'harbour-shop-password';

/** A second site of the demo group for the tests, with its key. */
export const OTHER_SITE = { key: 'harbour-test', name: 'Quillmoor Harbour test shop' } as const;

/** Sends a call over HTTP Basic as a person the tests added, optionally at a site (the header). */
export function sendAs(
  server: TestServer,
  username: string,
  call: Call,
  site?: string,
): Promise<ApiResponse> {
  const pair = Buffer.from(`${username}:${SITE_PASSWORD}`).toString('base64');
  return send(server, 'anonymous', {
    ...call,
    headers: {
      authorization: `Basic ${pair}`,
      'x-larder-client': 'larder-tests',
      ...(site ? { 'x-larder-site': site } : {}),
      ...call.headers,
    },
  });
}

/** Adds a site as the demo admin (rosa); returns nothing, asserts it was made. */
export async function addSite(server: TestServer, site: { key: string; name: string }) {
  const response = await send(server, 'rosa', { method: 'POST', path: '/api/sites', body: site });
  assert.equal(response.status, 201, response.text);
}

/**
 * Adds a person as the demo admin and gives them roles: `everywhere` their role at every site
 * (null: none), `sites` their roles at single sites.
 */
export async function addPerson(
  server: TestServer,
  username: string,
  everywhere: 'admin' | 'cook' | 'reviewer' | null,
  sites: readonly { key: string; role: 'admin' | 'cook' | 'reviewer' }[],
): Promise<void> {
  const added = await send(server, 'rosa', {
    method: 'POST',
    path: '/api/people',
    body: { username, displayName: username, role: everywhere ?? 'cook', password: SITE_PASSWORD },
  });
  assert.equal(added.status, 201, added.text);
  const changed = await send(server, 'rosa', {
    method: 'PATCH',
    path: `/api/people/${added.json.person.id}`,
    body: { roleEverywhere: everywhere !== null, sites },
  });
  assert.equal(changed.status, 200, changed.text);
}
