import assert from 'node:assert/strict';
import { after, before, describe, it } from 'node:test';
import type { RecallReport, TraceAnswer, TraceNode } from '../../shared/api/trace-record.ts';
import { parseCsv } from '../helpers/csv.ts';
import { OTHER_SITE, addPerson, addSite, sendAs } from '../helpers/site-fixture.ts';
import { clockFrom, startTestServer, type TestServer } from '../helpers/test-server.ts';
import { insertSmokehouseLots } from '../helpers/trace-fixture.ts';

// The kitchen of tests/helpers/trace-fixture.ts with its second delivery of Hollin Farm's lot
// HF-4471 (R201203-91) and the smoked belly made from it (201203-SB-02) moved to a second shop.
// That belly used 4000 g of the main site's first delivery and went (3000 g) into the main
// site's sliced bacon: a trace crosses the two sites both ways.
const MOVED = ['R201203-91', '201203-SB-02'];
const HIDDEN_FROM_MAIN = [...MOVED, OTHER_SITE.key];
const HIDDEN_FROM_SHOP = ['201201-SB-01', '201205-SL-01', '201206-BA-01', 'R201201-91', '"main"'];

/** Every node of a tree, depth first. */
const nodesOf = (nodes: readonly TraceNode[]): TraceNode[] =>
  nodes.flatMap((node) => [node, ...nodesOf(node.children)]);

/** Asserts none of the words is anywhere in an answer's text. */
function names(text: string, words: readonly string[]): string[] {
  return words.filter((word) => text.toLowerCase().includes(word.toLowerCase()));
}

describe('sites: trace and recall keep to the sites a person has a role at', () => {
  let server: TestServer;
  const stops: (() => unknown)[] = [];
  const get = (who: string, path: string, site?: string) =>
    sendAs(server, who, { method: 'GET', path }, site);

  before(async () => {
    // A fixed day years before the demo's, which is seeded around the real today: none of this
    // test's lot codes can meet one of the demo's.
    server = await startTestServer(
      { after: (fn) => void stops.push(fn) },
      {},
      { now: clockFrom('2020-12-07') },
    );
    await insertSmokehouseLots(server.context.db);
    // Before a second site: a trace names no site and hides nothing.
    const single = await server.as('tobin').get('/api/trace/back/201205-SL-01');
    assert.equal(single.status, 200, single.text);
    assert.ok(!/"site"|elsewhere/.test(single.text), single.text);
    await addSite(server, OTHER_SITE);
    const sql = server.context.db.sequelize;
    for (const table of ['receipts', 'batches'])
      await sql.query(
        `UPDATE ${table} SET site_id = (SELECT id FROM sites WHERE key = ?) WHERE lot_code IN (?, ?)`,
        { replacements: [OTHER_SITE.key, ...MOVED] },
      );
    await addPerson(server, 'main-cook', null, [{ key: 'main', role: 'cook' }]);
    await addPerson(server, 'shop-cook', null, [{ key: OTHER_SITE.key, role: 'cook' }]);
  });
  after(async () => {
    for (const stop of stops.reverse()) await stop();
  });

  it("should trace back without naming another site's lots, saying how much came from elsewhere", async () => {
    const back = await get('main-cook', '/api/trace/back/201205-SL-01');
    assert.equal(back.status, 200, back.text);
    const root = (back.json as TraceAnswer).roots[0];
    assert.equal(root.lot.site, 'main');
    assert.deepEqual(
      root.children.map((c) => [c.lot.lotCode, c.lot.site]),
      [['201201-SB-01', 'main']],
    );
    assert.deepEqual(root.elsewhere, [{ amount: '3000', measure: 'g' }]);
    assert.deepEqual(names(back.text, HIDDEN_FROM_MAIN), []);
    // The shop's belly, back: its own delivery shown, the main site's belly and salt not.
    const shop = await get('shop-cook', '/api/trace/back/201203-SB-02');
    assert.equal(shop.status, 200, shop.text);
    const belly = (shop.json as TraceAnswer).roots[0];
    assert.deepEqual(
      belly.children.map((c) => c.lot.lotCode),
      ['R201203-91'],
    );
    assert.deepEqual(belly.elsewhere, [{ amount: '4015', measure: 'g' }]);
    assert.deepEqual(names(shop.text, HIDDEN_FROM_SHOP), []);
  });

  it('should trace a supplier lot forward from the receipts of the asking site only', async () => {
    const forward = await get('shop-cook', '/api/trace/forward?supplierLot=HF-4471');
    assert.equal(forward.status, 200, forward.text);
    const answer = forward.json as TraceAnswer;
    assert.deepEqual(
      answer.roots.map((r) => r.lot.lotCode),
      ['R201203-91'],
    );
    const belly = answer.roots[0].children[0];
    assert.equal(belly.lot.lotCode, '201203-SB-02');
    assert.deepEqual(belly.elsewhere, [{ amount: '3000', measure: 'g' }]);
    assert.equal(answer.batches, 1, 'the batches of the main site are not counted either');
    assert.deepEqual(names(forward.text, HIDDEN_FROM_SHOP), []);
    const mainOnly = await get('shop-cook', '/api/trace/forward?supplierLot=TR-302');
    assert.equal(mainOnly.status, 404, mainOnly.text);
  });

  it('should answer a lot of a site the person has no role at as one that does not exist', async () => {
    for (const path of [
      '/api/trace/back/R201203-91',
      '/api/trace/forward/201203-sb-02',
      '/api/trace/forward?lot=R201203-91',
      '/api/trace/recall?lot=201203-SB-02',
      '/api/trace/recall.csv?lot=R201203-91',
    ]) {
      const response = await get('main-cook', path);
      assert.equal(response.status, 404, `${path}: ${response.text}`);
      assert.deepEqual(names(response.text, HIDDEN_FROM_MAIN.slice(2)), [], path);
    }
  });

  it('should give a recall report whose mass balance closes without naming the other site', async () => {
    const report = await get('main-cook', '/api/trace/recall?supplierLot=HF-4471');
    assert.equal(report.status, 200, report.text);
    const recall = report.json as RecallReport;
    assert.deepEqual(
      recall.recalled.map((l) => l.lotCode),
      ['R201201-91'],
    );
    assert.deepEqual(
      recall.batches.map((b) => b.lotCode),
      ['201201-SB-01', '201205-SL-01', '201206-BA-01'],
    );
    assert.deepEqual(recall.totals.used, [{ amount: '6000', measure: 'g' }]);
    assert.deepEqual(recall.totals.usedElsewhere, [{ amount: '4000', measure: 'g' }]);
    assert.match(recall.elsewhere ?? '', /another site of the group/);
    assert.deepEqual(names(report.text, HIDDEN_FROM_MAIN), []);
    const csv = await get('main-cook', '/api/trace/recall.csv?supplierLot=HF-4471');
    assert.equal(csv.status, 200, csv.text);
    const rows = parseCsv(csv.text);
    const away = rows.filter((row) => row[0] === 'elsewhere');
    assert.deepEqual(
      away.map((row) => [row[11], row[12], row[13]]),
      [['R201201-91', '4000', 'g']],
    );
    assert.deepEqual(names(csv.text, HIDDEN_FROM_MAIN), []);
  });

  it('should show a person with a role at both sites the whole trace, each lot with its site', async () => {
    const back = await server.as('tobin').get('/api/trace/back/201205-SL-01');
    assert.equal(back.status, 200, back.text);
    const all = nodesOf((back.json as TraceAnswer).roots);
    assert.ok(all.every((node) => node.elsewhere === undefined));
    const sites = Object.fromEntries(all.map((node) => [node.lot.lotCode, node.lot.site]));
    assert.equal(sites['201203-SB-02'], OTHER_SITE.key);
    assert.equal(sites['R201203-91'], OTHER_SITE.key);
    assert.equal(sites['201201-SB-01'], 'main');
  });
});
