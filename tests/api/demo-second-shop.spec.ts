import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { send } from '../helpers/api-calls.ts';
import { PASSWORDS, startTestServer, type TestServer } from '../helpers/test-server.ts';

const TWO_SITES = { LARDER_DEMO_SITES: '2' };
// source: server/demo/demo-people.ts (the demo's own invented shop)
const SHOP = { key: 'saltmarrow', name: 'Saltmarrow Quay shop' };

/** Every lot code of a site's batch log, as the admin lists it there (newest first). */
async function lotsAt(server: TestServer, site?: string): Promise<string[]> {
  const response = await send(server, 'rosa', {
    method: 'GET',
    path: '/api/batches?limit=200',
    headers: site ? { 'x-larder-site': site } : {},
  });
  assert.equal(response.status, 200, response.text);
  return (response.json as { items: { lotCode: string }[] }).items.map((b) => b.lotCode);
}

// The demo of a group: the smokehouse (main) and a second shop with its own cook and batches.
describe('the demo’s second shop', () => {
  it('should leave the smokehouse’s batch log and lot codes as a demo of one site has them', async (t) => {
    const one = await startTestServer(t);
    const two = await startTestServer(t, TWO_SITES);
    const alone = await lotsAt(one);
    assert.ok(alone.length > 40, `the smokehouse has its five weeks: ${alone.length}`);
    assert.deepEqual(await lotsAt(two), alone);
    assert.deepEqual(await lotsAt(two, 'main'), alone);
    const shop = await lotsAt(two, SHOP.key);
    // Six batches, the shop's ten days. source: server/demo/seed-shop.ts
    assert.equal(shop.length, 6, shop.join(', '));
    for (const lot of shop) assert.ok(!alone.includes(lot), `${lot} is the shop's alone`);
    const signIn = {
      method: 'POST',
      path: '/api/session',
      body: { username: 'rosa', password: PASSWORDS.rosa },
    };
    assert.equal((await send(two, 'anonymous', signIn)).json.siteCount, 2);
    assert.equal((await send(one, 'anonymous', signIn)).json.siteCount, 1);
  });

  it('should give the shop a cook who sees that shop only, and list her sign-in', async (t) => {
    const server = await startTestServer(t, TWO_SITES);
    const demo = await send(server, 'anonymous', { method: 'GET', path: '/api/session/demo' });
    const maren = demo.json.signIns.find((p: { username: string }) => p.username === 'maren');
    assert.equal(maren?.role, 'cook');
    const sites = await send(server, 'maren', { method: 'GET', path: '/api/sites' });
    assert.equal(sites.status, 200, sites.text);
    assert.deepEqual(sites.json.sites, [{ ...SHOP, role: 'cook' }]);
    const own = await send(server, 'maren', { method: 'GET', path: '/api/batches' });
    assert.equal(own.status, 200, own.text);
    assert.deepEqual(
      own.json.items.map((b: { lotCode: string }) => b.lotCode),
      await lotsAt(server, SHOP.key),
    );
    const main = await send(server, 'maren', {
      method: 'GET',
      path: '/api/batches',
      headers: { 'x-larder-site': 'main' },
    });
    assert.equal(main.status, 404, main.text);
    const admin = await send(server, 'rosa', { method: 'GET', path: '/api/sites' });
    assert.deepEqual(
      admin.json.sites.map((s: { key: string; role: string }) => `${s.key}/${s.role}`),
      ['main/admin', `${SHOP.key}/admin`],
    );
  });

  it('should keep the smoker readings of the shop’s first hot links', async (t) => {
    const server = await startTestServer(t, TWO_SITES);
    const shop = await lotsAt(server, SHOP.key);
    const links = shop.at(-1)!;
    assert.match(links, /-HLC-/);
    const record = await send(server, 'maren', {
      method: 'GET',
      path: `/api/batches/${links}/process`,
    });
    assert.equal(record.status, 200, record.text);
    const smoker = record.json.controls.find(
      (c: { control: { id: string } }) => c.control.id === 'smoker',
    );
    assert.ok(smoker.readings.length >= 2, JSON.stringify(smoker.readings));
  });
});
