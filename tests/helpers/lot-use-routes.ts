import assert from 'node:assert/strict';
import { BELLY, send } from './api-calls.ts';
import type { Fixture, RouteCase } from './api-routes.ts';
import { insertReceipts } from './lot-use-fixture.ts';
import { route } from './weights-routes.ts';

let serial = 0;

/**
 * The day's next lot code after every one taken, as receiving numbers them: a fuzzed delivery
 * through the API takes the number after the highest, so a fixed number would meet it.
 */
async function freeCode(fx: Fixture, prefix: string): Promise<string> {
  const [rows] = (await fx.server.context.db.sequelize.query(
    'SELECT lot_code FROM receipts WHERE lot_code LIKE ?',
    { replacements: [`${prefix}%`] },
  )) as [{ lot_code: string }[], unknown];
  const highest = Math.max(0, ...rows.map((row) => Number(row.lot_code.slice(prefix.length))));
  return `${prefix}${String(Math.max(highest + 1, 501))}`;
}

/** A new batch of the demo belly under way, and a lot of belly received today for it. */
async function bellyWithLot(fx: Fixture): Promise<{ batch: string; lot: string }> {
  const response = await send(fx.server, fx.setup, {
    method: 'POST',
    path: '/api/batches',
    body: BELLY,
  });
  assert.equal(response.status, 201, response.text);
  const day = BELLY.batch.start;
  const lot = await freeCode(fx, `R${day.slice(2).replaceAll('-', '')}-`);
  await insertReceipts(fx.server.context.db, [
    {
      lotCode: lot,
      item: 'pork-belly',
      itemName: 'pork belly',
      supplierLot: `HV-${++serial}`,
      quantity: '5',
      unit: 'kg',
      amount: '5000',
      receivedOn: day,
    },
  ]);
  return { batch: response.json.batch.lotCode, lot };
}

/** The routes of what a batch was made from: every role reads, cooks and admins record. */
export const LOT_USE_ROUTES: readonly RouteCase[] = [
  route('GET', '/api/batches/:lot/lots', ['cook', 'reviewer', 'admin'], async (fx) => ({
    path: `/api/batches/${(await bellyWithLot(fx)).batch}/lots`,
  })),
  route('POST', '/api/batches/:lot/lots', ['cook', 'admin'], async (fx) => {
    const { batch, lot } = await bellyWithLot(fx);
    return {
      path: `/api/batches/${batch}/lots`,
      body: { picks: [{ item: 'pork-belly', lot, amount: '4.26 kg' }] },
    };
  }),
];
