/**
 * Received lots for the lot-use tests, written by plain SQL (the receiving routes are another
 * part's). Invented Quillmoor suppliers.
 */
import assert from 'node:assert/strict';
import { QueryTypes } from 'sequelize';
import type { Database } from '../../server/db/database.ts';
import { insertRow } from '../../server/db/insert-row.ts';
import type { TestServer } from './test-server.ts';

/** A lot as received, in the item's base measure (grams for a kg item). */
export interface FixtureReceipt {
  readonly lotCode: string;
  readonly item: string;
  readonly itemName: string;
  readonly supplier?: string;
  readonly supplierLot: string;
  readonly quantity: string;
  readonly unit: string;
  /** In the base measure; remaining starts the same. */
  readonly amount: string;
  readonly receivedOn: string;
  readonly useBy?: string;
  readonly decision?: 'accepted' | 'accepted-with-action' | 'refused';
}

async function personId(db: Database, username: string): Promise<number> {
  const [row] = await db.sequelize.query<{ id: number }>(
    'SELECT id FROM people WHERE username = ?',
    { replacements: [username], type: QueryTypes.SELECT },
  );
  return row.id;
}

/** Inserts received lots; their ids in order. */
export async function insertReceipts(
  db: Database,
  receipts: readonly FixtureReceipt[],
): Promise<number[]> {
  const by = await personId(db, 'rosa');
  return db.write(async (t) => {
    const ids: number[] = [];
    for (const r of receipts) {
      const { lastId } = await insertRow(
        db,
        t,
        `INSERT INTO receipts (lot_code, item, item_name, supplier, supplier_lot, use_by, quantity,
           unit, amount, remaining, decision, received_at, received_on, person_id)
         VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
        [
          r.lotCode,
          r.item,
          r.itemName,
          r.supplier ?? 'Hollin Vale Farm',
          r.supplierLot,
          r.useBy ?? null,
          r.quantity,
          r.unit,
          r.amount,
          r.amount,
          r.decision ?? 'accepted',
          `${r.receivedOn}T07:00:00Z`,
          r.receivedOn,
          by,
        ],
      );
      ids.push(lastId);
    }
    return ids;
  });
}

/** What is left of each lot, and whether it is emptied, by lot code. */
export async function lotsLeft(
  db: Database,
): Promise<Record<string, { remaining: string; emptiedOn: string | null }>> {
  const rows = await db.sequelize.query<{
    lot_code: string;
    remaining: string;
    emptied_on: string | null;
  }>('SELECT lot_code, remaining, emptied_on FROM receipts ORDER BY id', {
    type: QueryTypes.SELECT,
  });
  return Object.fromEntries(
    rows.map((r) => [r.lot_code, { remaining: r.remaining, emptiedOn: r.emptied_on }]),
  );
}

/**
 * Records a batch of an assembly formula through the product's own route, as a cook would: a
 * count of units on a day (done on its day, planned for a later one); its lot code.
 */
export async function recordAssembly(
  server: TestServer,
  formula: string,
  start: string,
  count = '10',
): Promise<string> {
  const response = await server.as('tobin').post('/api/batches', {
    formula,
    batch: { count, start },
  });
  assert.equal(response.status, 201, response.text);
  return response.json.batch.lotCode as string;
}
