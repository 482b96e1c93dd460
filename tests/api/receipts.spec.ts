import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { startTestServer, type TestServer } from '../helpers/test-server.ts';

const today = (): string => new Date().toISOString().slice(0, 10);
const dayAfter = (days: number): string =>
  new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

/** A chilled delivery of pork belly, as the door sees it, with what the test changes. */
const belly = (change: Record<string, unknown> = {}) => ({
  item: 'pork-belly',
  supplier: 'Test Farm Pork',
  supplierLot: 'TF-4471',
  establishment: 'EST. 9012',
  packedOn: dayAfter(-2),
  useBy: dayAfter(12),
  quantity: '40',
  unit: 'lb',
  unitCost: '3.10',
  temperature: '3 °C',
  ...change,
});

async function received(server: TestServer, body: object) {
  const answer = await server.as('tobin').post('/api/receipts', body);
  assert.equal(answer.status, 201, answer.text);
  return answer.json.receipt;
}

const ACTION = {
  cause: 'The delivery van’s cooling unit failed on the round.',
  restored: 'Bellies moved straight into the walk-in and read at 4 °C within the hour.',
  prevention: 'Supplier told; deliveries read at the van door before unloading.',
  disposition: 'rechilled',
};

describe('receiving deliveries', () => {
  it('should receive a chilled delivery within its limit, in grams, under the day’s next lot code', async (t) => {
    const server = await startTestServer(t);
    const first = await received(server, belly());
    const second = await received(server, belly({ supplierLot: 'TF-4472', temperature: '41 °F' }));
    const prefix = `R${today().slice(2, 4)}${today().slice(5, 7)}${today().slice(8, 10)}-`;
    assert.equal(first.lotCode, `${prefix}01`);
    assert.equal(second.lotCode, `${prefix}02`);
    assert.equal(first.decision, 'accepted');
    // source: NIST SP 811 (2008), Appendix B.8: 1 lb = 453.59237 g, so 40 lb = 18143.6948 g
    assert.equal(first.amount, '18143.6948');
    assert.equal(first.remaining, '18143.6948');
    assert.equal(first.receivedBy.displayName.length > 0, true);
    // source: FDA Food Code 2022, §3-202.11(A): refrigerated food received at 5 °C (41 °F) or below
    assert.equal(first.limit.words, '5 °C (41 °F) or colder');
    assert.match(first.limit.source, /3-202\.11\(A\)/);
    assert.equal(second.decision, 'accepted', '41 °F is at the limit, not over it');
    const audit = await server.as('rosa').get('/api/audit?action=receipt-record&limit=5');
    assert.equal(audit.status, 200, audit.text);
    assert.ok(audit.json.events.some((e: { subject: string }) => e.subject === first.lotCode));
  });

  it('should ask what was done with a delivery over its limit, and refuse it when told', async (t) => {
    const server = await startTestServer(t);
    // source: FDA Food Code 2022, §3-202.11(A): limit 5 °C (41 °F); 8 °C is over it
    const asked = await server.as('tobin').post('/api/receipts', belly({ temperature: '8 °C' }));
    assert.equal(asked.status, 422, asked.text);
    assert.equal(asked.json.error.code, 'decision-needed');
    assert.match(asked.json.error.message, /over its limit of 5 °C \(41 °F\)/);
    const refused = await received(server, belly({ temperature: '8 °C', decision: 'refuse' }));
    assert.equal(refused.decision, 'refused');
    assert.equal(refused.remaining, '0');
    assert.equal(refused.emptiedOn, today());
    assert.equal(refused.deviation, null);
    const stock = await server.as('imke').get('/api/stock');
    assert.equal(stock.status, 200, stock.text);
    const lots = stock.json.items.flatMap((i: { lots: { lotCode: string }[] }) => i.lots);
    assert.ok(!lots.some((l: { lotCode: string }) => l.lotCode === refused.lotCode));
  });

  it('should take a delivery over its limit in only with a corrective action, as a closed deviation the HACCP report shows', async (t) => {
    const server = await startTestServer(t);
    const noAction = await server
      .as('tobin')
      .post('/api/receipts', belly({ temperature: '46 °F', decision: 'accept' }));
    assert.equal(noAction.status, 422, noAction.text);
    assert.equal(noAction.json.error.code, 'action-needed');
    const taken = await received(
      server,
      belly({ temperature: '46 °F', decision: 'accept', action: ACTION }),
    );
    assert.equal(taken.decision, 'accepted-with-action');
    assert.equal(taken.deviation.kind, 'check');
    assert.equal(taken.deviation.control, 'receiving');
    assert.match(taken.deviation.what, /over its limit of 5 °C \(41 °F\)/);
    assert.equal(taken.deviation.action.disposition, 'rechilled');
    const report = await server.as('imke').get(`/api/reports/haccp?from=${today()}&to=${today()}`);
    assert.equal(report.status, 200, report.text);
    const row = report.json.receiving.find((r: { lotCode: string }) => r.lotCode === taken.lotCode);
    assert.ok(row, 'the report lists the delivery');
    assert.equal(row.deviations[0].action.cause, ACTION.cause);
  });

  it('should judge shell eggs at 45 °F and frozen goods by arriving frozen solid', async (t) => {
    const server = await startTestServer(t);
    // source: FDA Food Code 2022, §3-202.11(C): shell eggs at 7 °C (45 °F) air temperature
    const eggs = await received(server, {
      item: 'eggs',
      supplier: 'Test Hens',
      supplierLot: 'H-1',
      quantity: '180',
      unit: 'each',
      temperature: '44 °F',
    });
    assert.equal(eggs.decision, 'accepted');
    assert.equal(eggs.amount, '180');
    // source: FDA Food Code 2022, §3-202.11(E): shipped frozen, received frozen
    const thawed = await server
      .as('tobin')
      .post(
        '/api/receipts',
        belly({ temperature: undefined, shippedFrozen: true, frozenSolid: false }),
      );
    assert.equal(thawed.status, 422, thawed.text);
    assert.equal(thawed.json.error.code, 'decision-needed');
    const solid = await received(
      server,
      belly({ temperature: '-18 °C', shippedFrozen: true, frozenSolid: true }),
    );
    assert.equal(solid.decision, 'accepted');
    assert.equal(solid.limit.words, 'frozen solid');
  });

  it('should need the establishment number on meat, a temperature on chilled goods, and none on dry goods', async (t) => {
    const server = await startTestServer(t);
    const noEst = await server.as('tobin').post('/api/receipts', belly({ establishment: '' }));
    assert.equal(noEst.status, 422);
    assert.equal(noEst.json.error.code, 'establishment-needed');
    const noTemp = await server.as('tobin').post('/api/receipts', belly({ temperature: '' }));
    assert.equal(noTemp.json.error.code, 'temperature-needed');
    const wrongUnit = await server.as('tobin').post('/api/receipts', belly({ unit: 'l' }));
    assert.equal(wrongUnit.json.error.code, 'bad-quantity');
    const pastUseBy = await server
      .as('tobin')
      .post('/api/receipts', belly({ useBy: dayAfter(-1), packedOn: dayAfter(-9) }));
    assert.equal(pastUseBy.json.error.code, 'past-use-by');
    const salt = await received(server, {
      item: 'kosher-salt',
      supplier: 'Test Mill',
      supplierLot: 'SL-9',
      quantity: '25',
      unit: 'kg',
    });
    assert.equal(salt.decision, 'accepted');
    assert.equal(salt.limit.words, 'no temperature limit');
    const reviewer = await server.as('imke').post('/api/receipts', belly());
    assert.equal(reviewer.status, 403);
  });

  it('should list deliveries newest first with filters, show one, and discard what is left with a reason', async (t) => {
    const server = await startTestServer(t);
    const a = await received(server, belly({ supplierLot: 'A-1', useBy: dayAfter(10) }));
    const b = await received(server, belly({ supplierLot: 'BL-2', useBy: dayAfter(5) }));
    const list = await server.as('imke').get('/api/receipts?supplier=test%20farm&pageSize=1');
    assert.equal(list.status, 200, list.text);
    assert.equal(list.json.total >= 2, true);
    assert.equal(list.json.receipts[0].lotCode, b.lotCode);
    const byLot = await server.as('imke').get('/api/receipts?supplierLot=A-1');
    assert.deepEqual(
      byLot.json.receipts.map((r: { lotCode: string }) => r.lotCode),
      [a.lotCode],
    );
    const shown = await server.as('imke').get(`/api/receipts/${a.lotCode.toLowerCase()}`);
    assert.equal(shown.json.receipt.supplierLot, 'A-1');
    const stock = await server.as('imke').get('/api/stock');
    const item = stock.json.items.find((i: { item: string }) => i.item === 'pork-belly');
    const codes = item.lots.map((l: { lotCode: string }) => l.lotCode);
    assert.ok(codes.indexOf(b.lotCode) < codes.indexOf(a.lotCode), 'first to expire first');
    const lot = item.lots.find((l: { lotCode: string }) => l.lotCode === b.lotCode);
    assert.equal(lot.remainingInUnit, '40');
    assert.equal(lot.daysLeft, 5);
    const noReason = await server
      .as('tobin')
      .post(`/api/receipts/${b.lotCode}/discard`, { reason: ' ' });
    assert.equal(noReason.status, 422);
    const discarded = await server
      .as('tobin')
      .post(`/api/receipts/${b.lotCode}/discard`, { reason: 'Bag split in the walk-in.' });
    assert.equal(discarded.status, 200, discarded.text);
    assert.equal(discarded.json.receipt.remaining, '0');
    assert.equal(discarded.json.receipt.emptiedOn, today());
    const again = await server
      .as('tobin')
      .post(`/api/receipts/${b.lotCode}/discard`, { reason: 'x' });
    assert.equal(again.status, 409);
    assert.equal(again.json.error.code, 'not-on-hand');
  });

  it('should list the catalogue items with their receiving limits for the form', async (t) => {
    const server = await startTestServer(t);
    const answer = await server.as('imke').get('/api/stock/items');
    assert.equal(answer.status, 200, answer.text);
    const items = answer.json.items as {
      key: string;
      limit: { words: string };
      establishment: boolean;
      units: string[];
    }[];
    const belly = items.find((i) => i.key === 'pork-belly')!;
    // source: FDA Food Code 2022, §3-202.11(A): 5 °C (41 °F) or below
    assert.equal(belly.limit.words, '5 °C (41 °F) or colder');
    assert.equal(belly.establishment, true);
    assert.deepEqual(belly.units, ['g', 'kg', 'oz', 'lb']);
    assert.equal(
      items.find((i) => i.key === 'nonfat-dry-milk')!.limit.words,
      'no temperature limit',
    );
    assert.ok(!items.some((i) => i.key === 'water'));
  });

  it('should give every concurrent delivery its own lot code', async (t) => {
    const server = await startTestServer(t);
    const answers = await Promise.all(
      Array.from({ length: 8 }, (_, i) =>
        server.as('tobin').post('/api/receipts', belly({ supplierLot: `C-${i}` })),
      ),
    );
    for (const answer of answers) assert.equal(answer.status, 201, answer.text);
    const codes = new Set(answers.map((a) => a.json.receipt.lotCode));
    assert.equal(codes.size, 8);
  });
});
