import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { QueryTypes } from 'sequelize';
import { seedableDemo } from './demo-template.ts';
import { ownTemplateWhenAlone, testPostgresUrl } from './test-database.ts';
import { startTestServer, type TestServer } from './test-server.ts';

describe('which test servers copy the seeded demo', () => {
  it('should copy it for the settings that change nothing of the seed, one site or two', () => {
    assert.deepEqual(seedableDemo({}, undefined), { sites: 1 });
    assert.deepEqual(seedableDemo({ LARDER_CONSOLE: '/x', LARDER_DEMO_SITES: '2' }, undefined), {
      sites: 2,
    });
  });

  it('should leave a server with a clock, a workflow setting or a kitchen name to seed its own', () => {
    assert.equal(
      seedableDemo({}, () => new Date()),
      undefined,
    );
    assert.equal(seedableDemo({ LARDER_LOCK_SIGNED_OFF: '1' }, undefined), undefined);
    assert.equal(seedableDemo({ LARDER_KITCHEN: 'Harbour' }, undefined), undefined);
    assert.equal(seedableDemo({ LARDER_FORMULAS: '/elsewhere' }, undefined), undefined);
    assert.equal(seedableDemo({ LARDER_DEMO_SITES: '3' }, undefined), undefined);
  });
});

/** What the demo wrote, table by table, in an order that does not depend on insertion. */
async function demoRecords(server: TestServer): Promise<Record<string, unknown[]>> {
  const rows = (sql: string) =>
    server.context.db.sequelize.query(sql, { type: QueryTypes.SELECT, raw: true });
  return {
    sites: await rows('SELECT key, name FROM sites ORDER BY key'),
    people: await rows('SELECT username, role FROM people ORDER BY username'),
    batches: await rows(
      'SELECT lot_code, formula_id, status, started_on FROM batches ORDER BY lot_code',
    ),
    receipts: await rows('SELECT lot_code, item, supplier_lot FROM receipts ORDER BY lot_code'),
    equipment: await rows('SELECT name FROM equipment ORDER BY name'),
  };
}

// Only a PostgreSQL run copies it: each SQLite test server seeds its own file.
const adminUrl = testPostgresUrl();
if (adminUrl)
  describe('the seeded demo on PostgreSQL', () => {
    ownTemplateWhenAlone(adminUrl);

    for (const sites of ['1', '2'])
      it(`should give a server of ${sites} site(s) the records it would have seeded itself`, async (t) => {
        const copied = await startTestServer(t, { LARDER_DEMO_SITES: sites });
        // LARDER_MODE is not among the neutral settings: this one seeds its own, as before.
        const own = await startTestServer(t, { LARDER_DEMO_SITES: sites, LARDER_MODE: 'demo' });
        const expected = await demoRecords(own);
        assert.equal(expected.sites.length, Number(sites));
        assert.ok(expected.batches.length > 20, `${expected.batches.length} batches`);
        assert.deepEqual(await demoRecords(copied), expected);
        // A second copy is a database of its own: what one server records, the other never sees.
        const other = await startTestServer(t, { LARDER_DEMO_SITES: sites });
        const recorded = await copied.as('tobin').post('/api/batches', {
          formula: 'brisket-rub',
          batch: { base: '1kg' },
        });
        assert.equal(recorded.status, 201, recorded.text);
        assert.deepEqual(await demoRecords(other), expected);
      });
  });
