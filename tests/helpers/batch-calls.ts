import assert from 'node:assert/strict';
import { PASSWORDS, type ApiClient, type TestServer } from './test-server.ts';

export { BELLY } from './api-calls.ts';

/** A batch of the demo buns, started today (a start lies within a year of the server's today). */
export const BUN = {
  formula: 'pit-bun',
  batch: { pieces: '24', start: new Date().toISOString().slice(0, 10) },
} as const;

/** Records a batch and returns its lot code. */
export async function recordBatch(client: ApiClient, body: object): Promise<string> {
  const response = await client.post('/api/batches', body);
  assert.equal(response.status, 201, response.text);
  return response.json.batch.lotCode as string;
}

/** A batch as an admin reads it now, with its events. */
export interface ReadBatch {
  status: string;
  updatedAt: string;
  discardReason: string | null;
  operator: { id: number };
  signedOff: { by: { id: number; displayName: string }; at: string } | null;
  events: {
    type: string;
    by: { displayName: string };
    from: string | null;
    to: string | null;
    reason: string | null;
  }[];
}

/** The batch as it is now, with its events. */
export async function readBatch(server: TestServer, lot: string): Promise<ReadBatch> {
  const response = await server.as('rosa').get(`/api/batches/${lot}`);
  assert.equal(response.status, 200, response.text);
  return response.json.batch as ReadBatch;
}

/** A batch's label (or any file) as the head cook fetches it, its bytes whole: any role may. */
export async function fetchLabel(server: TestServer, route: string) {
  const auth = Buffer.from(`rosa:${PASSWORDS.rosa}`).toString('base64');
  const response = await fetch(server.url + route, { headers: { authorization: `Basic ${auth}` } });
  const bytes = new Uint8Array(await response.arrayBuffer());
  return { status: response.status, type: response.headers.get('content-type'), bytes };
}
