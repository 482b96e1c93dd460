import { dec, type LastDelivery, type StockLot, type StockOnHand } from '../../shared/index.ts';
import type { Database } from '../db/database.ts';
import { readRows } from '../db/read-row.ts';

interface LotRow {
  item: string;
  lot_code: string;
  remaining: string;
  use_by: string | null;
  received_at: string;
}

interface LastRow {
  item: string;
  supplier: string;
  received_on: string;
}

// The latest delivery of each item. PostgreSQL has no bare columns beside an aggregate: there,
// the first row of each item newest first (DISTINCT ON).
const LAST_DELIVERIES_SQL = {
  sqlite: `SELECT item, supplier, received_on, MAX(received_at) AS latest FROM receipts
     WHERE decision <> 'refused' GROUP BY item`,
  postgres: `SELECT DISTINCT ON (item) item, supplier, received_on, received_at AS latest
     FROM receipts WHERE decision <> 'refused' ORDER BY item, received_at DESC, id DESC`,
};

/**
 * The lots on hand (not emptied, not refused at the door), through the receipts_on_hand index,
 * and the latest delivery taken in of each item (SQLite gives a bare column of the row holding
 * the MAX of an aggregate query); undefined when no delivery was ever recorded, so there is no
 * stock to speak of.
 */
export async function readStockOnHand(db: Database): Promise<StockOnHand | undefined> {
  const [{ any }] = await readRows<{ any: number }>(
    db.sequelize,
    'SELECT EXISTS (SELECT 1 FROM receipts) AS any',
    [],
  );
  if (!any) return undefined;
  const lots = await readRows<LotRow>(
    db.sequelize,
    `SELECT item, lot_code, remaining, use_by, received_at FROM receipts
     WHERE emptied_on IS NULL AND decision <> 'refused' ORDER BY item, use_by, received_at`,
    [],
  );
  const last = await readRows<LastRow>(db.sequelize, LAST_DELIVERIES_SQL[db.dialect], []);
  return {
    lots: lots.map((row): StockLot => ({
      item: row.item,
      lot: row.lot_code,
      remaining: dec(row.remaining),
      ...(row.use_by ? { useBy: row.use_by } : {}),
      receivedAt: row.received_at,
    })),
    lastFrom: new Map(
      last.map((row): [string, LastDelivery] => [
        row.item,
        { supplier: row.supplier, receivedOn: row.received_on },
      ]),
    ),
  };
}
