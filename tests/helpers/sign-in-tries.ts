import { rawRequest } from './raw-http.ts';
import type { TestServer } from './test-server.ts';

/**
 * A sign-in through the form, as a browser sends it; its status.
 * @param server The test server.
 */
export async function formSignIn(
  server: TestServer,
  username: string,
  password: string,
): Promise<number> {
  const response = await rawRequest(server.url, {
    method: 'POST',
    path: '/api/session',
    body: { username, password },
  });
  return response.status;
}

/**
 * A read of the batch log signed with HTTP Basic, as a script sends it; its status.
 * @param server The test server.
 */
export async function basicRead(
  server: TestServer,
  username: string,
  password: string,
): Promise<number> {
  const response = await rawRequest(server.url, {
    path: '/api/batches?limit=1',
    headers: {
      authorization: `Basic ${Buffer.from(`${username}:${password}`).toString('base64')}`,
    },
  });
  return response.status;
}
