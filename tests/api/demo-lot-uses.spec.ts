import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { QueryTypes } from 'sequelize';
import { addDays } from '../../shared/calculation/dates.ts';
import { Decimal } from '../../shared/decimal.ts';
import { seedDemoLotUses } from '../../server/demo/demo-lot-uses.ts';
import { insertReceipts, lotsLeft, type FixtureReceipt } from '../helpers/lot-use-fixture.ts';
import { clearStock } from '../helpers/pull-list-fixture.ts';
import { startTestServer } from '../helpers/test-server.ts';

const TODAY = new Date().toISOString().slice(0, 10);

const belly = (lotCode: string, grams: string, useBy: string): FixtureReceipt => ({
  lotCode,
  item: 'pork-belly',
  itemName: 'pork belly',
  supplierLot: `HV-${lotCode.slice(-2)}`,
  quantity: String(Number(grams) / 1000),
  unit: 'kg',
  amount: grams,
  receivedOn: addDays(TODAY, -50),
  useBy,
});

describe("the demo kitchen's lot uses", () => {
  it('should give each demo belly batch lots first to expire first, earliest batch first', async (t) => {
    const server = await startTestServer(t);
    const { db } = server.context;
    // A small lot that expires four weeks ago, a large one good for a month, one long expired.
    await clearStock(db);

    await insertReceipts(db, [
      belly('R-DEMO-01', '6000', addDays(TODAY, -28)),
      belly('R-DEMO-02', '500000', addDays(TODAY, 30)),
      belly('R-DEMO-03', '5000', addDays(TODAY, -45)),
    ]);
    const given = await seedDemoLotUses(server.context);
    const bellies = await db.sequelize.query<{ lot_code: string; started_on: string }>(
      `SELECT lot_code, started_on FROM batches
       WHERE formula_id IN ('quillmoor-belly', 'maple-pump-belly') AND status <> 'planned'
       ORDER BY started_on, id`,
      { type: QueryTypes.SELECT },
    );
    // Only the bellies have lots on hand (their meat); every other line is short. The demo's
    // packs and burgers (server/demo/seed-assemblies.ts) draw on batches, not stock: each is
    // given the first finished batch of each of its parts.
    const assemblies = await db.sequelize.query<{ n: number }>(
      `SELECT count(*) AS n FROM batches WHERE kind = 'assembly' AND status <> 'planned'`,
      { type: QueryTypes.SELECT },
    );
    assert.ok(assemblies[0].n > 0, 'the demo has packs and burgers');
    assert.equal(given, bellies.length + assemblies[0].n);
    const uses = await db.sequelize.query<{
      batch: string;
      lot: string;
      amount: string;
      day: string;
    }>(
      `SELECT b.lot_code AS batch, r.lot_code AS lot, u.amount, u.used_on AS day
       FROM lot_uses u JOIN batches b ON b.id = u.batch_id JOIN receipts r ON r.id = u.receipt_id
       ORDER BY b.started_on, b.id, u.id`,
      { type: QueryTypes.SELECT },
    );
    assert.equal(uses[0].batch, bellies[0].lot_code);
    assert.equal(uses[0].lot, 'R-DEMO-01');
    // Never past a use-by, and the long-expired lot never drawn on.
    for (const use of uses.filter((u) => u.lot === 'R-DEMO-01'))
      assert.ok(use.day <= addDays(TODAY, -28), `${use.batch} used R-DEMO-01 on ${use.day}`);
    const left = await lotsLeft(db);
    assert.equal(left['R-DEMO-03'].remaining, '5000');
    // The small lot runs out in the second belly batch, which takes the rest from the large one:
    // 6 000 g − the first batch's share = the second's share of it.
    assert.equal(uses[1].batch, bellies[1].lot_code);
    assert.equal(new Decimal(uses[0].amount).plus(uses[1].amount).toString(), '6000');
    assert.deepEqual(left['R-DEMO-01'], { remaining: '0', emptiedOn: bellies[1].started_on });
    assert.deepEqual([uses[2].batch, uses[2].lot], [bellies[1].lot_code, 'R-DEMO-02']);
    // What each lot lost is what its uses took.
    for (const [lot, amount] of [
      ['R-DEMO-01', '6000'],
      ['R-DEMO-02', '500000'],
    ] as const) {
      const taken = uses
        .filter((u) => u.lot === lot)
        .reduce((sum, u) => sum.plus(u.amount), new Decimal(0));
      assert.equal(new Decimal(amount).minus(left[lot].remaining).toString(), taken.toString());
    }
    // Run again, it gives nothing more: the lots are recorded.
    assert.equal(await seedDemoLotUses(server.context), 0);
  });
});
