import type { Receipt, ReceiptPage, StockItemView, StockView } from '../../shared/api/receipt.ts';
import { daysBetween, isIsoDate } from '../../shared/calculation/dates.ts';
import { Decimal, sum } from '../../shared/decimal.ts';
import { remainingInUnit } from '../../shared/stock/base-measure.ts';
import { suggestLots, type StockLot } from '../../shared/stock/fifo.ts';
import { likeAnyCase } from '../db/dialect-sql.ts';
import { readRows } from '../db/read-row.ts';
import { andSite, siteCondition, type SiteScope } from '../sites/site-scope.ts';
import { badRequest, notFound } from '../http/app-error.ts';
import { RECEIPT_LOT_PATTERN } from './receipt-lot-code.ts';
import { RECEIPT_SELECT, toReceipt, type ReceiptRow } from './receipt-rows.ts';
import type { StockDeps } from './receipt-writes.ts';

/** Deliveries on a page when the request does not say, and the most one page may hold. */
const PAGE_SIZE = 50;
const MAX_PAGE_SIZE = 200;

/** The filters GET /api/receipts takes, as strings from the query. */
export interface ReceiptQuery {
  readonly item?: string;
  readonly supplier?: string;
  readonly supplierLot?: string;
  readonly from?: string;
  readonly to?: string;
  readonly page?: string;
  readonly pageSize?: string;
}

async function withDeviations(deps: StockDeps, rows: ReceiptRow[]): Promise<Receipt[]> {
  return Promise.all(
    rows.map(async (row) =>
      toReceipt(
        row,
        row.deviation_id === null ? null : await deps.process.deviation(row.deviation_id),
      ),
    ),
  );
}

function whole(text: string | undefined, field: string, fallback: number, max: number): number {
  if (text === undefined) return fallback;
  const n = Number(text);
  if (!/^\d+$/.test(text) || n < 1 || n > max)
    throw badRequest(`${field} must be a whole number from 1 to ${max}`, [{ field }]);
  return n;
}

/**
 * A page of deliveries, newest first, filtered by item, supplier (any part of its name, any
 * case), supplier's lot (exactly) and receiving days from/to (both included).
 * With a site, that site's deliveries only.
 * @throws AppError 400 a day that is no date, a page out of range
 */
export async function listReceipts(
  deps: StockDeps,
  query: ReceiptQuery,
  site?: SiteScope,
): Promise<ReceiptPage> {
  const atSite = siteCondition(site, 'r.site_id');
  const where: string[] = atSite.sql ? [atSite.sql] : [];
  const values: (string | number)[] = [...atSite.values];
  const add = (clause: string, value: string): void => {
    where.push(clause);
    values.push(value);
  };
  if (query.item) add('r.item = ?', query.item);
  // Any part of the supplier's name: LIKE's own characters typed are taken as themselves.
  if (query.supplier)
    add(
      `r.supplier ${likeAnyCase(deps.db.dialect)} ? ESCAPE '\\'`,
      `%${query.supplier.replace(/[\\%_]/g, (c) => `\\${c}`)}%`,
    );
  if (query.supplierLot) add('r.supplier_lot = ?', query.supplierLot);
  for (const [key, op] of [
    ['from', '>='],
    ['to', '<='],
  ] as const) {
    const day = query[key];
    if (day === undefined) continue;
    if (!isIsoDate(day)) throw badRequest(`${key} must be a day, YYYY-MM-DD`, [{ field: key }]);
    add(`r.received_on ${op} ?`, day);
  }
  const page = whole(query.page, 'page', 1, 1_000_000);
  const pageSize = whole(query.pageSize, 'pageSize', PAGE_SIZE, MAX_PAGE_SIZE);
  const filter = where.length ? `WHERE ${where.join(' AND ')}` : '';
  const [count] = await readRows<{ n: number }>(
    deps.db.sequelize,
    `SELECT COUNT(*) AS n FROM receipts r ${filter}`,
    values,
  );
  const rows = await readRows<ReceiptRow>(
    deps.db.sequelize,
    `${RECEIPT_SELECT} ${filter} ORDER BY r.received_at DESC, r.id DESC LIMIT ? OFFSET ?`,
    [...values, pageSize, (page - 1) * pageSize],
  );
  return { receipts: await withDeviations(deps, rows), total: count.n, page, pageSize };
}

/** The kitchen's lot code asked for, upper-cased; not found when the text cannot be one. */
export function receiptLotOf(lot: string): string {
  const code = lot.toUpperCase();
  if (!RECEIPT_LOT_PATTERN.test(code)) throw notFound(`no delivery with lot code ${lot}`);
  return code;
}

/** One delivery by the kitchen's lot code, in either case. @throws AppError 404 */
export async function showReceipt(deps: StockDeps, lot: string): Promise<Receipt> {
  const code = receiptLotOf(lot);
  const rows = await readRows<ReceiptRow>(
    deps.db.sequelize,
    `${RECEIPT_SELECT} WHERE r.lot_code = ?`,
    [code],
  );
  if (!rows.length) throw notFound(`no delivery with lot code ${code}`);
  return (await withDeviations(deps, rows))[0];
}

/**
 * What is on hand by item, on `today`: each item's usable lots in the order they should be used
 * (first to expire first out, as suggestLots orders them), then its expired lots, marked, to be
 * discarded. Items by name. With a site, that site's lots only.
 */
export async function stockOnHand(
  deps: StockDeps,
  today: string,
  site?: SiteScope,
): Promise<StockView> {
  const atSite = andSite(site, 'r.site_id');
  const rows = await readRows<ReceiptRow>(
    deps.db.sequelize,
    `${RECEIPT_SELECT} WHERE r.emptied_on IS NULL AND r.decision <> 'refused'${atSite.sql}
     ORDER BY r.item, r.use_by, r.received_at`,
    atSite.values,
  );
  const byItem = new Map<string, ReceiptRow[]>();
  for (const row of rows) byItem.set(row.item, [...(byItem.get(row.item) ?? []), row]);
  const items: StockItemView[] = [];
  for (const [item, itemRows] of byItem) {
    const lots: StockLot[] = itemRows.map((row) => ({
      item,
      lot: row.lot_code,
      remaining: new Decimal(row.remaining),
      ...(row.use_by === null ? {} : { useBy: row.use_by }),
      receivedAt: row.received_at,
    }));
    const total = sum(lots.map((lot) => lot.remaining));
    const { takes, expired } = suggestLots(lots, item, total, today);
    const rowOf = new Map(itemRows.map((row) => [row.lot_code, row]));
    const view = (lot: StockLot, isExpired: boolean) => {
      const row = rowOf.get(lot.lot)!;
      return {
        lotCode: row.lot_code,
        supplier: row.supplier,
        supplierLot: row.supplier_lot,
        remainingInUnit: remainingInUnit(
          lot.remaining,
          new Decimal(row.quantity),
          new Decimal(row.amount),
        ).toString(),
        unit: row.unit,
        remaining: row.remaining,
        useBy: row.use_by,
        daysLeft: row.use_by === null ? null : daysBetween(today, row.use_by),
        expired: isExpired,
        receivedAt: row.received_at,
      };
    };
    const usable = takes.map((take) => take.lot);
    items.push({
      item,
      name: itemRows[0].item_name,
      measure: toReceipt(itemRows[0], null).measure,
      onHand: sum(usable.map((lot) => lot.remaining)).toString(),
      lots: [...usable.map((lot) => view(lot, false)), ...expired.map((lot) => view(lot, true))],
    });
  }
  items.sort((a, b) => a.name.localeCompare(b.name) || a.item.localeCompare(b.item));
  return { today, items };
}
