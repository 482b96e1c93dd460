import { dec, type LastDelivery, type StockLot, type StockOnHand } from '../../shared/index.ts';
import type { Database } from '../db/database.ts';
import { readRows } from '../db/read-row.ts';
import { andSite, type SiteScope } from '../sites/site-scope.ts';

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

// The latest delivery of each item (at the site: `site` is its condition or nothing). PostgreSQL
// has no bare columns beside an aggregate: there, the first row of each item newest first
// (DISTINCT ON).
const LAST_DELIVERIES_SQL = {
  sqlite: (site: string) => `SELECT item, supplier, received_on, MAX(received_at) AS latest
     FROM receipts WHERE decision <> 'refused'${site} GROUP BY item`,
  postgres: (site: string) => `SELECT DISTINCT ON (item) item, supplier, received_on,
     received_at AS latest FROM receipts WHERE decision <> 'refused'${site}
     ORDER BY item, received_at DESC, id DESC`,
};

/**
 * The lots on hand (not emptied, not refused at the door), through the receipts_on_hand index,
 * and the latest delivery taken in of each item (SQLite gives a bare column of the row holding
 * the MAX of an aggregate query); undefined when no delivery was ever recorded, so there is no
 * stock to speak of. With a site, that site's deliveries only.
 */
export async function readStockOnHand(
  db: Database,
  site?: SiteScope,
): Promise<StockOnHand | undefined> {
  const atSite = andSite(site, 'site_id');
  const [{ any }] = await readRows<{ any: number }>(
    db.sequelize,
    `SELECT EXISTS (SELECT 1 FROM receipts WHERE 1 = 1${atSite.sql}) AS any`,
    atSite.values,
  );
  if (!any) return undefined;
  const lots = await readRows<LotRow>(
    db.sequelize,
    `SELECT item, lot_code, remaining, use_by, received_at FROM receipts
     WHERE emptied_on IS NULL AND decision <> 'refused'${atSite.sql}
     ORDER BY item, use_by, received_at`,
    atSite.values,
  );
  const last = await readRows<LastRow>(
    db.sequelize,
    LAST_DELIVERIES_SQL[db.dialect](atSite.sql),
    atSite.values,
  );
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
