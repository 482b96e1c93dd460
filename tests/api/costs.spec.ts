import assert from 'node:assert/strict';
import { before, describe, it } from 'node:test';
import { BELLY, send, suiteServer } from '../helpers/api-calls.ts';
import {
  addLotUse,
  addReceipt,
  bellyInEmptyKitchen,
  dayFromToday,
} from '../helpers/cost-fixture.ts';

// The demo belly (quillmoor-belly), 4.26 kg green: fine sea salt 2.25 % = 95.85 g, curing salt
// 0.25 % = 10.65 g, dark brown sugar 1.2 % = 51.12 g, cracked black pepper 0.3 % = 12.78 g;
// yields smoke 90 % and slice 94 %, so 4 260 × 0.90 × 0.94 = 3 603.96 g finished.
// Priced by hand (invented Quillmoor deliveries):
//   pork belly, its lot at 9.00 a kg:             4 260 × 9.00 ÷ 1000            = 38.34
//   sea salt, its lot at 2.00 a kg:                95.85 × 2.00 ÷ 1000           =  0.1917
//   curing salt, no lot: latest price 8.00 a kg
//     (an older delivery at 20.00 is not the latest): 10.65 × 8.00 ÷ 1000      =  0.0852
//   brown sugar, its lot at 2.26796185 a lb:      51.12 × 2.26796185 ÷ 453.59237 = 0.2556
//   black pepper: never received with a price                                  unpriced
//   total                                                                        38.8725
// 38.8725 ÷ 3.60396 = 10.78605… a finished kg → 10.79; a 150 g portion 38.8725 × 150 ÷ 3 603.96
// = 1.61790… → 1.62; 3 603.96 ÷ 150 = 24.03 → 24 portions. (derived: cost ÷ weight; the pound is
// 453.59237 g, source: NIST SP 811 (2008), Appendix B.8)
describe('GET /api/batches/:lot/cost', () => {
  const server = suiteServer();
  let lot: string;
  before(async () => {
    lot = await bellyInEmptyKitchen(server());
    const belly = await addReceipt(server(), {
      item: 'pork-belly',
      itemName: 'pork belly',
      quantity: '5',
      unit: 'kg',
      amount: '5000',
      unitCost: '9.00',
      on: dayFromToday(-3),
    });
    const salt = await addReceipt(server(), {
      item: 'sea-salt',
      itemName: 'sea salt',
      quantity: '1',
      unit: 'kg',
      amount: '1000',
      unitCost: '2.00',
      on: dayFromToday(-20),
    });
    const sugar = await addReceipt(server(), {
      item: 'brown-sugar-dark',
      itemName: 'brown sugar',
      quantity: '2',
      unit: 'lb',
      amount: '907.18474',
      unitCost: '2.26796185',
      on: dayFromToday(-20),
    });
    for (const [on, cost] of [
      [dayFromToday(-40), '20.00'],
      [dayFromToday(-10), '8.00'],
    ]) {
      await addReceipt(server(), {
        item: 'curing-salt-1',
        itemName: 'curing salt',
        quantity: '1',
        unit: 'kg',
        amount: '1000',
        unitCost: cost,
        on,
        emptiedOn: on,
      });
    }
    await addLotUse(server(), {
      batch: lot,
      item: 'pork-belly',
      amount: '4260',
      receipt: belly.id,
    });
    await addLotUse(server(), { batch: lot, item: 'sea-salt', amount: '95.85', receipt: salt.id });
    await addLotUse(server(), {
      batch: lot,
      item: 'brown-sugar-dark',
      amount: '51.12',
      receipt: sugar.id,
    });
  });

  it('should price the lots used, the rest at the latest price, per finished kg and per portion', async () => {
    const response = await send(server(), 'imke', {
      method: 'GET',
      path: `/api/batches/${lot}/cost?portion=150%20g`,
    });
    assert.equal(response.status, 200, response.text);
    const cost = response.json;
    assert.equal(cost.total, '38.8725');
    assert.equal(cost.totalText, '38.87');
    assert.equal(cost.finishedGrams, '3603.96');
    assert.equal(cost.perFinishedKgText, '10.79');
    assert.deepEqual(cost.portion && [cost.portion.count, cost.portion.costText], [24, '1.62']);
    assert.deepEqual(cost.latestPriced, ['curing salt']);
    assert.equal(cost.complete, false);
    assert.deepEqual(cost.unpriced, [
      { name: 'black pepper', reason: 'never received with a price' },
    ]);
    const lines = cost.lines.map(
      (l: { name: string; source: string; costText: string | null }) =>
        `${l.name} ${l.source} ${l.costText}`,
    );
    assert.deepEqual(lines, [
      'pork belly lot 38.34',
      'sea salt lot 0.19',
      'brown sugar lot 0.26',
      'curing salt latest-price 0.09',
      'black pepper latest-price null',
    ]);
  });

  it('should name the meat of a cure unpriced when no lot of it was recorded', async () => {
    const other = await send(server(), 'rosa', {
      method: 'POST',
      path: '/api/batches',
      body: BELLY,
    });
    const response = await send(server(), 'rosa', {
      method: 'GET',
      path: `/api/batches/${other.json.batch.lotCode}/cost`,
    });
    assert.equal(response.status, 200, response.text);
    assert.equal(response.json.unpriced[0].name, 'the meat (green weight)');
    assert.equal(response.json.portion, null);
  });

  // 1 kg of the first batch at 38.8725 ÷ 3.60396 a kg = 10.78605… → 10.79 (its exact price, kept).
  it('should price a batch made from an earlier batch at that batch’s cost per finished kg', async () => {
    const next = await send(server(), 'rosa', {
      method: 'POST',
      path: '/api/batches',
      body: BELLY,
    });
    const nextLot = next.json.batch.lotCode;
    await addLotUse(server(), {
      batch: nextLot,
      item: 'pork-belly',
      amount: '1000',
      sourceBatch: lot,
    });
    const response = await send(server(), 'rosa', {
      method: 'GET',
      path: `/api/batches/${nextLot}/cost`,
    });
    const line = response.json.lines.find((l: { source: string }) => l.source === 'earlier-batch');
    assert.equal(line.lot, lot);
    assert.equal(line.costText, '10.79');
  });

  it('should refuse a portion that is not a weight, and an unknown lot', async () => {
    const bad = await send(server(), 'rosa', {
      method: 'GET',
      path: `/api/batches/${lot}/cost?portion=three`,
    });
    assert.equal(bad.status, 400);
    const none = await send(server(), 'rosa', {
      method: 'GET',
      path: '/api/batches/261203-ZZ-99/cost',
    });
    assert.equal(none.status, 404);
  });

  it('should chart a formula’s cost per finished kg, one point a batch, oldest first', async () => {
    const response = await send(server(), 'imke', {
      method: 'GET',
      path: '/api/formulas/quillmoor-belly/costs',
    });
    assert.equal(response.status, 200, response.text);
    const points: { lot: string; day: string; perFinishedKgText: string }[] = response.json.points;
    const mine = points.filter((point) => point.lot === lot);
    assert.deepEqual(
      mine.map((point) => point.perFinishedKgText),
      ['10.79'],
    );
    // The demo kitchen's own belly batches come before ours, the three of today last.
    assert.ok(points.length > 3);
    assert.deepEqual(points.slice(-3).map((point) => point.lot)[0], lot);
    const days = points.map((point) => point.day);
    assert.deepEqual(days, [...days].sort());
    assert.equal(response.json.truncated, false);
  });

  it('should read a formula’s batches and a batch’s lot uses on their indexes', async () => {
    const { db } = server().context;
    const plan = async (sql: string): Promise<string> => {
      if (db.dialect === 'sqlite') {
        const [rows] = await db.sequelize.query(`EXPLAIN QUERY PLAN ${sql}`);
        return (rows as { detail: string }[]).map((row) => row.detail).join('; ');
      }
      // PostgreSQL reads a table this small whole whatever its indexes: told not to where it
      // can help it, it shows the index it can use (or still a Seq Scan, when it has none).
      return db.sequelize.transaction(async (transaction) => {
        await db.sequelize.query('SET LOCAL enable_seqscan = off', { transaction });
        const [rows] = await db.sequelize.query(`EXPLAIN ${sql}`, { transaction });
        return (rows as { 'QUERY PLAN': string }[]).map((row) => row['QUERY PLAN']).join('; ');
      });
    };
    const through = (index: string): RegExp =>
      db.dialect === 'sqlite'
        ? new RegExp(`USING INDEX ${index}\\b`)
        : new RegExp(`(using|Index Scan on) ${index}\\b`);
    assert.match(
      await plan('SELECT * FROM lot_uses WHERE batch_id = 1 ORDER BY id'),
      through('lot_uses_batch'),
    );
    assert.match(
      await plan(
        "SELECT * FROM batches WHERE formula_id = 'x' ORDER BY recorded_at DESC, id DESC LIMIT 201",
      ),
      through('batches_formula'),
    );
    assert.match(
      await plan(
        "SELECT unit FROM receipts WHERE item = 'x' AND unit_cost IS NOT NULL AND decision <> 'refused' AND received_on <= '2026-12-03' ORDER BY received_on DESC, received_at DESC, id DESC LIMIT 1",
      ),
      through('receipts_latest_price'),
    );
  });
});

describe('GET /api/plans/:assembly/:day/cost', () => {
  const server = suiteServer();
  const day = dayFromToday(30);

  it('should price a plan not recorded yet at the latest prices, and want its count', async () => {
    const none = await send(server(), 'rosa', {
      method: 'GET',
      path: `/api/plans/smokehouse-burger/${day}/cost`,
    });
    assert.equal(none.status, 404, none.text);
    const response = await send(server(), 'rosa', {
      method: 'GET',
      path: `/api/plans/smokehouse-burger/${day}/cost?count=120`,
    });
    assert.equal(response.status, 200, response.text);
    assert.equal(response.json.recorded, false);
    assert.equal(response.json.count, 120);
    assert.ok(response.json.batches.length >= 3, response.text);
    assert.ok(response.json.batches.every((b: { lot: string | null }) => b.lot === null));
  });

  it('should add up the recorded batches of a plan, priced from their lots', async () => {
    const recorded = await send(server(), 'rosa', {
      method: 'POST',
      path: '/api/plans/record',
      body: { assembly: 'smokehouse-burger', count: 120, for: day },
    });
    assert.equal(recorded.status, 201, recorded.text);
    const grind = recorded.json.batches.find(
      (b: { formula: { id: string } }) => b.formula.id === 'chuck-grind',
    );
    const trim = await addReceipt(server(), {
      item: 'beef-chuck-trim',
      itemName: 'beef',
      quantity: '40',
      unit: 'kg',
      amount: '40000',
      unitCost: '7.50',
      on: dayFromToday(0),
    });
    await addLotUse(server(), {
      batch: grind.lotCode,
      item: 'beef-chuck-trim',
      amount: '1000',
      receipt: trim.id,
    });
    const response = await send(server(), 'imke', {
      method: 'GET',
      path: `/api/plans/smokehouse-burger/${day}/cost`,
    });
    assert.equal(response.status, 200, response.text);
    assert.equal(response.json.recorded, true);
    assert.equal(response.json.count, 120);
    // Every batch but the burgers' own, which are those batches put together: not priced twice.
    const burgers = recorded.json.batches.filter(
      (b: { formula: { id: string } }) => b.formula.id === 'smokehouse-burger',
    );
    assert.equal(burgers.length, 1);
    assert.equal(response.json.batches.length, recorded.json.batches.length - 1);
    const grindCost = response.json.batches.find((b: { lot: string }) => b.lot === grind.lotCode);
    // 1 kg of chuck trim at 7.50 a kg = 7.50, from its lot.
    assert.ok(
      grindCost.lines.some(
        (l: { lot: string; costText: string }) => l.lot === trim.lot && l.costText === '7.50',
      ),
    );
    const sum = response.json.batches.reduce(
      (total: number, b: { total: string }) => total + Number(b.total),
      0,
    );
    assert.ok(Math.abs(sum - Number(response.json.total)) < 1e-9);
  });
});
