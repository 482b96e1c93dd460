import assert from 'node:assert/strict';
import { send } from './api-calls.ts';
import type { Fixture, Role, RouteCase } from './api-routes.ts';
import { route } from './equipment-routes.ts';

let serial = 0;

const RECEIVERS: readonly Role[] = ['cook', 'admin'];
const ALL: readonly Role[] = ['cook', 'reviewer', 'admin'];

/** A chilled delivery within its limit, with a supplier lot no other cell used. */
const delivery = () => ({
  item: 'pork-belly',
  supplier: 'Matrix Meats',
  supplierLot: `M-${++serial}`,
  establishment: 'EST. 9012',
  quantity: '10',
  unit: 'kg',
  temperature: '3 °C',
});

/** A delivery received by the setup's admin, for a cell that reads or discards it. */
async function receivedLot(fx: Fixture): Promise<string> {
  const answer = await send(fx.server, fx.setup, {
    method: 'POST',
    path: '/api/receipts',
    body: delivery(),
  });
  assert.equal(answer.status, 201, `setup POST /api/receipts: ${answer.text}`);
  return answer.json.receipt.lotCode;
}

/** Receiving and stock (server/stock/receipts-router.ts): cooks and admins write, all read. */
export const RECEIPT_ROUTES: readonly RouteCase[] = [
  route('GET', '/api/receipts', ALL, async () => ({ path: '/api/receipts?pageSize=5' })),
  route('POST', '/api/receipts', RECEIVERS, async () => ({
    path: '/api/receipts',
    body: delivery(),
  })),
  route('GET', '/api/receipts/:lot', ALL, async (fx) => ({
    path: `/api/receipts/${await receivedLot(fx)}`,
  })),
  route('POST', '/api/receipts/:lot/discard', RECEIVERS, async (fx) => ({
    path: `/api/receipts/${await receivedLot(fx)}/discard`,
    body: { reason: 'Dropped on the dock.' },
  })),
  route('GET', '/api/stock', ALL, async () => ({ path: '/api/stock' })),
  route('GET', '/api/stock/items', ALL, async () => ({ path: '/api/stock/items' })),
];
