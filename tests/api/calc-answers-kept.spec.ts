// POST /api/calc keeps finished answers (server/calc/calc-answers.ts). Each answer here is
// checked against a second server that keeps none (LARDER_CALC_CACHE=0) on the same formula
// texts: a kept answer must be the answer the calculation gives, whatever was asked before.
import assert from 'node:assert/strict';
import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { startTestServer, type TestServer } from '../helpers/test-server.ts';

const SAUCE = { formula: 'house-sauce', batch: { total: '2kg' } };

/** The answer of a server that keeps no answers, with the same formula file's text. */
async function worked(
  fresh: TestServer,
  file: string,
  text: string,
  body: unknown,
): Promise<{ status: number; text: string }> {
  writeFileSync(path.join(fresh.formulasDir, file), text);
  const response = await fresh.as('tobin').post('/api/calc', body);
  return { status: response.status, text: response.text };
}

/** Asks until the answer is not `old` (a folder watch tells of a change in a moment), at most 10 s. */
async function askUntilChanged(
  server: TestServer,
  body: unknown,
  old: string,
): Promise<{ status: number; text: string }> {
  let response = await server.as('tobin').post('/api/calc', body);
  for (let tries = 0; tries < 40 && response.text === old; tries++) {
    await new Promise((resolve) => setTimeout(resolve, 250));
    response = await server.as('tobin').post('/api/calc', body);
  }
  return { status: response.status, text: response.text };
}

describe('calculation answers kept by the server', () => {
  it('should answer a formula saved through the API with its new amounts on the next request', async (t) => {
    const server = await startTestServer(t);
    const fresh = await startTestServer(t, { LARDER_CALC_CACHE: '0' });
    const tobin = server.as('tobin');
    const first = await tobin.post('/api/calc', SAUCE);
    const again = await tobin.post('/api/calc', SAUCE);
    assert.equal(first.status, 200, first.text);
    assert.equal(again.text, first.text);
    assert.equal(server.context.calcAnswers.stats().found, 1, 'the second was the kept answer');

    const rosa = server.as('rosa');
    const got = await rosa.get('/api/formulas/house-sauce');
    const yaml = (got.json.yaml as string).replace('pct: 25 }', 'pct: 30 }');
    const saved = await rosa.request(
      'PUT',
      '/api/formulas/house-sauce',
      { yaml, message: 'More chili' },
      { 'if-match': `"${got.json.revision as string}"` },
    );
    assert.equal(saved.status, 200, saved.text);
    const after = await tobin.post('/api/calc', SAUCE);
    assert.equal(after.status, 200, after.text);
    assert.notEqual(after.text, first.text);
    assert.equal(after.text, (await worked(fresh, 'house-sauce.yaml', yaml, SAUCE)).text);
  });

  it('should follow a formula file changed on disk by another program, broken and mended', async (t) => {
    const server = await startTestServer(t);
    const fresh = await startTestServer(t, { LARDER_CALC_CACHE: '0' });
    const file = path.join(server.formulasDir, 'house-sauce.yaml');
    const original = readFileSync(file, 'utf8');
    // Twice: the folder watch starts on the first read, and the second answer is the kept one.
    await server.as('tobin').post('/api/calc', SAUCE);
    const before = await server.as('tobin').post('/api/calc', SAUCE);
    assert.equal(before.status, 200, before.text);

    // As a git pull or an editor writes it, behind the server's back.
    const changed = original.replace('pct: 8 }', 'pct: 12 }');
    writeFileSync(file, changed);
    const after = await askUntilChanged(server, SAUCE, before.text);
    assert.equal(after.status, 200, after.text);
    assert.equal(after.text, (await worked(fresh, 'house-sauce.yaml', changed, SAUCE)).text);

    // Broken, the file is refused, although an answer of the same body is kept.
    writeFileSync(file, original.replace('kind: mix', 'kind: [mix'));
    const broken = await askUntilChanged(server, SAUCE, after.text);
    assert.equal(broken.status, 422, broken.text);

    // Mended to its first text: the first text's answer.
    writeFileSync(file, original);
    const mended = await askUntilChanged(server, SAUCE, broken.text);
    assert.equal(mended.status, 200, mended.text);
    assert.equal(mended.text, before.text);
  });

  it('should work out an assembly afresh when a formula it is made from changes', async (t) => {
    const server = await startTestServer(t);
    const fresh = await startTestServer(t, { LARDER_CALC_CACHE: '0' });
    const pack = { formula: 'bacon-pack', batch: { count: '40' } };
    await server.as('tobin').post('/api/calc', pack);
    const before = await server.as('tobin').post('/api/calc', pack);
    assert.equal(before.status, 200, before.text);
    // The belly is renamed, as the pack's answer names it. The pack's own file is unchanged.
    const belly = path.join(server.formulasDir, 'quillmoor-belly.yaml');
    const changed = readFileSync(belly, 'utf8').replace(
      'title: Quillmoor belly, dry equilibrium cure',
      'title: Quillmoor belly, dry equilibrium cure (house)',
    );
    writeFileSync(belly, changed);
    const after = await askUntilChanged(server, pack, before.text);
    assert.equal(after.status, 200, after.text);
    assert.notEqual(after.text, before.text);
    writeFileSync(path.join(fresh.formulasDir, 'quillmoor-belly.yaml'), changed);
    assert.equal(after.text, (await fresh.as('tobin').post('/api/calc', pack)).text);
  });

  it('should give each batch its own answer, in any order of its options, and keep no refusal', async (t) => {
    const server = await startTestServer(t);
    const fresh = await startTestServer(t, { LARDER_CALC_CACHE: '0' });
    const tobin = server.as('tobin');
    const bodies = [
      SAUCE,
      { formula: 'house-sauce', batch: { total: '3kg' } },
      { formula: 'house-sauce', batch: { total: '2kg' }, units: 'us' },
      { formula: 'quillmoor-belly', batch: { meat: '4.26kg', thickness: '4cm' } },
      { formula: 'quillmoor-belly', batch: { thickness: '4cm', meat: '4.26kg' } },
      { formula: 'quillmoor-belly', batch: { meat: '4.26kg', thickness: '5cm' } },
      { formula: 'pit-bun', batch: { pieces: '24' } },
      { formula: 'bacon-pack', batch: { count: '12' } },
    ];
    // Twice round: the second round is answered from what the first kept.
    for (const round of [1, 2])
      for (const body of bodies) {
        const ours = await tobin.post('/api/calc', body);
        const theirs = await fresh.as('tobin').post('/api/calc', body);
        assert.equal(ours.status, 200, `${JSON.stringify(body)}: ${ours.text}`);
        assert.equal(ours.text, theirs.text, `round ${round}, ${JSON.stringify(body)}`);
      }
    const kept = server.context.calcAnswers.stats();
    // The belly's two orders of options are one batch: seven answers kept.
    assert.equal(kept.entries, 7);

    // A refused batch is worked out and refused again each time, never kept.
    const wrong = { formula: 'quillmoor-belly', batch: { meat: 'a lot', thickness: '4cm' } };
    for (const round of [1, 2]) {
      const refused = await tobin.post('/api/calc', wrong);
      assert.equal(refused.status, 400, `round ${round}: ${refused.text}`);
    }
    assert.equal(server.context.calcAnswers.stats().entries, 7);
  });

  it('should work out a batch with no start day again when the server’s day moves on', async (t) => {
    let now = new Date('2026-03-02T12:00:00Z');
    const server = await startTestServer(t, {}, { now: () => now });
    const belly = { formula: 'quillmoor-belly', batch: { meat: '4.26kg', thickness: '4cm' } };
    const monday = await server.as('tobin').post('/api/calc', belly);
    assert.equal(monday.status, 200, monday.text);
    now = new Date('2026-03-03T12:00:00Z');
    const tuesday = await server.as('tobin').post('/api/calc', belly);
    assert.equal(tuesday.status, 200, tuesday.text);
    assert.notEqual(tuesday.text, monday.text);
    assert.match(tuesday.text, /2026-03-03/);
  });

  it('should refuse a deactivated person at once, though their answer is kept', async (t) => {
    const server = await startTestServer(t);
    const tobin = await server.signIn('tobin');
    assert.equal((await tobin.post('/api/calc', SAUCE)).status, 200);
    assert.equal((await tobin.post('/api/calc', SAUCE)).status, 200);
    const people = (await server.as('rosa').get('/api/people')).json.people as {
      id: number;
      username: string;
    }[];
    const id = people.find((p) => p.username === 'tobin')?.id;
    const off = await server.as('rosa').request('PATCH', `/api/people/${id}`, { active: false });
    assert.equal(off.status, 200, off.text);
    assert.equal((await tobin.post('/api/calc', SAUCE)).status, 401);
    assert.equal((await server.as('tobin').post('/api/calc', SAUCE)).status, 401);
  });
});
