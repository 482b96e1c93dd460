import assert from 'node:assert/strict';
import { before, describe, it } from 'node:test';
import {
  assertErrorEnvelope,
  cookieSession,
  send,
  snapshot,
  suiteServer,
  type CookieSession,
} from '../helpers/api-calls.ts';

const cursorOf = (json: unknown): string =>
  Buffer.from(JSON.stringify(json), 'utf8').toString('base64url');

describe('bad uploads, unknown routes and bad query parameters', () => {
  const server = suiteServer();
  let rosa: CookieSession;
  before(async () => {
    rosa = await cookieSession(server(), 'rosa');
  });

  /** Sends each request as the admin; each must be a 4xx JSON error that stores nothing. */
  async function refuse(
    calls: readonly { method?: string; path: string; body?: unknown; headers?: object }[],
    status?: number,
  ): Promise<void> {
    for (const { method = 'GET', path, body, headers } of calls) {
      const before = await snapshot(server());
      const call = { method, path, body, headers: headers as Record<string, string> };
      const response = await send(server(), rosa, call);
      const what = `${method} ${path}`;
      assertErrorEnvelope(response, what);
      if (status !== undefined) assert.equal(response.status, status, `${what}: ${response.text}`);
      assert.deepEqual(await snapshot(server()), before, `${what}: something was written`);
    }
  }

  const upload = (form: FormData) => ({ method: 'POST', path: '/api/formulas/upload', body: form });
  const fileForm = (...files: [field: string, text: string, name: string][]): FormData => {
    const form = new FormData();
    for (const [field, text, name] of files) form.append(field, new Blob([text]), name);
    return form;
  };
  const MIX =
    'formula: 1\nid: upload-mix\ntitle: Upload mix\nkind: mix\ningredients:\n  - { name: salt, pct: 100, base: true }\n';

  it('should refuse uploads that are not one formula file in multipart/form-data', async () => {
    await refuse([{ method: 'POST', path: '/api/formulas/upload', body: { file: MIX } }], 400);
    await refuse([upload(fileForm(['other', MIX, 'upload-mix.yaml']))], 400);
    await refuse([upload(fileForm(['file', MIX, 'a.yaml'], ['file', MIX, 'b.yaml']))], 400);
    await refuse([upload(fileForm(['file', 'x'.repeat(2 * 1024 * 1024), 'big.yaml']))], 413);
  });

  it('should answer a broken multipart body with 400, not 500', async () => {
    const head = '--XYZ\r\nContent-Disposition: form-data; name="file"; filename="a.yaml"\r\n\r\n';
    const multipart = (boundary: string) => ({
      'content-type': `multipart/form-data${boundary}`,
    });
    await refuse(
      [
        {
          method: 'POST',
          path: '/api/formulas/upload',
          body: head + MIX,
          headers: multipart('; boundary=XYZ'),
        },
        { method: 'POST', path: '/api/formulas/upload', body: 'hello', headers: multipart('') },
        {
          method: 'POST',
          path: '/api/formulas/upload',
          body: 'no parts',
          headers: multipart('; boundary=XYZ'),
        },
      ],
      400,
    );
  });

  it('should answer unknown API routes and methods with a JSON 404', async () => {
    await refuse(
      [
        { path: '/api/nope' },
        { path: '/api' },
        { path: '/api/batches/240229-QB-01/events/1' },
        { method: 'POST', path: '/api/health', body: {} },
        { method: 'DELETE', path: '/api/formulas/house-sauce' },
        { method: 'PUT', path: '/api/batches', body: {} },
        { method: 'PATCH', path: '/api/audit', body: {} },
      ],
      404,
    );
    const anonymous = await send(server(), 'anonymous', { method: 'GET', path: '/api/nope' });
    assert.equal(anonymous.status, 401, 'the sign-in gate comes before the 404');
  });

  it('should refuse list and export parameters of the wrong type with 400', async () => {
    const list = [
      'limit=abc',
      'limit=0',
      'limit=201',
      'limit=1.5',
      'limit=-1',
      'from=not-a-date',
      'to=2024-02-30',
      'from=2024-03-01&to=2024-02-01',
      'sort=bogus',
      'order=sideways',
      'cursor=garbage',
      `cursor=${cursorOf([])}`,
      `cursor=${cursorOf({ s: 'lot', o: 'asc', k: 'X', i: 1, d: 'n' })}`,
      'signedOff=maybe',
      'operator=abc',
      'status=cooking',
      'kind=soup',
      'formula=Not_An_Id',
      'limt=5',
      'kind=cure&kind=mix',
    ];
    await refuse(
      list.map((query) => ({ path: `/api/batches?${query}` })),
      400,
    );
    const csv = ['limit=5', 'cursor=x', 'sort=bogus', 'from=not-a-date', 'status=cooking'];
    await refuse(
      csv.map((query) => ({ path: `/api/batches.csv?${query}` })),
      400,
    );
    const audit = ['limit=abc', 'limit=0', 'limit=501', 'before=abc', 'before=0', 'before=1.5'];
    await refuse(
      audit.map((query) => ({ path: `/api/audit?${query}` })),
      400,
    );
    await refuse(
      [
        { path: '/api/formulas?kind=soup' },
        { path: '/api/formulas?kind=cure&kind=mix' },
        { path: '/api/formulas/house-sauce/diff' },
        { path: '/api/formulas/house-sauce/diff?from=not-a-revision' },
        { path: `/api/formulas/house-sauce/diff?from=${'0'.repeat(64)}&to=abc` },
        { path: `/api/formulas/house-sauce/revisions/not-a-revision` },
      ],
      400,
    );
  });

  it('should refuse a repeated cursor on the batch list with 400', async () => {
    await refuse([{ path: '/api/batches?limit=1&cursor=a&cursor=b' }], 400);
  });

  it('should refuse a repeated action filter on the audit log with 400', async () => {
    await refuse([{ path: '/api/audit?action=sign-in&action=person-add' }], 400);
  });

  it('should refuse unknown parameters on the formula list and the audit log with 400', async () => {
    await refuse(
      [
        { path: '/api/formulas?sort=bogus' },
        { path: '/api/formulas?kinds=cure' },
        { path: '/api/audit?sort=bogus' },
        { path: '/api/audit?actions=sign-in' },
      ],
      400,
    );
  });

  it('should refuse a person id that is not written as a whole number with 400', async () => {
    const body = { displayName: 'Rosa Quennick (head cook)' };
    await refuse(
      ['1e0', '0x1', '1.0', '%201'].map((id) => ({
        method: 'PATCH',
        path: `/api/people/${id}`,
        body,
      })),
      400,
    );
  });
});
