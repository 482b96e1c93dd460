import assert from 'node:assert/strict';
import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { before, describe, it } from 'node:test';
import { QueryTypes } from 'sequelize';
import { BELLY, snapshot, suiteServer, type Call } from '../helpers/api-calls.ts';
import { ROUTES, makeFixture, type Fixture } from '../helpers/api-routes.ts';
import { OTHER_SITE, SITE_PASSWORD, addPerson, addSite, sendAs } from '../helpers/site-fixture.ts';
import { SITE_OUTCOMES, type SiteOutcome } from '../helpers/site-routes.ts';
import type { TestServer } from '../helpers/test-server.ts';

// Every route kept to the site (tests/helpers/site-routes.ts) × an admin of the other site only,
// sent what the role matrix sends an admin of the main site: the main site's batches, deliveries,
// readings and equipment. Each cell is a test of its own, so a failure names the route.

const STATUS: Readonly<Record<SiteOutcome, (status: number) => boolean>> = {
  'not-found': (status) => status === 404,
  'own-site': (status) => status < 400,
  'group-admin': (status) => status === 403,
};

/** Every lot code of the main site: none may appear in an answer to the other site. */
async function mainSiteLots(server: TestServer): Promise<string[]> {
  const rows = await server.context.db.sequelize.query<{ lot_code: string }>(
    `SELECT lot_code FROM batches WHERE site_id = 1 UNION ALL SELECT lot_code FROM receipts WHERE site_id = 1`,
    { type: QueryTypes.SELECT },
  );
  return rows.map((row) => row.lot_code);
}

describe('site matrix: every route kept to the site × a person with a role only at another site', () => {
  const server = suiteServer();
  let fx: Fixture;
  before(async () => {
    fx = await makeFixture(server());
    await addSite(server(), OTHER_SITE);
    await addPerson(server(), 'shop-admin', null, [{ key: OTHER_SITE.key, role: 'admin' }]);
  });

  it('should name only routes the role matrix has', () => {
    const known = new Set(ROUTES.map((route) => `${route.method} ${route.route}`));
    assert.deepEqual(
      Object.keys(SITE_OUTCOMES).filter((key) => !known.has(key)),
      [],
    );
  });

  for (const route of ROUTES) {
    const outcome = SITE_OUTCOMES[`${route.method} ${route.route}`];
    if (!outcome) continue;
    it(`should answer ${route.method} ${route.route} for the other site's admin: ${outcome}`, async () => {
      const call = await route.prepare(fx, 'admin');
      // The own-password route checks the current password: the person's own.
      const body =
        route.route === '/api/people/me/password'
          ? { current: SITE_PASSWORD, password: SITE_PASSWORD }
          : call.body;
      const lots = await mainSiteLots(server());
      const stored = await snapshot(server());
      const response = await sendAs(server(), 'shop-admin', { ...call, body });
      assert.ok(STATUS[outcome](response.status), `${response.status}: ${response.text}`);
      // A 404 may repeat the code the request itself named; any other is the main site's data.
      const asked = `${call.path} ${JSON.stringify(body ?? '')}`.toUpperCase();
      const named = lots.filter(
        (lot) => response.text.includes(lot) && !asked.includes(lot.toUpperCase()),
      );
      assert.deepEqual(named, [], `the answer names the main site's ${named.join(', ')}`);
      if (outcome !== 'own-site') assert.deepEqual(await snapshot(server()), stored);
    });
  }
});

// The same across the formula routes, for a formula of the main site only (`site: main`): the
// other site's admin gets, on every route that names it, the very answer for a formula that was
// never written (404, or no costs), and never its title; the main site's admin gets them answered.
describe('site matrix: a formula of the main site only × the other site’s admin', () => {
  const server = suiteServer();
  const ID = 'main-only-belly';
  const TITLE = 'Main kitchen only belly';
  const GHOST = 'never-written-belly';
  let revision = '';

  before(async () => {
    await addSite(server(), OTHER_SITE);
    await addPerson(server(), 'shop-admin', null, [{ key: OTHER_SITE.key, role: 'admin' }]);
    await addPerson(server(), 'main-admin', null, [{ key: 'main', role: 'admin' }]);
    const text = readFileSync(path.join(server().formulasDir, 'quillmoor-belly.yaml'), 'utf8');
    const own = text
      .replace(/^id: .*$/m, `id: ${ID}\nsite: main`)
      .replace(/^title: .*$/m, `title: ${TITLE}`);
    assert.notEqual(own, text);
    writeFileSync(path.join(server().formulasDir, `${ID}.yaml`), own);
    const shown = await sendAs(server(), 'main-admin', {
      method: 'GET',
      path: `/api/formulas/${ID}`,
    });
    assert.equal(shown.status, 200, shown.text);
    revision = shown.json.revision;
    // A batch of it at main, so that main's costs of it are not the empty answer.
    const recorded = await sendAs(server(), 'main-admin', {
      method: 'POST',
      path: '/api/batches',
      body: { ...BELLY, formula: ID },
    });
    assert.equal(recorded.status, 201, recorded.text);
  });

  const calls = (): { name: string; call: Call }[] => [
    {
      name: 'POST /api/calc',
      call: { method: 'POST', path: '/api/calc', body: { ...BELLY, formula: ID } },
    },
    { name: 'GET /api/formulas/:id', call: { method: 'GET', path: `/api/formulas/${ID}` } },
    {
      name: 'GET /api/formulas/:id/revisions',
      call: { method: 'GET', path: `/api/formulas/${ID}/revisions` },
    },
    {
      name: 'GET /api/formulas/:id/revisions/:revision',
      call: { method: 'GET', path: `/api/formulas/${ID}/revisions/${revision}` },
    },
    {
      name: 'GET /api/formulas/:id/diff',
      call: { method: 'GET', path: `/api/formulas/${ID}/diff?from=${revision}` },
    },
    {
      name: 'POST /api/formulas/:id/preview',
      call: { method: 'POST', path: `/api/formulas/${ID}/preview`, body: { batch: BELLY.batch } },
    },
    {
      name: 'GET /api/formulas/:id/costs',
      call: { method: 'GET', path: `/api/formulas/${ID}/costs` },
    },
    {
      name: 'POST /api/batches',
      call: { method: 'POST', path: '/api/batches', body: { ...BELLY, formula: ID } },
    },
  ];

  for (const { name } of calls()) {
    it(`should answer ${name} naming it at the other site as for no such formula`, async () => {
      const { call } = calls().find((entry) => entry.name === name)!;
      const ghost = JSON.parse(JSON.stringify(call).replaceAll(ID, GHOST)) as Call;
      const stored = await snapshot(server());
      const refused = await sendAs(server(), 'shop-admin', call);
      const nowhere = await sendAs(server(), 'shop-admin', ghost);
      assert.equal(refused.status, nowhere.status, refused.text);
      assert.equal(refused.text.replaceAll(ID, GHOST), nowhere.text);
      assert.ok(!refused.text.includes(TITLE), refused.text);
      assert.deepEqual(await snapshot(server()), stored);
      const answered = await sendAs(server(), 'main-admin', call);
      assert.ok(answered.status < 400, `${answered.status}: ${answered.text}`);
      assert.notEqual(answered.text.replaceAll(ID, GHOST), nowhere.text);
    });
  }

  it('should leave it out of the other site’s formula list, and list it at main', async () => {
    const shop = await sendAs(server(), 'shop-admin', { method: 'GET', path: '/api/formulas' });
    const main = await sendAs(server(), 'main-admin', { method: 'GET', path: '/api/formulas' });
    const ids = (answer: typeof shop) => answer.json.formulas.map((f: { id: string }) => f.id);
    assert.equal(shop.status, 200, shop.text);
    assert.ok(!ids(shop).includes(ID) && !shop.text.includes(TITLE), shop.text);
    assert.ok(ids(main).includes(ID), ids(main).join(' '));
  });
});
