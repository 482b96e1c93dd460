import assert from 'node:assert/strict';
import { createHash } from 'node:crypto';
import { readFileSync, readdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import {
  PASSWORDS,
  startTestServer,
  type ApiClient,
  type TestServer,
} from '../helpers/test-server.ts';

const sha256 = (text: string): string => createHash('sha256').update(text, 'utf8').digest('hex');

function fileText(server: TestServer, name: string): string {
  return readFileSync(path.join(server.formulasDir, name), 'utf8');
}

function put(
  client: ApiClient,
  id: string,
  body: unknown,
  revision?: string,
): ReturnType<ApiClient['request']> {
  return client.request(
    'PUT',
    `/api/formulas/${id}`,
    body,
    revision === undefined ? {} : { 'if-match': `"${revision}"` },
  );
}

/** Leftover temporary files would mean a write was not cleaned up. */
function assertNoTemporaryFiles(server: TestServer): void {
  assert.deepEqual(
    readdirSync(server.formulasDir).filter((name) => name.endsWith('.tmp')),
    [],
  );
}

// A formula with comments everywhere a kitchen puts them: above keys, after values, in lists.
const COMMENTED = `# yaml-language-server: $schema=../shared/schema/formula.schema.json
# Quillmoor Smokehouse (an invented kitchen) — a test rub with many comments.
formula: 1 # file format version
id: comment-rub
title: Commented rub
kind: mix

# The base is the salt; everything else is a share of it.
ingredients:
  - { name: kosher salt, pct: 100, base: true } # weigh first
  # Coarse pepper, from the 16-mesh bag.
  - { name: coarse black pepper, pct: 60 }
  - { name: granulated garlic, pct: 12 } # was 10 until the spring menu
steps:
  - Mix in the bowl of the stand mixer for one minute. # low speed
`;

describe('saving a formula', () => {
  it('should save a structured formula change and keep every comment of the file', async (t) => {
    const server = await startTestServer(t);
    const rosa = await server.signIn('rosa'); // one sign-in, not a password check per request
    const original = fileText(server, 'quillmoor-belly.yaml');
    const got = await rosa.get('/api/formulas/quillmoor-belly');
    const formula = got.json.formula;
    formula.ingredients[2].pct = 1.5;
    const saved = await put(
      rosa,
      'quillmoor-belly',
      { formula, message: 'More brown sugar' },
      got.json.revision,
    );
    assert.equal(saved.status, 200, saved.text);
    const text = fileText(server, 'quillmoor-belly.yaml');
    assert.equal(saved.json.revision, sha256(text));
    assert.equal(saved.headers.get('etag'), `"${sha256(text)}"`);
    assert.equal(saved.json.previousRevision, got.json.revision);
    assert.equal(saved.json.commit, null);
    assert.deepEqual(saved.json.warnings, []);
    const comments = original.split('\n').filter((line) => line.startsWith('#'));
    assert.ok(comments.length >= 2, 'the demo belly has comments to keep');
    for (const comment of comments) assert.ok(text.includes(comment), comment);
    // Exactly one line differs: the one whose percentage changed.
    const before = original.split('\n');
    const after = text.split('\n');
    assert.equal(after.length, before.length);
    const changed = after.filter((line, i) => line !== before[i]);
    assert.deepEqual(changed, ['  - { name: dark brown sugar, pct: 1.5 }']);

    const history = await rosa.get('/api/formulas/quillmoor-belly/revisions');
    const [newest, first] = history.json.revisions;
    assert.equal(newest.source, 'save');
    assert.equal(newest.message, 'More brown sugar');
    assert.equal(newest.revision, sha256(text));
    assert.equal(newest.author.username, 'rosa');
    assert.equal(newest.current, true);
    assert.equal(first.source, 'disk');
    assert.equal(first.revision, got.json.revision);
    const audit = await rosa.get('/api/audit?action=formula-save');
    assert.equal(audit.json.events[0].subject, 'quillmoor-belly');
    assertNoTemporaryFiles(server);
  });

  it('should keep inline comments, comments above items and blank lines', async (t) => {
    const server = await startTestServer(t);
    writeFileSync(path.join(server.formulasDir, 'comment-rub.yaml'), COMMENTED);
    const rosa = await server.signIn('rosa'); // one sign-in, not a password check per request
    const got = await rosa.get('/api/formulas/comment-rub');
    assert.equal(got.json.valid, true, JSON.stringify(got.json.problems));
    const formula = got.json.formula;
    formula.ingredients[1].pct = 65;
    formula.ingredients.push({ name: 'chili flakes', pct: 4 });
    const saved = await put(rosa, 'comment-rub', { formula, message: 'Hotter' }, got.json.revision);
    assert.equal(saved.status, 200, saved.text);
    const expected = COMMENTED.replace(
      '  - { name: coarse black pepper, pct: 60 }',
      '  - { name: coarse black pepper, pct: 65 }',
    ).replace(
      '  - { name: granulated garlic, pct: 12 } # was 10 until the spring menu\n',
      '  - { name: granulated garlic, pct: 12 } # was 10 until the spring menu\n  - { name: chili flakes, pct: 4 }\n',
    );
    assert.equal(fileText(server, 'comment-rub.yaml'), expected);
  });

  it('should save YAML text sent as it is', async (t) => {
    const server = await startTestServer(t);
    const rosa = await server.signIn('rosa'); // one sign-in, not a password check per request
    const got = await rosa.get('/api/formulas/house-sauce');
    const yaml = got.json.yaml.replace('pct: 25 }', 'pct: 30 }');
    const saved = await put(
      rosa,
      'house-sauce',
      { yaml, message: 'More chili' },
      got.json.revision,
    );
    assert.equal(saved.status, 200, saved.text);
    assert.equal(fileText(server, 'house-sauce.yaml'), yaml);
    assert.equal(saved.json.changed, true);
    const again = await put(rosa, 'house-sauce', { yaml, message: 'Again' }, saved.json.revision);
    assert.equal(again.status, 200);
    assert.equal(again.json.changed, false);
  });

  it('should save through a console session with its CSRF token', async (t) => {
    const server = await startTestServer(t);
    const rosa = await server.signIn('rosa');
    const got = await rosa.get('/api/formulas/house-sauce');
    const yaml = got.json.yaml.replace('pct: 25 }', 'pct: 26 }');
    const saved = await put(
      rosa,
      'house-sauce',
      { yaml, message: 'A touch more' },
      got.json.revision,
    );
    assert.equal(saved.status, 200, saved.text);
  });
});

describe('refusing a save', () => {
  it('should answer 428 without If-Match and write nothing', async (t) => {
    const server = await startTestServer(t);
    const before = fileText(server, 'house-sauce.yaml');
    const response = await put(server.as('rosa'), 'house-sauce', {
      yaml: before.replace('pct: 25 }', 'pct: 30 }'),
      message: 'No precondition',
    });
    assert.equal(response.status, 428);
    assert.equal(response.json.error.code, 'precondition-required');
    assert.equal(fileText(server, 'house-sauce.yaml'), before);
  });

  it('should answer 409 to a stale If-Match with the current revision, and write nothing', async (t) => {
    const server = await startTestServer(t);
    const before = fileText(server, 'house-sauce.yaml');
    const response = await put(
      server.as('rosa'),
      'house-sauce',
      { yaml: before.replace('pct: 25 }', 'pct: 30 }'), message: 'Stale' },
      'a'.repeat(64),
    );
    assert.equal(response.status, 409);
    assert.equal(response.json.error.code, 'stale-revision');
    assert.deepEqual(response.json.error.details, [{ currentRevision: sha256(before) }]);
    assert.equal(fileText(server, 'house-sauce.yaml'), before);
  });

  it('should never let a second admin overwrite the first one’s save', async (t) => {
    const server = await startTestServer(t);
    const rosa = await server.signIn('rosa'); // one sign-in, not a password check per request
    const got = await rosa.get('/api/formulas/house-sauce');
    const first = got.json.yaml.replace('pct: 25 }', 'pct: 30 }');
    const second = got.json.yaml.replace('pct: 8 }', 'pct: 9 }');
    const [a, b] = await Promise.all([
      put(rosa, 'house-sauce', { yaml: first, message: 'First' }, got.json.revision),
      put(rosa, 'house-sauce', { yaml: second, message: 'Second' }, got.json.revision),
    ]);
    assert.deepEqual([a.status, b.status].sort(), [200, 409]);
    const winner = a.status === 200 ? first : second;
    assert.equal(fileText(server, 'house-sauce.yaml'), winner);
    const saves = (await rosa.get('/api/formulas/house-sauce/revisions')).json.revisions.filter(
      (r: { source: string }) => r.source === 'save',
    );
    assert.equal(saves.length, 1);
    assertNoTemporaryFiles(server);
  });

  it('should notice a file changed on disk between reading and saving', async (t) => {
    const server = await startTestServer(t);
    const rosa = await server.signIn('rosa'); // one sign-in, not a password check per request
    const got = await rosa.get('/api/formulas/house-sauce');
    // Someone pulls a change with git while the admin edits.
    const pulled = got.json.yaml.replace('pct: 3,', 'pct: 4,');
    assert.notEqual(pulled, got.json.yaml);
    writeFileSync(path.join(server.formulasDir, 'house-sauce.yaml'), pulled);
    const response = await put(
      rosa,
      'house-sauce',
      { yaml: got.json.yaml.replace('pct: 25 }', 'pct: 30 }'), message: 'Clobber?' },
      got.json.revision,
    );
    assert.equal(response.status, 409);
    assert.equal(response.json.error.code, 'stale-revision');
    assert.equal(response.json.error.details[0].currentRevision, sha256(pulled));
    assert.equal(fileText(server, 'house-sauce.yaml'), pulled);
    const history = await rosa.get('/api/formulas/house-sauce/revisions');
    const [newest] = history.json.revisions;
    assert.equal(newest.source, 'disk');
    assert.equal(newest.message, 'changed on disk');
    assert.equal(newest.revision, sha256(pulled));
    assert.equal(newest.author, null);
    const audit = await rosa.get('/api/audit?action=formula-disk-change');
    assert.equal(audit.json.events.length, 1);
    assert.deepEqual(audit.json.events[0].detail, {
      file: 'house-sauce.yaml',
      from: got.json.revision,
      to: sha256(pulled),
    });
  });

  it('should answer 422 with line numbers to invalid YAML and write nothing', async (t) => {
    const server = await startTestServer(t);
    const rosa = await server.signIn('rosa'); // one sign-in, not a password check per request
    const got = await rosa.get('/api/formulas/house-sauce');
    const rows = (await rosa.get('/api/formulas/house-sauce/revisions')).json.revisions.length;
    const broken = got.json.yaml.replace('kind: mix', 'kind: mix\ncolour: red');
    const response = await put(
      rosa,
      'house-sauce',
      { yaml: broken, message: 'Broken' },
      got.json.revision,
    );
    assert.equal(response.status, 422);
    assert.equal(response.json.error.code, 'invalid-formula');
    const colour = response.json.error.details.find((p: { message: string }) =>
      p.message.includes('colour'),
    );
    // "colour:" is inserted right after "kind: mix", which is line 6 of house-sauce.yaml.
    assert.equal(colour.line, 7);
    assert.equal(colour.column, 1);
    const syntax = await put(
      rosa,
      'house-sauce',
      { yaml: 'formula: 1\nid: house-sauce\ningredients: [\n', message: 'Broken' },
      got.json.revision,
    );
    assert.equal(syntax.status, 422);
    assert.ok(syntax.json.error.details[0].line >= 3);
    assert.equal(fileText(server, 'house-sauce.yaml'), got.json.yaml);
    const after = (await rosa.get('/api/formulas/house-sauce/revisions')).json.revisions.length;
    assert.equal(after, rows);
    assertNoTemporaryFiles(server);
  });

  it('should refuse a change of id, in YAML or in a structured formula', async (t) => {
    const server = await startTestServer(t);
    const rosa = await server.signIn('rosa'); // one sign-in, not a password check per request
    const got = await rosa.get('/api/formulas/house-sauce');
    const renamed = got.json.yaml.replace('id: house-sauce', 'id: other-sauce');
    const yaml = await put(rosa, 'house-sauce', { yaml: renamed, message: 'x' }, got.json.revision);
    assert.equal(yaml.status, 422);
    assert.equal(yaml.json.error.code, 'id-mismatch');
    // "id: other-sauce" is line 4 of house-sauce.yaml; the value starts at column 5.
    assert.deepEqual(
      { line: yaml.json.error.details[0].line, column: yaml.json.error.details[0].column },
      { line: 4, column: 5 },
    );
    const formula = { ...got.json.formula, id: 'other-sauce' };
    const json = await put(rosa, 'house-sauce', { formula, message: 'x' }, got.json.revision);
    assert.equal(json.status, 422);
    assert.equal(json.json.error.code, 'id-mismatch');
    const both = await put(
      rosa,
      'house-sauce',
      { yaml: got.json.yaml, formula: got.json.formula, message: 'x' },
      got.json.revision,
    );
    assert.equal(both.status, 400);
    assert.equal(fileText(server, 'house-sauce.yaml'), got.json.yaml);
  });

  it('should answer 403 to cooks and reviewers on every change, and write nothing', async (t) => {
    const server = await startTestServer(t);
    const got = await server.as('rosa').get('/api/formulas/house-sauce');
    const yaml = got.json.yaml.replace('pct: 25 }', 'pct: 30 }');
    const created = got.json.yaml.replace('id: house-sauce', 'id: cook-sauce');
    for (const user of ['tobin', 'imke'] as const) {
      const client = server.as(user);
      const form = new FormData();
      form.append('file', new Blob([created]), 'cook-sauce.yaml');
      const upload = await fetch(`${server.url}/api/formulas/upload`, {
        method: 'POST',
        headers: {
          authorization: `Basic ${Buffer.from(`${user}:${PASSWORDS[user]}`).toString('base64')}`,
          'x-larder-client': 'larder-tests',
        },
        body: form,
      });
      const responses = [
        await put(client, 'house-sauce', { yaml, message: 'x' }, got.json.revision),
        await client.post('/api/formulas', { yaml: created, message: 'x' }),
        { status: upload.status, text: '', json: await upload.json() },
      ];
      for (const response of responses) {
        assert.equal(response.status, 403, `${user}: ${response.text}`);
        assert.equal(response.json.error.code, 'forbidden');
      }
    }
    assert.equal(fileText(server, 'house-sauce.yaml'), got.json.yaml);
    assert.ok(!readdirSync(server.formulasDir).includes('cook-sauce.yaml'));
  });
});
