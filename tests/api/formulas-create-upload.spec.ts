import assert from 'node:assert/strict';
import { createHash } from 'node:crypto';
import { existsSync, readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import {
  PASSWORDS,
  startTestServer,
  type DemoUser,
  type TestServer,
} from '../helpers/test-server.ts';

const sha256 = (text: string): string => createHash('sha256').update(text, 'utf8').digest('hex');

// An invented seasoning of the demo kitchen.
const RUB = `# Quillmoor Smokehouse (an invented kitchen) — the salt for the smoked-salt caramel.
formula: 1
id: smoked-salt
title: Smoked finishing salt
kind: mix
ingredients:
  - { name: flaky sea salt, pct: 100, base: true }
  - { name: smoked paprika, pct: 2 } # sweet, not hot
`;

interface UploadResponse {
  status: number;
  headers: Headers;
  json: any; // eslint-disable-line @typescript-eslint/no-explicit-any -- tests read any shape
}

/** Sends one file as multipart/form-data, the way the console's upload button does. */
async function upload(
  server: TestServer,
  user: DemoUser,
  text: string | Uint8Array,
  fileName: string,
  options: { revision?: string; message?: string } = {},
): Promise<UploadResponse> {
  const form = new FormData();
  form.append('file', new Blob([text]), fileName);
  if (options.message !== undefined) form.append('message', options.message);
  const headers: Record<string, string> = {
    authorization: `Basic ${Buffer.from(`${user}:${PASSWORDS[user]}`).toString('base64')}`,
    'x-larder-client': 'larder-tests',
  };
  if (options.revision !== undefined) headers['if-match'] = `"${options.revision}"`;
  const response = await fetch(`${server.url}/api/formulas/upload`, {
    method: 'POST',
    headers,
    body: form,
  });
  return { status: response.status, headers: response.headers, json: await response.json() };
}

function fileText(server: TestServer, name: string): string {
  return readFileSync(path.join(server.formulasDir, name), 'utf8');
}

describe('creating a formula', () => {
  it('should create ID.yaml with a revision row and an audit entry', async (t) => {
    const server = await startTestServer(t);
    const rosa = await server.signIn('rosa'); // one sign-in, not a password check per request
    const response = await rosa.post('/api/formulas', { yaml: RUB, message: 'New finishing salt' });
    assert.equal(response.status, 201, response.text);
    assert.equal(response.headers.get('location'), '/api/formulas/smoked-salt');
    assert.equal(response.headers.get('etag'), `"${sha256(RUB)}"`);
    assert.equal(response.json.created, true);
    assert.equal(fileText(server, 'smoked-salt.yaml'), RUB);
    const got = await rosa.get('/api/formulas/smoked-salt');
    assert.equal(got.json.revision, sha256(RUB));
    const history = await rosa.get('/api/formulas/smoked-salt/revisions');
    assert.equal(history.json.revisions.length, 1);
    assert.equal(history.json.revisions[0].source, 'create');
    assert.equal(history.json.revisions[0].author.displayName.length > 0, true);
    const audit = await rosa.get('/api/audit?action=formula-create');
    assert.equal(audit.json.events[0].subject, 'smoked-salt');
  });

  it('should answer 409 when the id exists, and leave the file alone', async (t) => {
    const server = await startTestServer(t);
    const before = fileText(server, 'house-sauce.yaml');
    const copy = before.replace('title: Pit-house sandwich sauce', 'title: Another');
    const response = await server.as('rosa').post('/api/formulas', { yaml: copy, message: 'x' });
    assert.equal(response.status, 409);
    assert.equal(response.json.error.code, 'formula-exists');
    assert.equal(fileText(server, 'house-sauce.yaml'), before);
  });

  it('should answer 422 to an invalid formula and 400 to an id that is no id', async (t) => {
    const server = await startTestServer(t);
    const before = readdirSync(server.formulasDir).sort();
    const invalid = await server
      .as('rosa')
      .post('/api/formulas', { yaml: RUB.replace('kind: mix', 'kind: stew'), message: 'x' });
    assert.equal(invalid.status, 422);
    // "kind: stew" is line 5 of RUB.
    assert.ok(invalid.json.error.details.some((p: { line: number }) => p.line === 5));
    const escape = await server
      .as('rosa')
      .post('/api/formulas', { yaml: RUB.replace('id: smoked-salt', "id: '../x'"), message: 'x' });
    assert.equal(escape.status, 400);
    assert.equal(escape.json.error.code, 'bad-id');
    assert.deepEqual(readdirSync(server.formulasDir).sort(), before);
    assert.equal(existsSync(path.join(server.dir, 'x.yaml')), false);
  });
});

describe('uploading a formula file', () => {
  it('should create a formula named by the id inside the file, not the uploaded name', async (t) => {
    const server = await startTestServer(t);
    const response = await upload(server, 'rosa', RUB, 'My Salt (final).yml', {
      message: 'From the laptop',
    });
    assert.equal(response.status, 201, JSON.stringify(response.json));
    assert.equal(response.json.file, 'smoked-salt.yaml');
    assert.equal(fileText(server, 'smoked-salt.yaml'), RUB);
    assert.equal(existsSync(path.join(server.formulasDir, 'My Salt (final).yml')), false);
    const history = await server.as('rosa').get('/api/formulas/smoked-salt/revisions');
    assert.equal(history.json.revisions[0].source, 'upload');
    assert.equal(history.json.revisions[0].message, 'From the laptop');
  });

  it('should replace a formula only with a matching If-Match', async (t) => {
    const server = await startTestServer(t);
    const before = fileText(server, 'house-sauce.yaml');
    const changed = before.replace('pct: 25 }', 'pct: 28 }');
    const withoutRevision = await upload(server, 'rosa', changed, 'house-sauce.yaml');
    assert.equal(withoutRevision.status, 409);
    assert.equal(withoutRevision.json.error.code, 'formula-exists');
    const stale = await upload(server, 'rosa', changed, 'house-sauce.yaml', {
      revision: 'b'.repeat(64),
    });
    assert.equal(stale.status, 409);
    assert.equal(stale.json.error.code, 'stale-revision');
    assert.equal(fileText(server, 'house-sauce.yaml'), before);
    const replaced = await upload(server, 'rosa', changed, 'house-sauce.yaml', {
      revision: sha256(before),
    });
    assert.equal(replaced.status, 200, JSON.stringify(replaced.json));
    assert.equal(replaced.headers.get('etag'), `"${sha256(changed)}"`);
    assert.equal(fileText(server, 'house-sauce.yaml'), changed);
    const audit = await server.as('rosa').get('/api/audit?action=formula-upload');
    assert.equal(audit.json.events[0].subject, 'house-sauce');
  });

  it('should refuse an upload whose id would leave the folder, writing nothing', async (t) => {
    const server = await startTestServer(t);
    const before = readdirSync(server.formulasDir).sort();
    const beforeDir = readdirSync(server.dir).sort();
    const response = await upload(
      server,
      'rosa',
      RUB.replace('id: smoked-salt', "id: '../x'"),
      'x.yaml',
    );
    assert.equal(response.status, 400);
    assert.equal(response.json.error.code, 'bad-id');
    assert.deepEqual(readdirSync(server.formulasDir).sort(), before);
    assert.deepEqual(readdirSync(server.dir).sort(), beforeDir);
  });

  it('should refuse a file that is not YAML, too large, missing or invalid', async (t) => {
    const server = await startTestServer(t);
    const before = readdirSync(server.formulasDir).sort();
    const text = await upload(server, 'rosa', RUB, 'smoked-salt.txt');
    assert.equal(text.status, 415);
    // 256 KB is the largest formula file; one byte more is refused.
    const large = await upload(server, 'rosa', `${RUB}#${'x'.repeat(256 * 1024)}\n`, 'big.yaml');
    assert.equal(large.status, 413);
    const invalid = await upload(server, 'rosa', RUB.replace('pct: 2 }', 'pct: two }'), 'a.yaml');
    assert.equal(invalid.status, 422);
    assert.ok(invalid.json.error.details.some((p: { line: number }) => p.line === 8));
    const notUtf8 = await upload(server, 'rosa', new Uint8Array([0x66, 0xff, 0xfe]), 'b.yaml');
    assert.equal(notUtf8.status, 422);
    const empty = await fetch(`${server.url}/api/formulas/upload`, {
      method: 'POST',
      headers: {
        authorization: `Basic ${Buffer.from(`rosa:${PASSWORDS.rosa}`).toString('base64')}`,
        'x-larder-client': 'larder-tests',
      },
      body: new FormData(),
    });
    assert.equal(empty.status, 400);
    assert.deepEqual(readdirSync(server.formulasDir).sort(), before);
  });
});
