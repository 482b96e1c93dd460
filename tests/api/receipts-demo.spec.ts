import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { Receipt, StockView } from '../../shared/api/receipt.ts';
import { startTestServer } from '../helpers/test-server.ts';

describe('the demo deliveries', () => {
  it('should cover every item the demo batches use, from invented suppliers, before the first batch', async (t) => {
    const server = await startTestServer(t);
    const page = await server.as('imke').get('/api/receipts?pageSize=200');
    assert.equal(page.status, 200, page.text);
    const receipts: Receipt[] = page.json.receipts;
    assert.ok(page.json.total <= 200, 'one page holds them all');
    const items = new Set(receipts.map((r) => r.item));
    // The meat of every cure and grind, and what their lines name.
    for (const item of [
      'pork-belly',
      'pork-leg',
      'pork-shoulder',
      'beef-brisket',
      'beef-chuck-trim',
      'beef-fat-trim',
      'kosher-salt',
      'curing-salt-1',
      'bread-flour',
      'instant-yeast',
      'eggs',
      'whole-milk',
      'nonfat-dry-milk',
    ])
      assert.ok(items.has(item), `a delivery of ${item}`);
    assert.ok(!items.has('water'), 'tap water is not delivered');
    assert.equal(new Set(receipts.map((r) => r.supplier)).size, 4);
    for (const r of receipts.filter((r) => r.item.startsWith('pork') || r.item.startsWith('beef')))
      assert.match(r.establishment ?? '', /^EST\. \d+$/, r.lotCode);
    const batches = await server.as('imke').get('/api/batches?sort=started&order=asc&limit=1');
    const firstStart: string = batches.json.items[0].startedOn;
    const bellies = receipts.filter((r) => r.item === 'pork-belly' && r.decision !== 'refused');
    assert.ok(
      bellies.some((r) => r.receivedOn < firstStart),
      'bellies were in before the first bacon',
    );
  });

  it('should hold one pork-belly delivery refused for its temperature, with its reason', async (t) => {
    const server = await startTestServer(t);
    const page = await server.as('imke').get('/api/receipts?item=pork-belly&pageSize=200');
    const refused = (page.json.receipts as Receipt[]).filter((r) => r.decision === 'refused');
    assert.equal(refused.length, 1);
    // source: FDA Food Code 2022, §3-202.11(A): 5 °C (41 °F) or below; 8.5 °C is over
    assert.equal(refused[0].temperatureC, '8.5');
    assert.match(refused[0].found, /over its limit of 5 °C \(41 °F\)/);
    assert.match(refused[0].note ?? '', /cooling unit/);
    const stock = await server.as('imke').get('/api/stock');
    const lots = (stock.json as StockView).items.flatMap((i) => i.lots);
    assert.ok(
      !lots.some((l) => l.lotCode === refused[0].lotCode),
      'a refused delivery is never on hand',
    );
  });
});
