import assert from 'node:assert/strict';
import { before, describe, it } from 'node:test';
import { BELLY, send, suiteServer } from '../helpers/api-calls.ts';
import { OTHER_SITE, addPerson, addSite, sendAs } from '../helpers/site-fixture.ts';

// Two sites of one group: the demo's own (main) and a second shop. A cook at the second shop
// only, and a reviewer of the group who cooks at the second shop, show that the role in force is
// the role at the request's site, and that a site's batches are never seen from the other.
describe('sites: the batch log belongs to a site', () => {
  const server = suiteServer();
  let mainLot: string;
  let otherLot: string;

  before(async () => {
    await addSite(server(), OTHER_SITE);
    await addPerson(server(), 'harbour-cook', null, [{ key: OTHER_SITE.key, role: 'cook' }]);
    await addPerson(server(), 'group-reviewer', 'reviewer', [
      { key: OTHER_SITE.key, role: 'cook' },
    ]);
    await addPerson(server(), 'two-shops', null, [
      { key: OTHER_SITE.key, role: 'cook' },
      { key: 'main', role: 'reviewer' },
    ]);
    const main = await send(server(), 'tobin', {
      method: 'POST',
      path: '/api/batches',
      body: BELLY,
    });
    assert.equal(main.status, 201, main.text);
    mainLot = main.json.batch.lotCode;
    const other = await sendAs(server(), 'harbour-cook', {
      method: 'POST',
      path: '/api/batches',
      body: BELLY,
    });
    assert.equal(other.status, 201, other.text);
    otherLot = other.json.batch.lotCode;
  });

  it('should record a batch at the only site of a person who names none, and at no other', async () => {
    const site = await server().context.db.sequelize.query<{ key: string }>(
      'SELECT s.key FROM batches b JOIN sites s ON s.id = b.site_id WHERE b.lot_code = ?',
      { replacements: [otherLot], type: 'SELECT' as never },
    );
    assert.deepEqual(
      site.map((row) => row.key),
      [OTHER_SITE.key],
    );
    assert.notEqual(otherLot, mainLot, 'lot codes stay unique across the group');
  });

  it('should list a site its own batches only', async () => {
    const atOther = await sendAs(server(), 'harbour-cook', { method: 'GET', path: '/api/batches' });
    assert.equal(atOther.status, 200, atOther.text);
    const otherLots = atOther.json.items.map((b: { lotCode: string }) => b.lotCode);
    assert.deepEqual(otherLots, [otherLot]);
    assert.equal(atOther.json.total, 1);
    const atMain = await send(server(), 'rosa', { method: 'GET', path: '/api/batches?limit=200' });
    const mainLots = atMain.json.items.map((b: { lotCode: string }) => b.lotCode);
    assert.ok(mainLots.includes(mainLot));
    assert.ok(!mainLots.includes(otherLot), 'the main site lists no batch of the other');
    const chosen = await send(server(), 'rosa', {
      method: 'GET',
      path: `/api/batches?site=${OTHER_SITE.key}`,
    });
    assert.deepEqual(
      chosen.json.items.map((b: { lotCode: string }) => b.lotCode),
      [otherLot],
    );
  });

  it("should answer another site's batch as one that does not exist", async () => {
    for (const path of [
      `/api/batches/${otherLot}`,
      `/api/batches/${otherLot}/sheet.pdf`,
      `/api/batches/${otherLot}/process`,
      `/api/batches/${otherLot}/lots`,
      `/api/batches/${otherLot}/cost`,
      `/api/trace/back/${otherLot}`,
    ]) {
      const response = await send(server(), 'rosa', { method: 'GET', path });
      assert.equal(response.status, 404, `${path}: ${response.text}`);
    }
    const changes = [
      { method: 'POST', path: `/api/batches/${otherLot}/status`, body: { to: 'curing' } },
      { method: 'POST', path: `/api/batches/${otherLot}/sign-off`, body: {} },
    ];
    for (const call of changes) {
      const response = await send(server(), 'rosa', call);
      assert.equal(response.status, 404, `${call.path}: ${response.text}`);
    }
    const csv = await send(server(), 'rosa', { method: 'GET', path: '/api/batches.csv' });
    assert.ok(!csv.text.includes(otherLot), 'the export of main holds no batch of the other site');
  });

  it('should refuse a site the person has no role at as one that does not exist', async () => {
    const main = await sendAs(
      server(),
      'harbour-cook',
      { method: 'GET', path: '/api/batches' },
      'main',
    );
    assert.equal(main.status, 404, main.text);
    assert.equal(main.json.error.code, 'no-such-site');
    const made = await sendAs(
      server(),
      'harbour-cook',
      { method: 'GET', path: '/api/batches' },
      'nowhere',
    );
    assert.equal(made.status, 404);
    assert.equal(made.json.error.message, main.json.error.message.replace('"main"', '"nowhere"'));
    const sites = await sendAs(server(), 'harbour-cook', { method: 'GET', path: '/api/sites' });
    assert.deepEqual(sites.json.sites, [
      { key: OTHER_SITE.key, name: OTHER_SITE.name, role: 'cook' },
    ]);
  });

  it('should give the role at the site: a reviewer of the group records where they cook, not elsewhere', async () => {
    const atOther = await sendAs(
      server(),
      'group-reviewer',
      { method: 'POST', path: '/api/batches', body: BELLY },
      OTHER_SITE.key,
    );
    assert.equal(atOther.status, 201, atOther.text);
    const atMain = await sendAs(server(), 'group-reviewer', {
      method: 'POST',
      path: '/api/batches',
      body: BELLY,
    });
    assert.equal(atMain.status, 403, atMain.text);
    const sites = await sendAs(server(), 'group-reviewer', { method: 'GET', path: '/api/sites' });
    assert.deepEqual(
      sites.json.sites.map((s: { key: string; role: string }) => [s.key, s.role]),
      [
        ['main', 'reviewer'],
        [OTHER_SITE.key, 'cook'],
      ],
    );
  });

  it('should ask which site when a person has several and the main one is not theirs alone to default to', async () => {
    // two-shops sees main, so main is the default; a person of two shops without main must say.
    const defaulted = await sendAs(server(), 'two-shops', { method: 'GET', path: '/api/batches' });
    assert.equal(defaulted.status, 200, defaulted.text);
    await addSite(server(), { key: 'third-test', name: 'Third test shop' });
    await addPerson(server(), 'far-cook', null, [
      { key: OTHER_SITE.key, role: 'cook' },
      { key: 'third-test', role: 'cook' },
    ]);
    const asked = await sendAs(server(), 'far-cook', { method: 'GET', path: '/api/batches' });
    assert.equal(asked.status, 400, asked.text);
    assert.equal(asked.json.error.code, 'site-required');
    assert.deepEqual(
      asked.json.error.details.map((d: { key: string }) => d.key),
      [OTHER_SITE.key, 'third-test'],
    );
  });

  it('should keep people, sites and formulas to admins of the whole group', async () => {
    await addPerson(server(), 'shop-admin', null, [{ key: OTHER_SITE.key, role: 'admin' }]);
    for (const call of [
      { method: 'GET', path: '/api/people' },
      { method: 'POST', path: '/api/sites', body: { key: 'by-shop-admin', name: 'No' } },
      { method: 'GET', path: '/api/audit' },
    ]) {
      const response = await sendAs(server(), 'shop-admin', call);
      assert.equal(response.status, 403, `${call.method} ${call.path}: ${response.text}`);
    }
  });

  it('should keep equipment added at a site to that site', async () => {
    const added = await send(server(), 'rosa', {
      method: 'POST',
      path: '/api/equipment',
      body: {
        name: 'Harbour walk-in',
        kind: 'cooler',
        control: { rule: 'cold-holding', every: '4 h' },
      },
      headers: { 'x-larder-site': OTHER_SITE.key },
    });
    assert.equal(added.status, 201, added.text);
    const log = `/api/equipment/${added.json.equipment.id}/log`;
    const atMain = await send(server(), 'rosa', { method: 'GET', path: log });
    assert.equal(atMain.status, 404, atMain.text);
    const atOther = await send(server(), 'rosa', {
      method: 'GET',
      path: `${log}?site=${OTHER_SITE.key}`,
    });
    assert.equal(atOther.status, 200, atOther.text);
  });
});
