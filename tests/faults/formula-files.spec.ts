import assert from 'node:assert/strict';
import { readFileSync, renameSync, unlinkSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { QueryTypes } from 'sequelize';
import { BELLY, cookieSession, send, type CookieSession } from '../helpers/api-calls.ts';
import { startTestServer, type ApiResponse, type TestServer } from '../helpers/test-server.ts';

/** Rows of the tables a batch record writes. */
async function batchRows(server: TestServer): Promise<{ batches: number; events: number }> {
  const [row] = await server.context.db.sequelize.query<{ batches: number; events: number }>(
    'SELECT (SELECT COUNT(*) FROM batches) AS batches, (SELECT COUNT(*) FROM batch_events) AS events',
    { type: QueryTypes.SELECT },
  );
  return { ...row };
}

function assertRefused(response: ApiResponse, status: number, code: string, what: string): void {
  assert.equal(response.status, status, `${what}: ${response.status} ${response.text}`);
  assert.match(response.headers.get('content-type') ?? '', /^application\/json/, what);
  assert.equal(response.json?.error?.code, code, `${what}: ${response.text}`);
}

const PIT_BUN = { formula: 'pit-bun', batch: { pieces: '24' } };
const RUB = { formula: 'brisket-rub', batch: { base: '1kg' } };

describe('formula files failing under the running server', () => {
  it('should answer 503 formulas-unavailable while the folder is gone, keep the batch log, and record nothing', async (t) => {
    const server = await startTestServer(t);
    const rosa: CookieSession = await cookieSession(server, 'rosa');
    const recorded = await send(server, rosa, {
      method: 'POST',
      path: '/api/batches',
      body: BELLY,
    });
    assert.equal(recorded.status, 201, recorded.text);
    const lot = recorded.json.batch.lotCode as string;
    const before = await batchRows(server);

    // Beside it in the test's folder, which is removed with everything in it.
    const away = `${server.formulasDir}.away`;
    renameSync(server.formulasDir, away);
    const needFolder = [
      { method: 'GET', path: '/api/formulas' },
      { method: 'GET', path: '/api/formulas/pit-bun' },
      { method: 'POST', path: '/api/calc', body: RUB },
      { method: 'POST', path: '/api/formulas/brisket-rub/preview', body: { batch: RUB.batch } },
      { method: 'POST', path: '/api/batches', body: BELLY },
      {
        method: 'POST',
        path: '/api/formulas',
        body: {
          yaml: 'formula: 1\nid: plain-salt\ntitle: Plain salt\nkind: mix\ningredients:\n  - { name: salt, pct: 100, base: true }\n',
          message: 'While the folder is gone',
        },
      },
      {
        method: 'POST',
        path: '/api/plans',
        body: { assembly: 'smokehouse-burger', count: 10, for: '2030-01-15' },
      },
    ];
    for (const call of needFolder) {
      const response = await send(server, rosa, call);
      const what = `${call.method} ${call.path}`;
      assertRefused(response, 503, 'formulas-unavailable', what);
      assert.match(response.json.error.message, /formulas folder cannot be read \(ENOENT\)/, what);
    }
    assert.deepEqual(await batchRows(server), before, 'a refused record left rows behind');

    // The batch log lives in the database: it reads, and moves along, without the folder.
    const list = await send(server, rosa, { method: 'GET', path: '/api/batches?limit=5' });
    assert.equal(list.status, 200, list.text);
    assert.ok(list.json.items.some((item: { lotCode: string }) => item.lotCode === lot));
    const one = await send(server, rosa, { method: 'GET', path: `/api/batches/${lot}` });
    assert.deepEqual(one.json.batch.result, recorded.json.batch.result);
    const moved = await send(server, rosa, {
      method: 'POST',
      path: `/api/batches/${lot}/status`,
      body: { to: 'curing' },
    });
    assert.equal(moved.status, 200, moved.text);
    // A calculation of YAML sent along needs no folder either.
    const inline = await send(server, rosa, {
      method: 'POST',
      path: '/api/calc',
      body: {
        formula: { yaml: readFileSync(path.join(away, 'brisket-rub.yaml'), 'utf8') },
        batch: RUB.batch,
      },
    });
    assert.equal(inline.status, 200, inline.text);

    renameSync(away, server.formulasDir);
    const back = await send(server, rosa, { method: 'POST', path: '/api/batches', body: BELLY });
    assert.equal(back.status, 201, back.text);
  });

  it('should answer 404 naming a deleted formula, and keep the other formulas and its batches', async (t) => {
    const server = await startTestServer(t);
    const rosa = await cookieSession(server, 'rosa');
    const sauce = await send(server, rosa, {
      method: 'POST',
      path: '/api/batches',
      body: { formula: 'house-sauce', batch: { total: '2kg' } },
    });
    assert.equal(sauce.status, 201, sauce.text);
    const lot = sauce.json.batch.lotCode as string;
    const before = await batchRows(server);

    unlinkSync(path.join(server.formulasDir, 'house-sauce.yaml'));
    const gone = [
      { method: 'GET', path: '/api/formulas/house-sauce' },
      {
        method: 'POST',
        path: '/api/calc',
        body: { formula: 'house-sauce', batch: { total: '2kg' } },
      },
      {
        method: 'POST',
        path: '/api/formulas/house-sauce/preview',
        body: { batch: { total: '2kg' } },
      },
      {
        method: 'POST',
        path: '/api/batches',
        body: { formula: 'house-sauce', batch: { total: '2kg' } },
      },
    ];
    for (const call of gone) {
      const response = await send(server, rosa, call);
      assertRefused(response, 404, 'not-found', `${call.method} ${call.path}`);
      assert.match(response.json.error.message, /no formula "house-sauce"/);
    }
    assert.deepEqual(await batchRows(server), before, 'a refused record left rows behind');

    const list = await send(server, rosa, { method: 'GET', path: '/api/formulas' });
    assert.equal(list.status, 200, list.text);
    const ids = list.json.formulas.map((f: { id: string }) => f.id);
    assert.ok(!ids.includes('house-sauce'));
    assert.ok(ids.includes('quillmoor-belly') && ids.includes('brisket-rub'));
    // Its batch and its history stay: the recorded revision is still there to read.
    const batch = await send(server, rosa, { method: 'GET', path: `/api/batches/${lot}` });
    assert.deepEqual(batch.json.batch.result, sauce.json.batch.result);
    const history = await send(server, rosa, {
      method: 'GET',
      path: '/api/formulas/house-sauce/revisions',
    });
    assert.equal(history.status, 200, history.text);
    assert.equal(history.json.currentRevision, null);
    assert.ok(history.json.revisions.length >= 1);
    const rub = await send(server, rosa, { method: 'POST', path: '/api/batches', body: RUB });
    assert.equal(rub.status, 201, rub.text);
  });

  it('should answer 422 naming a corrupted file and where it breaks, and keep the other formulas', async (t) => {
    const server = await startTestServer(t);
    const rosa = await cookieSession(server, 'rosa');
    const bunFile = path.join(server.formulasDir, 'pit-bun.yaml');
    const bunText = readFileSync(bunFile, 'utf8');
    const before = await batchRows(server);

    // Garbage bytes, as a bad disk or a half-copied file leaves them.
    writeFileSync(
      bunFile,
      Buffer.from([0xff, 0xfe, 0x00, 0x01, 0x9c, 0x80, 0x1b, 0x5b, 0x41, 0x00]),
    );
    // YAML that does not parse: a quote opened on line 3, column 8, never closed.
    writeFileSync(
      path.join(server.formulasDir, 'chuck-grind.yaml'),
      'formula: 1\nid: chuck-grind\ntitle: "Grind\nkind: blend\n',
    );
    const broken = [
      { file: 'pit-bun.yaml', path: '/api/batches', body: PIT_BUN, line: 1 },
      { file: 'pit-bun.yaml', path: '/api/calc', body: PIT_BUN, line: 1 },
      {
        file: 'chuck-grind.yaml',
        path: '/api/batches',
        body: { formula: 'chuck-grind', batch: { total: '20kg' } },
        line: 3,
      },
    ];
    for (const { file, path: route, body, line } of broken) {
      const response = await send(server, rosa, { method: 'POST', path: route, body });
      const what = `${route} with ${file}`;
      assertRefused(response, 422, 'invalid-formula', what);
      assert.equal(response.json.error.message, `the formula file ${file} has errors`);
      const [first] = response.json.error.details;
      assert.equal(first.file, file, what);
      assert.equal(first.line, line, what);
      assert.equal(typeof first.message, 'string', what);
    }
    const chuck = await send(server, rosa, {
      method: 'POST',
      path: '/api/batches',
      body: { formula: 'chuck-grind', batch: { total: '20kg' } },
    });
    assert.match(chuck.json.error.details[0].message, /quote/);
    // An assembly that uses them is refused too, naming the component at fault.
    const plan = await send(server, rosa, {
      method: 'POST',
      path: '/api/plans',
      body: { assembly: 'smokehouse-burger', count: 10, for: '2030-01-15' },
    });
    assert.equal(plan.status, 422, plan.text);
    assert.match(plan.text, /pit-bun|chuck-grind/);
    assert.deepEqual(await batchRows(server), before, 'a refused record left rows behind');

    // The list and the formula itself still answer, saying what is wrong.
    const list = await send(server, rosa, { method: 'GET', path: '/api/formulas' });
    assert.equal(list.status, 200, list.text);
    const byFile = new Map<string, { valid: boolean }>(
      list.json.formulas.map((f: { file: string; valid: boolean }) => [f.file, f]),
    );
    assert.equal(byFile.get('pit-bun.yaml')?.valid, false);
    assert.equal(byFile.get('chuck-grind.yaml')?.valid, false);
    assert.equal(byFile.get('quillmoor-belly.yaml')?.valid, true);
    const bun = await send(server, rosa, { method: 'GET', path: '/api/formulas/pit-bun' });
    assert.equal(bun.status, 200, bun.text);
    assert.equal(bun.json.valid, false);
    assert.ok(bun.json.problems.length > 0);

    const belly = await send(server, rosa, { method: 'POST', path: '/api/batches', body: BELLY });
    assert.equal(belly.status, 201, belly.text);
    // Mended, the file works again: the refusals were its content's.
    writeFileSync(bunFile, bunText);
    const mended = await send(server, rosa, {
      method: 'POST',
      path: '/api/batches',
      body: PIT_BUN,
    });
    assert.equal(mended.status, 201, mended.text);
  });
});
