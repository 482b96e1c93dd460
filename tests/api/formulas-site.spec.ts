import assert from 'node:assert/strict';
import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { before, describe, it } from 'node:test';
import { BELLY, send, suiteServer } from '../helpers/api-calls.ts';
import { OTHER_SITE, addPerson, addSite, sendAs } from '../helpers/site-fixture.ts';
import type { TestServer } from '../helpers/test-server.ts';

/** Writes a copy of a demo formula into the server's own folder under a new id, with `site:`. */
function copyFormula(server: TestServer, from: string, id: string, site: string): void {
  const text = readFileSync(path.join(server.formulasDir, `${from}.yaml`), 'utf8');
  const renamed = text.replace(/^id: .*$/m, `id: ${id}\nsite: ${site}`);
  assert.notEqual(renamed, text);
  writeFileSync(path.join(server.formulasDir, `${id}.yaml`), renamed);
}

/** A day far enough ahead for the belly's hold, as tests/api/plans.spec.ts plans. */
const SERVICE = new Date(Date.now() + 30 * 86_400_000).toISOString().slice(0, 10);

// Two sites of one group: main (the demo's) and a shop. A formula of the shop only is listed,
// shown, calculated, recorded and planned there, and at main is a formula that does not exist.
describe('formulas: a formula of one site only', () => {
  const server = suiteServer();
  const belly = { ...BELLY, formula: 'harbour-belly' };

  before(async () => {
    await addSite(server(), OTHER_SITE);
    await addPerson(server(), 'harbour-cook', null, [{ key: OTHER_SITE.key, role: 'cook' }]);
    await addPerson(server(), 'main-cook', null, [{ key: 'main', role: 'cook' }]);
    copyFormula(server(), 'quillmoor-belly', 'harbour-belly', OTHER_SITE.key);
    copyFormula(server(), 'smokehouse-burger', 'harbour-burger', OTHER_SITE.key);
    copyFormula(server(), 'quillmoor-belly', 'stray-belly', 'no-such-shop');
    // An assembly of the whole group with the shop's bacon in it.
    const burger = readFileSync(path.join(server().formulasDir, 'smokehouse-burger.yaml'), 'utf8');
    writeFileSync(
      path.join(server().formulasDir, 'group-burger.yaml'),
      burger
        .replace('id: smokehouse-burger', 'id: group-burger')
        .replace('formula: quillmoor-belly', 'formula: harbour-belly'),
    );
  });

  it('should list, show and calculate it at its own site', async () => {
    const list = await sendAs(server(), 'harbour-cook', { method: 'GET', path: '/api/formulas' });
    assert.equal(list.status, 200, list.text);
    const ids = list.json.formulas.map((f: { id: string }) => f.id);
    assert.ok(ids.includes('harbour-belly'), ids.join(' '));
    assert.ok(ids.includes('quillmoor-belly'), 'the group’s formulas are listed too');
    const shown = await sendAs(server(), 'harbour-cook', {
      method: 'GET',
      path: '/api/formulas/harbour-belly',
    });
    assert.equal(shown.status, 200, shown.text);
    assert.equal(shown.json.formula.site, OTHER_SITE.key);
    const calc = await sendAs(server(), 'harbour-cook', {
      method: 'POST',
      path: '/api/calc',
      body: belly,
    });
    assert.equal(calc.status, 200, calc.text);
    const revisions = await sendAs(server(), 'harbour-cook', {
      method: 'GET',
      path: '/api/formulas/harbour-belly/revisions',
    });
    assert.equal(revisions.status, 200, revisions.text);
  });

  it('should record a batch of it and plan with it at its own site', async () => {
    const recorded = await sendAs(server(), 'harbour-cook', {
      method: 'POST',
      path: '/api/batches',
      body: belly,
    });
    assert.equal(recorded.status, 201, recorded.text);
    assert.equal(recorded.json.batch.formula.id, 'harbour-belly');
    const plan = await sendAs(server(), 'harbour-cook', {
      method: 'POST',
      path: '/api/plans',
      body: { assembly: 'harbour-burger', count: 10, for: SERVICE },
    });
    assert.equal(plan.status, 200, plan.text);
  });

  it('should answer it at another site as a formula that does not exist', async () => {
    const list = await sendAs(server(), 'main-cook', { method: 'GET', path: '/api/formulas' });
    assert.equal(list.status, 200, list.text);
    const ids = list.json.formulas.map((f: { id: string }) => f.id);
    assert.ok(!ids.includes('harbour-belly'), 'listed at main');
    assert.ok(!ids.includes('harbour-burger'), 'listed at main');
    assert.ok(ids.includes('quillmoor-belly'));
    const missing = await sendAs(server(), 'main-cook', {
      method: 'GET',
      path: '/api/formulas/no-such-formula',
    });
    assert.equal(missing.status, 404);
    for (const call of [
      { method: 'GET', path: '/api/formulas/harbour-belly' },
      { method: 'GET', path: '/api/formulas/harbour-belly/revisions' },
      { method: 'POST', path: '/api/calc', body: belly },
      { method: 'POST', path: '/api/batches', body: belly },
      {
        method: 'POST',
        path: '/api/plans',
        body: { assembly: 'harbour-burger', count: 10, for: SERVICE },
      },
      {
        method: 'POST',
        path: '/api/plans/record',
        body: { assembly: 'harbour-burger', count: 10, for: SERVICE },
      },
    ] as const) {
      const answer = await sendAs(server(), 'main-cook', call);
      assert.equal(answer.status, 404, `${call.method} ${call.path}: ${answer.text}`);
      assert.equal(answer.json.error.code, missing.json.error.code);
      assert.match(answer.json.error.message, /no formula "harbour-(belly|burger)"/);
    }
    // The group's admin at main, naming the shop, sees it again: the site decides, not the person.
    const atShop = await send(server(), 'rosa', {
      method: 'GET',
      path: `/api/formulas/harbour-belly?site=${OTHER_SITE.key}`,
    });
    assert.equal(atShop.status, 200, atShop.text);
  });

  it("should show a group's assembly of another site's formula as broken there only", async () => {
    const atMain = await sendAs(server(), 'main-cook', {
      method: 'GET',
      path: '/api/formulas/group-burger',
    });
    assert.equal(atMain.status, 200, atMain.text);
    assert.equal(atMain.json.valid, false);
    assert.ok(
      atMain.json.problems.some((p: { message: string }) => p.message.includes('harbour-belly')),
      atMain.text,
    );
    const atShop = await sendAs(server(), 'harbour-cook', {
      method: 'GET',
      path: '/api/formulas/group-burger',
    });
    assert.equal(atShop.json.valid, true, atShop.text);
    const plan = await sendAs(server(), 'main-cook', {
      method: 'POST',
      path: '/api/plans',
      body: { assembly: 'group-burger', count: 10, for: SERVICE },
    });
    assert.equal(plan.status, 422, plan.text);
  });

  it('should show a formula naming no site of the install as a file with an error', async () => {
    for (const who of ['main-cook', 'harbour-cook']) {
      const list = await sendAs(server(), who, { method: 'GET', path: '/api/formulas' });
      const stray = list.json.formulas.find((f: { id: string }) => f.id === 'stray-belly');
      assert.ok(stray, `listed for ${who}`);
      assert.equal(stray.valid, false);
      assert.equal(stray.file, 'stray-belly.yaml');
      assert.equal(stray.errorCount, 1);
    }
    const shown = await sendAs(server(), 'main-cook', {
      method: 'GET',
      path: '/api/formulas/stray-belly',
    });
    assert.equal(shown.status, 200, shown.text);
    const problem = shown.json.problems.find((p: { severity: string }) => p.severity === 'error');
    assert.equal(problem.file, 'stray-belly.yaml');
    // The copy puts `site:` on the line after `id:`.
    const lines = readFileSync(path.join(server().formulasDir, 'stray-belly.yaml'), 'utf8');
    assert.equal(lines.split('\n')[problem.line - 1], 'site: no-such-shop');
    assert.match(problem.message, /no site "no-such-shop"/);
    const calc = await sendAs(server(), 'main-cook', {
      method: 'POST',
      path: '/api/calc',
      body: { ...BELLY, formula: 'stray-belly' },
    });
    assert.equal(calc.status, 422, calc.text);
    assert.match(calc.json.error.message, /stray-belly\.yaml/);
  });
});

// One kitchen: a formula naming its only site is like any other; naming another is an error.
describe('formulas: site on a single-site install', () => {
  const server = suiteServer();

  before(() => {
    copyFormula(server(), 'quillmoor-belly', 'main-belly', 'main');
    copyFormula(server(), 'quillmoor-belly', 'shop-belly', OTHER_SITE.key);
  });

  it('should calculate a formula naming the only site, and refuse one naming another', async () => {
    const calc = await send(server(), 'tobin', {
      method: 'POST',
      path: '/api/calc',
      body: { ...BELLY, formula: 'main-belly' },
    });
    assert.equal(calc.status, 200, calc.text);
    const other = await send(server(), 'tobin', {
      method: 'POST',
      path: '/api/calc',
      body: { ...BELLY, formula: 'shop-belly' },
    });
    assert.equal(other.status, 422, other.text);
    assert.match(other.json.error.message, /shop-belly\.yaml/);
  });
});
