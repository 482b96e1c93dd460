import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { QueryTypes } from 'sequelize';
import { insertReceipts, lotsLeft, type FixtureReceipt } from '../helpers/lot-use-fixture.ts';
import { clearStock } from '../helpers/pull-list-fixture.ts';
import { clockFrom, startTestServer, type TestServer } from '../helpers/test-server.ts';

// The server's today: Thursday 3 December 2020, the day the bellies go into cure.
// A fixed day years before the demo's, which is seeded around the real today: none of this
// test's lot codes can meet one of the demo's.
const CLOCK = clockFrom('2020-12-03');

const belly = (
  lotCode: string,
  kg: string,
  receivedOn: string,
  useBy: string,
  more: Partial<FixtureReceipt> = {},
): FixtureReceipt => ({
  lotCode,
  item: 'pork-belly',
  itemName: 'pork belly',
  supplierLot: `HV-${lotCode.slice(-5)}`,
  quantity: kg,
  unit: 'kg',
  amount: String(Number(kg) * 1000),
  receivedOn,
  useBy,
  ...more,
});

const SEA_SALT: FixtureReceipt = {
  lotCode: 'R201101-01',
  item: 'sea-salt',
  itemName: 'sea salt',
  supplier: 'Saltmarsh Traders',
  supplierLot: 'SM-2210',
  quantity: '1',
  unit: 'kg',
  amount: '1000',
  receivedOn: '2020-11-01',
};

/** A house-bacon batch on 10 kg of belly, started today, under way; its lot code. */
async function baconBatch(server: TestServer): Promise<string> {
  const response = await server.as('tobin').post('/api/batches', {
    formula: 'quillmoor-belly',
    batch: { meat: '10 kg', thickness: '4 cm', start: '2020-12-03' },
  });
  assert.equal(response.status, 201, response.text);
  return response.json.batch.lotCode as string;
}

type Use = { lotCode: string; amount: string; lotAmount: string; supplierLot: string };
const usesOf = (uses: Use[]) => uses.map((u) => `${u.lotCode}: ${u.amount}`);

describe('a batch consuming lots', () => {
  it('should record the lots picked and take them off what is left', async (t) => {
    const server = await startTestServer(t, {}, { now: CLOCK });
    const { db } = server.context;
    await clearStock(db);

    await insertReceipts(db, [
      belly('R201201-01', '6', '2020-12-01', '2020-12-08'),
      belly('R201202-01', '8', '2020-12-02', '2020-12-10'),
      SEA_SALT,
    ]);
    const lot = await baconBatch(server);
    const response = await server.as('tobin').post(`/api/batches/${lot}/lots`, {
      picks: [
        { item: 'pork-belly', lot: 'R201201-01', amount: '6 kg' },
        { item: 'pork-belly', lot: 'r201202-01', amount: '4 kg' },
        // source: the formula's 2.25 % of the green weight, 10 000 g × 2.25 % = 225 g
        { item: 'sea-salt', lot: 'R201101-01', amount: '225 g' },
      ],
    });
    assert.equal(response.status, 201, response.text);
    // hand-worked: 6 000 − 6 000 = 0 (emptied on the day of use), 8 000 − 4 000 = 4 000,
    // 1 000 − 225 = 775
    assert.deepEqual(await lotsLeft(db), {
      'R201201-01': { remaining: '0', emptiedOn: '2020-12-03' },
      'R201202-01': { remaining: '4000', emptiedOn: null },
      'R201101-01': { remaining: '775', emptiedOn: null },
    });
    const read = await server.as('imke').get(`/api/batches/${lot}/lots`);
    assert.equal(read.status, 200, read.text);
    assert.deepEqual(usesOf(read.json.uses), [
      'R201201-01: 6000',
      'R201202-01: 4000',
      'R201101-01: 225',
    ]);
    // hand-worked: 4 000 g of a lot received in kilograms is 4 kg
    assert.equal(read.json.uses[1].lotAmount, '4');
    assert.equal(read.json.uses[1].supplierLot, 'HV-02-01');
    assert.equal(read.json.uses[2].supplier, 'Saltmarsh Traders');
    // recorded: nothing more is suggested
    assert.deepEqual(
      read.json.suggested.flatMap((s: { takes: Use[] }) => s.takes),
      [],
    );
    const audit = await server.as('rosa').get('/api/audit?action=batch-lots');
    assert.equal(audit.json.events[0].subject, lot);
  });

  it('should suggest the earliest use-by first, set an expired lot apart, and record the suggestion', async (t) => {
    const server = await startTestServer(t, {}, { now: CLOCK });
    const { db } = server.context;
    await clearStock(db);

    await insertReceipts(db, [
      belly('R201126-01', '5', '2020-11-26', '2020-12-02'),
      belly('R201130-01', '8', '2020-11-30', '2020-12-10'),
      belly('R201201-01', '6', '2020-12-01', '2020-12-05'),
      // came in the day after the batch was started: not on hand on its day of use
      belly('R201204-01', '9', '2020-12-04', '2020-12-06'),
      SEA_SALT,
    ]);
    const lot = await baconBatch(server);
    const read = await server.as('tobin').get(`/api/batches/${lot}/lots`);
    assert.equal(read.status, 200, read.text);
    const [meat, salt] = read.json.suggested;
    assert.equal(meat.item, 'pork-belly');
    // hand-worked on 3 Dec: R201126-01 (use by 2 Dec) is past its use-by (FDA Food Code 2022,
    // 3-501.17(A): the date marked is the day by which the food is to be used or discarded), so
    // 10 000 g is 6 000 of R201201-01 (use by 5 Dec), then 4 000 of R201130-01 (use by 10 Dec)
    assert.deepEqual(usesOf(meat.takes), ['R201201-01: 6000', 'R201130-01: 4000']);
    assert.deepEqual(
      meat.expired.map((l: { lotCode: string }) => l.lotCode),
      ['R201126-01'],
    );
    assert.equal(meat.shortfall, '0');
    assert.deepEqual(usesOf(salt.takes), ['R201101-01: 225']);
    // source: 0.25 % of 10 000 g, no curing-salt lot on hand: all of it short
    const cure = read.json.suggested.find((s: { item: string }) => s.item === 'curing-salt-1');
    assert.equal(cure.shortfall, '25');
    const accept = await server.as('tobin').post(`/api/batches/${lot}/lots`, { accept: true });
    assert.equal(accept.status, 201, accept.text);
    const left = await lotsLeft(db);
    assert.equal(left['R201201-01'].remaining, '0');
    assert.equal(left['R201130-01'].remaining, '4000');
    assert.equal(left['R201126-01'].remaining, '5000');
    assert.equal(left['R201204-01'].remaining, '9000');
  });

  it('should refuse more than a lot has left, and each other pick that cannot be true', async (t) => {
    const server = await startTestServer(t, {}, { now: CLOCK });
    const { db } = server.context;
    await clearStock(db);

    await insertReceipts(db, [
      belly('R201201-01', '6', '2020-12-01', '2020-12-08'),
      belly('R201125-01', '3', '2020-11-25', '2020-12-01'),
      belly('R201202-01', '7', '2020-12-02', '2020-12-09', { decision: 'refused' }),
      SEA_SALT,
    ]);
    const lot = await baconBatch(server);
    const tobin = server.as('tobin');
    const refusal = async (pick: object) => {
      const response = await tobin.post(`/api/batches/${lot}/lots`, { picks: [pick] });
      assert.equal(response.status, 422, response.text);
      return response.json.error;
    };
    const over = await refusal({ item: 'pork-belly', lot: 'R201201-01', amount: '6.5 kg' });
    assert.equal(over.code, 'over-draw');
    assert.match(over.message, /only 6 kg is left of lot R201201-01, not 6.5 kg/);
    const other = await refusal({ item: 'pork-belly', lot: 'R201101-01', amount: '1 kg' });
    assert.equal(other.code, 'other-item');
    assert.match(other.message, /lot R201101-01 is sea salt, not pork belly/);
    const expired = await refusal({ item: 'pork-belly', lot: 'R201125-01', amount: '1 kg' });
    assert.equal(expired.code, 'expired-lot');
    assert.match(
      expired.message,
      /to be used by 1 Dec 2020, before this batch was started on 3 Dec 2020/,
    );
    assert.equal(
      (await refusal({ item: 'pork-belly', lot: 'R201202-01', amount: '1 kg' })).code,
      'refused-lot',
    );
    assert.equal(
      (await refusal({ item: 'eggs', lot: 'R201201-01', amount: '1' })).code,
      'not-needed',
    );
    const none = await db.sequelize.query('SELECT id FROM lot_uses', { type: QueryTypes.SELECT });
    assert.equal(none.length, 0);
    assert.equal((await lotsLeft(db))['R201201-01'].remaining, '6000');
    const reviewer = await server.as('imke').post(`/api/batches/${lot}/lots`, { accept: true });
    assert.equal(reviewer.status, 403, reviewer.text);
  });

  it('should refuse recording twice, and on replacing give back what the first record took', async (t) => {
    const server = await startTestServer(t, {}, { now: CLOCK });
    const { db } = server.context;
    await clearStock(db);

    await insertReceipts(db, [belly('R201201-01', '10', '2020-12-01', '2020-12-08')]);
    const lot = await baconBatch(server);
    const tobin = server.as('tobin');
    const first = { picks: [{ item: 'pork-belly', lot: 'R201201-01', amount: '10 kg' }] };
    assert.equal((await tobin.post(`/api/batches/${lot}/lots`, first)).status, 201);
    assert.deepEqual((await lotsLeft(db))['R201201-01'], {
      remaining: '0',
      emptiedOn: '2020-12-03',
    });
    const twice = await tobin.post(`/api/batches/${lot}/lots`, first);
    assert.equal(twice.status, 409, twice.text);
    assert.equal(twice.json.error.code, 'lots-recorded');
    const again = await tobin.post(`/api/batches/${lot}/lots`, {
      replace: true,
      picks: [{ item: 'pork-belly', lot: 'R201201-01', amount: '9.8 kg' }],
    });
    assert.equal(again.status, 201, again.text);
    // hand-worked: 10 000 given back, then 9 800 taken: 200 g left, on hand again
    assert.deepEqual((await lotsLeft(db))['R201201-01'], { remaining: '200', emptiedOn: null });
    assert.deepEqual(usesOf(again.json.uses), ['R201201-01: 9800']);
    const kept = await db.sequelize.query<{ replaced_at: string | null }>(
      'SELECT replaced_at FROM lot_uses ORDER BY id',
      { type: QueryTypes.SELECT },
    );
    assert.equal(kept.length, 2);
    assert.notEqual(kept[0].replaced_at, null);
  });
});
