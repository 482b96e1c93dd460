import assert from 'node:assert/strict';
import { before, describe, it } from 'node:test';
import { QueryTypes } from 'sequelize';
import { snapshot, suiteServer } from '../helpers/api-calls.ts';
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
