import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { Decimal } from '../../shared/decimal.ts';
import { clockFrom, startTestServer } from '../helpers/test-server.ts';

describe('the cost of an assembly batch', () => {
  it('should price a pack at its belly batch’s cost per finished kilogram, and a pack as its portion', async (t) => {
    // A fixed day years before the demo's, which is seeded around the real today: none of this
    // test's lot codes can meet one of the demo's.
    const server = await startTestServer(t, {}, { now: clockFrom('2020-12-03') });
    const tobin = server.as('tobin');
    const received = await tobin.post('/api/receipts', {
      item: 'pork-belly',
      supplier: 'Fenwick Hollow Pork',
      supplierLot: 'FH-COST-1',
      establishment: 'EST. 38214',
      quantity: '10',
      unit: 'kg',
      unitCost: '6.00',
      // source: FDA Food Code 2022, §3-202.11(A): 5 °C (41 °F) or below; 3 °C is within it
      temperature: '3 °C',
    });
    assert.equal(received.status, 201, received.text);
    const belly = await tobin.post('/api/batches', {
      formula: 'quillmoor-belly',
      batch: { meat: '4 kg', thickness: '4 cm' },
    });
    const bellyLot = belly.json.batch.lotCode as string;
    const lots = await tobin.post(`/api/batches/${bellyLot}/lots`, {
      picks: [{ item: 'pork-belly', lot: received.json.receipt.lotCode, amount: '4 kg' }],
    });
    assert.equal(lots.status, 201, lots.text);
    const pack = await tobin.post('/api/batches', {
      formula: 'bacon-pack',
      batch: { count: '10' },
    });
    const packLot = pack.json.batch.lotCode as string;
    // 10 packs × 8 slices × 25 g = 2 000 g of the sliced belly.
    const used = await tobin.post(`/api/batches/${packLot}/lots`, {
      picks: [{ part: 'quillmoor-belly', batch: bellyLot, amount: '2 kg' }],
    });
    assert.equal(used.status, 201, used.text);

    const cost = await server.as('rosa').get(`/api/batches/${packLot}/cost`);
    assert.equal(cost.status, 200, cost.text);
    // By hand: the belly batch's 4 kg of belly at 6.00 a kg = 24.00 (its salt, sugar and pepper
    // were never received with a price: not counted); its finished weight is 4 000 g through
    // its yields, smoke 90 % and slice 94 % (formulas/quillmoor-belly.yaml): 3 384 g. So 24.00 ÷
    // 3.384 kg a kilogram, and the pack's 2 kg of it 48.00 ÷ 3.384 = 14.1844 (14.18).
    const [line] = cost.json.lines;
    assert.deepEqual([line.source, line.lot, line.costText], ['earlier-batch', bellyLot, '14.18']);
    assert.equal(
      new Decimal(cost.json.total).toDecimalPlaces(4).toString(),
      new Decimal('48').div('3.384').toDecimalPlaces(4).toString(),
    );
    assert.equal(cost.json.finishedGrams, '2000');
    // One pack is the portion: 200 g of the 2 000 g, a tenth of the cost, 1.42.
    assert.deepEqual(
      [cost.json.portion.grams, cost.json.portion.count, cost.json.portion.costText],
      ['200', 10, '1.42'],
    );
  });
});
