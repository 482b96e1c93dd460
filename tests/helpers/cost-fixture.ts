// Received lots and lot uses written straight into the tables (migration 015), for the costing
// tests: the receiving and consuming code is written alongside, and costing reads only the rows.
import assert from 'node:assert/strict';
import { BELLY, send } from './api-calls.ts';
import { addRow, idOf } from './process-rows.ts';
import { clearStock } from './pull-list-fixture.ts';
import type { TestServer } from './test-server.ts';

/** A delivery as the costing tests need it; the rest of the row is filled in. */
export interface ReceiptToAdd {
  readonly item: string;
  readonly itemName: string;
  /** How much came, in `unit`, and the same in the item's base measure (grams, ml, each). */
  readonly quantity: string;
  readonly unit: string;
  readonly amount: string;
  /** What is left, base measure; all of it when not said. */
  readonly remaining?: string;
  /** Price per unit received; none when not said. */
  readonly unitCost?: string;
  /** The day it came in, YYYY-MM-DD. */
  readonly on: string;
  readonly decision?: 'accepted' | 'accepted-with-action' | 'refused';
  readonly emptiedOn?: string;
}

let sequence = 0;

/** A day `days` from today (UTC), YYYY-MM-DD. */
export function dayFromToday(days: number): string {
  return new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
}

/** Writes a receipt (taken in by the demo admin); its id and the kitchen's lot code. */
export async function addReceipt(
  server: TestServer,
  receipt: ReceiptToAdd,
): Promise<{ id: number; lot: string }> {
  const lot = `R${receipt.on.slice(2).replaceAll('-', '')}-${String(++sequence).padStart(2, '0')}`;
  const id = await addRow(server, 'receipts', {
    lot_code: lot,
    item: receipt.item,
    item_name: receipt.itemName,
    supplier: 'Harrow Vale Meats',
    supplier_lot: `HV-${sequence}`,
    quantity: receipt.quantity,
    unit: receipt.unit,
    amount: receipt.amount,
    remaining: receipt.remaining ?? receipt.amount,
    unit_cost: receipt.unitCost ?? null,
    decision: receipt.decision ?? 'accepted',
    received_at: `${receipt.on}T07:30:00Z`,
    received_on: receipt.on,
    person_id: await idOf(server, 'people', 'rosa'),
    emptied_on: receipt.emptiedOn ?? null,
  });
  return { id, lot };
}

/** Writes a lot use: a batch (by lot code) drew `amount` (base measure) on a lot or earlier batch. */
export async function addLotUse(
  server: TestServer,
  use: {
    readonly batch: string;
    readonly item: string;
    readonly amount: string;
    readonly receipt?: number;
    readonly sourceBatch?: string;
  },
): Promise<number> {
  return addRow(server, 'lot_uses', {
    batch_id: await idOf(server, 'batches', use.batch),
    receipt_id: use.receipt ?? null,
    source_batch_id:
      use.sourceBatch === undefined ? null : await idOf(server, 'batches', use.sourceBatch),
    item: use.item,
    amount: use.amount,
    used_on: dayFromToday(0),
  });
}

/**
 * Empties the stock (the demo's deliveries would set the latest prices), then records a batch of
 * the demo belly, 4.26 kg green, as the demo cook; its lot code.
 */
export async function bellyInEmptyKitchen(server: TestServer): Promise<string> {
  await clearStock(server.context.db);
  const recorded = await send(server, 'rosa', {
    method: 'POST',
    path: '/api/batches',
    body: BELLY,
  });
  assert.equal(recorded.status, 201, recorded.text);
  return recorded.json.batch.lotCode as string;
}
