import { QueryTypes, type Transaction } from 'sequelize';
import type { BatchStatus } from '../../shared/api/batch-record.ts';
import { Decimal } from '../../shared/decimal.ts';
import type { StockLot } from '../../shared/stock/fifo.ts';
import type { SourceCandidate } from '../../shared/stock/lot-suggestions.ts';
import type { Database } from '../db/database.ts';
import { andSite, type SiteScope } from '../sites/site-scope.ts';

/** A received lot as lot uses read it. */
export interface ReceiptRow {
  readonly id: number;
  readonly lot_code: string;
  readonly item: string;
  readonly item_name: string;
  readonly supplier: string;
  readonly supplier_lot: string;
  readonly use_by: string | null;
  readonly unit: string;
  readonly remaining: string;
  readonly decision: 'accepted' | 'accepted-with-action' | 'refused';
  readonly received_at: string;
  readonly received_on: string;
  readonly emptied_on: string | null;
}

const RECEIPT_COLUMNS = `r.id, r.lot_code, r.item, r.item_name, r.supplier, r.supplier_lot,
  r.use_by, r.unit, r.remaining, r.decision, r.received_at, r.received_on, r.emptied_on`;

function select<T extends object>(
  db: Database,
  sql: string,
  replacements: unknown[],
  t?: Transaction,
): Promise<T[]> {
  return db.sequelize.query<T>(sql, {
    replacements,
    type: QueryTypes.SELECT,
    ...(t ? { transaction: t } : {}),
  });
}

/**
 * The lots of these items on hand on a day of use: accepted, not emptied, something left, and
 * received by that day (a lot that came in later cannot have gone in). Along receipts_on_hand.
 * With a site, that site's lots only: a kitchen uses what it received.
 */
export function receiptsOnHand(
  db: Database,
  items: readonly string[],
  usedOn: string,
  t?: Transaction,
  site?: SiteScope,
): Promise<ReceiptRow[]> {
  if (items.length === 0) return Promise.resolve([]);
  const atSite = andSite(site, 'r.site_id');
  return select<ReceiptRow>(
    db,
    `SELECT ${RECEIPT_COLUMNS} FROM receipts r
     WHERE r.item IN (${items.map(() => '?').join(', ')})
       AND r.emptied_on IS NULL AND r.decision <> 'refused' AND r.received_on <= ?${atSite.sql}
     ORDER BY r.item, r.use_by, r.received_at, r.id`,
    [...items, usedOn, ...atSite.values],
    t,
  ).then((rows) => rows.filter((row) => new Decimal(row.remaining).greaterThan(0)));
}

/** One received lot by the kitchen's lot code (either case); with a site, only one of its own. */
export async function receiptByCode(
  db: Database,
  code: string,
  t: Transaction,
  site?: SiteScope,
): Promise<ReceiptRow | undefined> {
  const atSite = andSite(site, 'r.site_id');
  const [row] = await select<ReceiptRow>(
    db,
    `SELECT ${RECEIPT_COLUMNS} FROM receipts r WHERE r.lot_code = ?${atSite.sql}`,
    [code.trim().toUpperCase(), ...atSite.values],
    t,
  );
  return row;
}

/** A lot row as the first-to-expire suggestion takes it. */
export function stockLotOf(row: ReceiptRow): StockLot {
  return {
    item: row.item,
    lot: row.lot_code,
    remaining: new Decimal(row.remaining),
    receivedAt: row.received_at,
    ...(row.use_by ? { useBy: row.use_by } : {}),
  };
}

/** A lot use as recorded, with its lot (received or a batch). */
export interface UseRow {
  readonly id: number;
  readonly item: string;
  readonly amount: string;
  readonly used_on: string;
  readonly receipt_id: number | null;
  readonly source_batch_id: number | null;
  readonly lot_code: string;
  readonly item_name: string | null;
  readonly supplier: string | null;
  readonly supplier_lot: string | null;
  readonly unit: string | null;
  readonly use_by: string | null;
}

/** The lot uses of a batch that stand (not replaced), in the order recorded. */
export function standingUses(db: Database, batchId: number, t?: Transaction): Promise<UseRow[]> {
  return select<UseRow>(
    db,
    `SELECT u.id, u.item, u.amount, u.used_on, u.receipt_id, u.source_batch_id,
       COALESCE(r.lot_code, s.lot_code) AS lot_code,
       COALESCE(r.item_name, s.formula_title) AS item_name, r.supplier, r.supplier_lot,
       r.unit, r.use_by
     FROM lot_uses u
     LEFT JOIN receipts r ON r.id = u.receipt_id
     LEFT JOIN batches s ON s.id = u.source_batch_id
     WHERE u.batch_id = ? AND u.replaced_at IS NULL ORDER BY u.id`,
    [batchId],
    t,
  );
}

interface CandidateRow {
  readonly id: number;
  readonly lot_code: string;
  readonly formula_id: string;
  readonly formula_revision: string;
  readonly formula_title: string;
  readonly status: BatchStatus;
  readonly started_on: string;
  readonly released: number | boolean;
  readonly done_at: string | null;
}

/** A batch that may be drawn on, with its id, its formula's title and revision, and when it was finished. */
export type SourceRow = SourceCandidate & {
  readonly id: number;
  readonly title: string;
  readonly formulaRevision: string;
  /** The day it was marked done (UTC, as start days are counted), or null while under way. */
  readonly finishedOn: string | null;
};

const CANDIDATE_COLUMNS = `b.id, b.lot_code, b.formula_id, b.formula_revision, b.formula_title,
  b.status, b.started_on,
  EXISTS (SELECT 1 FROM verifications v WHERE v.batch_id = b.id) AS released,
  (SELECT MIN(e.at) FROM batch_events e
   WHERE e.batch_id = b.id AND e.type = 'status' AND e.to_status = 'done') AS done_at`;

function sourceRow(row: CandidateRow): SourceRow {
  return {
    id: row.id,
    lotCode: row.lot_code,
    formulaId: row.formula_id,
    formulaRevision: row.formula_revision,
    title: row.formula_title,
    status: row.status,
    // EXISTS is 0 or 1 on SQLite, a boolean on PostgreSQL.
    released: Boolean(row.released),
    startedOn: row.started_on,
    finishedOn: row.done_at === null ? null : new Date(row.done_at).toISOString().slice(0, 10),
  };
}

/**
 * The batches of these formulas started by a day, the latest 200: candidates for an assembly's
 * parts (sourceBatchOrder puts them in the order to suggest). The latest, so that years of
 * batches never push this week's out of the list. With a site, that site's batches only.
 */
export async function sourceCandidates(
  db: Database,
  formulas: readonly string[],
  usedOn: string,
  t?: Transaction,
  site?: SiteScope,
): Promise<SourceRow[]> {
  if (formulas.length === 0) return [];
  const atSite = andSite(site, 'b.site_id');
  const rows = await select<CandidateRow>(
    db,
    `SELECT ${CANDIDATE_COLUMNS}
     FROM batches b
     WHERE b.formula_id IN (${formulas.map(() => '?').join(', ')}) AND b.started_on <= ?${atSite.sql}
     ORDER BY b.started_on DESC, b.lot_code DESC LIMIT 200`,
    [...formulas, usedOn, ...atSite.values],
    t,
  );
  return rows.map(sourceRow);
}

/** Batches by id, as candidates are read: the sources a batch was made from. */
export async function sourceRowsById(
  db: Database,
  ids: readonly number[],
  t?: Transaction,
): Promise<SourceRow[]> {
  if (ids.length === 0) return [];
  const rows = await select<CandidateRow>(
    db,
    `SELECT ${CANDIDATE_COLUMNS} FROM batches b WHERE b.id IN (${ids.map(() => '?').join(', ')})`,
    [...ids],
    t,
  );
  return rows.map(sourceRow);
}

/**
 * Whether a batch draws, through any number of batches made from batches, on another: drawing
 * on the source would then close a loop. One recursive walk along lot_uses_batch.
 */
export async function drawsOn(
  db: Database,
  from: number,
  target: number,
  t: Transaction,
): Promise<boolean> {
  const [row] = await select<{ found: number | boolean }>(
    db,
    `WITH RECURSIVE up(id) AS (
       SELECT ? UNION
       SELECT u.source_batch_id FROM lot_uses u JOIN up ON u.batch_id = up.id
       WHERE u.source_batch_id IS NOT NULL AND u.replaced_at IS NULL)
     SELECT EXISTS (SELECT 1 FROM up WHERE id = ?) AS found`,
    [from, target],
    t,
  );
  // EXISTS is 0 or 1 on SQLite, a boolean on PostgreSQL.
  return Boolean(row?.found);
}
