import assert from 'node:assert/strict';
import { createHash } from 'node:crypto';
import { existsSync, readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { startTestServer } from '../helpers/test-server.ts';
import { isFormulaFileName } from '../../shared/index.ts';

const sha256 = (text: string): string => createHash('sha256').update(text, 'utf8').digest('hex');

interface Line {
  name: string;
  grams: string;
}

function gramsOf(result: { groups: { lines: Line[] }[] }, name: string): number {
  const line = result.groups.flatMap((group) => group.lines).find((l) => l.name === name);
  assert.ok(line, `no line "${name}"`);
  return Number(line.grams);
}

describe('reading formulas', () => {
  it('should list every formula with its revision, validity and first sighting', async (t) => {
    const server = await startTestServer(t);
    const response = await server.as('imke').get('/api/formulas');
    assert.equal(response.status, 200);
    // Every formula file; the catalogue of materials beside them is not a formula.
    const files = readdirSync(server.formulasDir).filter(isFormulaFileName);
    assert.ok(readdirSync(server.formulasDir).includes('catalogue.yaml'));
    assert.equal(response.json.formulas.length, files.length);
    assert.deepEqual(
      response.json.formulas.filter((f: { file: string }) => f.file === 'catalogue.yaml'),
      [],
    );
    const belly = response.json.formulas.find((f: { id: string }) => f.id === 'quillmoor-belly');
    const text = readFileSync(path.join(server.formulasDir, 'quillmoor-belly.yaml'), 'utf8');
    assert.deepEqual(
      { ...belly, lastChangedAt: typeof belly.lastChangedAt },
      {
        id: 'quillmoor-belly',
        title: 'Quillmoor belly, dry equilibrium cure',
        kind: 'cure',
        file: 'quillmoor-belly.yaml',
        revision: sha256(text),
        valid: true,
        problemCount: 0,
        errorCount: 0,
        duplicate: false,
        lastChangedBy: null,
        lastChangedAt: 'string',
        lastChangeSource: 'disk',
      },
    );
    const history = await server.as('imke').get('/api/formulas/quillmoor-belly/revisions');
    assert.equal(history.json.revisions.length, 1);
    assert.equal(history.json.revisions[0].message, 'found on disk');
  });

  it('should filter the list by kind and refuse an unknown kind', async (t) => {
    const server = await startTestServer(t);
    const cures = await server.as('tobin').get('/api/formulas?kind=cure');
    assert.equal(cures.status, 200);
    assert.ok(cures.json.formulas.length > 0);
    assert.ok(cures.json.formulas.every((f: { kind: string }) => f.kind === 'cure'));
    assert.ok(cures.json.formulas.some((f: { id: string }) => f.id === 'ham-pump'));
    assert.equal((await server.as('tobin').get('/api/formulas?kind=soup')).status, 400);
    const assemblies = await server.as('tobin').get('/api/formulas?kind=assembly');
    assert.equal(assemblies.status, 200);
    assert.deepEqual(assemblies.json.formulas.map((f: { id: string }) => f.id).sort(), [
      'bacon-pack',
      'corned-beef-sandwich',
      'smokehouse-burger',
    ]);
  });

  it('should list a file with errors as not valid, with its problem count', async (t) => {
    const server = await startTestServer(t);
    const { writeFileSync } = await import('node:fs');
    writeFileSync(
      path.join(server.formulasDir, 'broken-rub.yaml'),
      'formula: 1\nid: broken-rub\ntitle: Broken\nkind: mix\ncolour: red\n',
    );
    const list = await server.as('rosa').get('/api/formulas?kind=mix');
    const broken = list.json.formulas.find((f: { id: string }) => f.id === 'broken-rub');
    assert.equal(broken.valid, false);
    assert.ok(broken.errorCount >= 1);
    assert.equal(broken.title, 'Broken');
  });

  it('should get one formula with its YAML, parsed formula and the revision as ETag', async (t) => {
    const server = await startTestServer(t);
    const text = readFileSync(path.join(server.formulasDir, 'house-sauce.yaml'), 'utf8');
    const response = await server.as('tobin').get('/api/formulas/house-sauce');
    assert.equal(response.status, 200);
    assert.equal(response.headers.get('etag'), `"${sha256(text)}"`);
    assert.equal(response.json.revision, sha256(text));
    assert.equal(response.json.yaml, text);
    assert.equal(response.json.formula.id, 'house-sauce');
    assert.equal(response.json.formula.ingredients[1].pct, 25);
    assert.deepEqual(response.json.problems, []);
    const again = await server
      .as('tobin')
      // fetch adds "Cache-Control: no-cache" to a conditional request unless one is given.
      .get('/api/formulas/house-sauce', {
        'if-none-match': `"${sha256(text)}"`,
        'cache-control': 'max-age=0',
      });
    assert.equal(again.status, 304);
  });

  it('should answer 404 for a formula that does not exist', async (t) => {
    const server = await startTestServer(t);
    const response = await server.as('imke').get('/api/formulas/no-such-formula');
    assert.equal(response.status, 404);
    assert.equal(response.json.error.code, 'not-found');
  });
});

describe('validating and previewing', () => {
  it('should validate YAML and give each problem its line and column, writing nothing', async (t) => {
    const server = await startTestServer(t);
    const before = readdirSync(server.formulasDir).sort();
    const schemaError = 'formula: 1\nid: red-rub\ntitle: Red rub\nkind: mix\ncolour: red\n';
    const response = await server.as('tobin').post('/api/formulas/validate', { yaml: schemaError });
    assert.equal(response.status, 200);
    assert.equal(response.json.usable, false);
    const colour = response.json.problems.find((p: { message: string }) =>
      p.message.includes('colour'),
    );
    // "colour:" is the key on line 5, column 1 of the text above.
    assert.equal(colour.line, 5);
    assert.equal(colour.column, 1);
    assert.equal(colour.severity, 'error');
    assert.ok(Array.isArray(colour.path));

    const syntax = await server
      .as('tobin')
      .post('/api/formulas/validate', { yaml: 'formula: 1\nid: red-rub\ntitle: [open\n' });
    assert.equal(syntax.json.usable, false);
    assert.ok(syntax.json.problems.every((p: { line: number }) => p.line >= 3));

    const good = readFileSync(path.join(server.formulasDir, 'brisket-rub.yaml'), 'utf8');
    const ok = await server.as('imke').post('/api/formulas/validate', { yaml: good });
    assert.equal(ok.json.usable, true);
    assert.equal(ok.json.id, 'brisket-rub');
    assert.deepEqual(readdirSync(server.formulasDir).sort(), before);
  });

  it('should preview unsaved YAML and the saved formula', async (t) => {
    const server = await startTestServer(t);
    const file = path.join(server.formulasDir, 'house-sauce.yaml');
    const text = readFileSync(file, 'utf8');
    const edited = text.replace('{ name: chili sauce, pct: 25 }', '{ name: chili sauce, pct: 50 }');
    assert.notEqual(edited, text);
    const unsaved = await server
      .as('tobin')
      .post('/api/formulas/house-sauce/preview', { yaml: edited, batch: { base: '1kg' } });
    assert.equal(unsaved.status, 200);
    assert.equal(unsaved.json.saved, false);
    // 50 % of a 1 kg base is 500 g (mix percentages are of the base).
    assert.equal(gramsOf(unsaved.json.result, 'chili sauce'), 500);
    const saved = await server
      .as('tobin')
      .post('/api/formulas/house-sauce/preview', { batch: { base: '1kg' } });
    assert.equal(saved.json.saved, true);
    assert.equal(saved.json.revision, sha256(text));
    // 25 % of a 1 kg base is 250 g.
    assert.equal(gramsOf(saved.json.result, 'chili sauce'), 250);
    assert.equal(readFileSync(file, 'utf8'), text);
  });

  it('should answer a preview of invalid YAML with 422 and its problems', async (t) => {
    const server = await startTestServer(t);
    const response = await server
      .as('tobin')
      .post('/api/formulas/house-sauce/preview', { yaml: 'formula: [', batch: { base: '1kg' } });
    assert.equal(response.status, 422);
    assert.equal(response.json.error.code, 'invalid-formula');
    assert.ok(response.json.error.details[0].line >= 1);
  });
});

describe('formula access and path safety', () => {
  it('should answer 401 to anonymous requests on every formulas route', async (t) => {
    const server = await startTestServer(t);
    const anonymous = server.as('anonymous');
    const revision = '0'.repeat(64);
    const calls = [
      anonymous.get('/api/formulas'),
      anonymous.get('/api/formulas/house-sauce'),
      anonymous.get('/api/formulas/house-sauce/revisions'),
      anonymous.get(`/api/formulas/house-sauce/revisions/${revision}`),
      anonymous.get(`/api/formulas/house-sauce/diff?from=${revision}`),
      anonymous.post('/api/formulas/validate', { yaml: 'formula: 1' }),
      anonymous.post('/api/formulas/house-sauce/preview', { batch: { base: '1kg' } }),
      anonymous.request('PUT', '/api/formulas/house-sauce', { yaml: 'x', message: 'x' }),
      anonymous.post('/api/formulas', { yaml: 'x', message: 'x' }),
      anonymous.post('/api/formulas/upload'),
    ];
    for (const response of await Promise.all(calls)) {
      assert.equal(response.status, 401);
      assert.equal(response.json.error.code, 'unauthenticated');
    }
  });

  it('should refuse ids that could reach outside the formulas folder with 400', async (t) => {
    const server = await startTestServer(t);
    const rosa = server.as('rosa');
    for (const route of [
      '/api/formulas/..%2Fpackage',
      '/api/formulas/..%2F..%2Fpackage',
      '/api/formulas/House-Sauce',
      '/api/formulas/x',
      '/api/formulas/..%2Fpackage/revisions',
    ]) {
      const response = await rosa.get(route);
      assert.equal(response.status, 400, route);
      assert.equal(response.json.error.code, 'bad-request');
    }
    const put = await rosa.request(
      'PUT',
      '/api/formulas/..%2Fpackage',
      { yaml: 'formula: 1', message: 'escape' },
      { 'if-match': `"${'0'.repeat(64)}"` },
    );
    assert.equal(put.status, 400);
    assert.equal(existsSync(path.join(server.dir, 'package')), false);
    assert.equal(existsSync(path.join(server.dir, 'package.yaml')), false);
  });
});
