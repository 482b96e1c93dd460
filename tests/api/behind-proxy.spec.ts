// Production behind a reverse proxy that ends TLS: Secure session cookies, HSTS, and sign-in
// limits counted per real client (X-Forwarded-For, believed only from the proxy).
import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { PASSWORDS, startTestServer } from '../helpers/test-server.ts';

const HTTPS_PRODUCTION = {
  LARDER_MODE: 'production',
  LARDER_SESSION_SECRET: 'a-test-secret-that-is-long-enough-for-production',
  LARDER_PUBLIC_URL: 'https://larder.example.com',
  LARDER_TRUST_PROXY: 'loopback',
};

/** A sign-in through the form, as the proxy passes it on for a client. */
function signIn(
  url: string,
  password: string,
  forwarded: Record<string, string>,
): Promise<Response> {
  return fetch(`${url}/api/session`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', ...forwarded },
    body: JSON.stringify({ username: 'imke', password }),
  });
}

describe('production behind a reverse proxy', () => {
  it('should set the session cookie Secure and send HSTS with every answer', async (t) => {
    const server = await startTestServer(t, HTTPS_PRODUCTION);
    const response = await signIn(server.url, PASSWORDS.imke, {
      'x-forwarded-proto': 'https',
      'x-forwarded-for': '203.0.113.7',
    });
    assert.equal(response.status, 201);
    const cookie = response.headers.get('set-cookie') ?? '';
    assert.match(cookie, /larder\.sid=/);
    assert.match(cookie, /;\s*Secure/i);
    assert.match(cookie, /;\s*HttpOnly/i);
    assert.match(cookie, /SameSite=Strict/i);
    // source: RFC 6797 §6.1 (Strict-Transport-Security: max-age in seconds)
    assert.match(response.headers.get('strict-transport-security') ?? '', /^max-age=31536000$/);
    const health = await fetch(`${server.url}/api/health`);
    assert.match(health.headers.get('strict-transport-security') ?? '', /max-age=/);
  });

  it('should count failed sign-ins per client behind the proxy, not per proxy', async (t) => {
    const server = await startTestServer(t, { ...HTTPS_PRODUCTION, LARDER_SIGN_IN_LIMIT: '3' });
    const from = (address: string) => ({
      'x-forwarded-proto': 'https',
      'x-forwarded-for': address,
    });
    const guesser = [];
    for (let i = 0; i < 4; i += 1)
      guesser.push((await signIn(server.url, `guess-${i}`, from('198.51.100.23'))).status);
    assert.deepEqual(guesser, [401, 401, 401, 429]);
    // Another client through the same proxy is not held up by the guesser.
    const other = await signIn(server.url, PASSWORDS.imke, from('203.0.113.40'));
    assert.equal(other.status, 201);
  });

  it('should not believe X-Forwarded-For from a client when no proxy is set', async (t) => {
    const server = await startTestServer(t, { LARDER_SIGN_IN_LIMIT: '3' });
    const statuses = [];
    // A guesser naming a new address each time is still one address: its own.
    for (let i = 0; i < 4; i += 1)
      statuses.push(
        (await signIn(server.url, `guess-${i}`, { 'x-forwarded-for': `192.0.2.${i}` })).status,
      );
    assert.deepEqual(statuses, [401, 401, 401, 429]);
  });

  it('should send no HSTS and no Secure cookie in the demo on plain http', async (t) => {
    const server = await startTestServer(t);
    const response = await signIn(server.url, PASSWORDS.imke, {});
    assert.equal(response.status, 201);
    assert.doesNotMatch(response.headers.get('set-cookie') ?? '', /Secure/i);
    assert.equal(response.headers.get('strict-transport-security'), null);
  });
});
