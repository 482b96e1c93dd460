// The SQL of trace back and trace forward over lot_uses (migration 015). Each step of a walk is
// one lookup in an index: going back, a batch's uses by lot_uses_batch; going forward, a received
// lot's uses by lot_uses_receipt and a batch's uses as an ingredient by lot_uses_source. Lists of
// ids travel as one JSON array parameter (json_each), so a statement is prepared the same way
// whatever the number of lots. trace-plans.spec.ts holds every statement to its indexes. Uses
// recorded again (replaced_at set, migration 016) were corrected and are not followed. Each
// statement is given for both databases (dialect-sql.ts holds the fragments they spell apart).

import {
  equalsIgnoringCase,
  jsonIdTable,
  typedParameter,
  type Dialect,
} from '../db/dialect-sql.ts';

/** The deepest level a trace follows: far past any real kitchen's batches made from batches. */
export const MOST_LEVELS = 16;

/** A statement as each database spells it. */
export type DialectSql = Readonly<Record<Dialect, string>>;

function bothDialects(sql: (dialect: Dialect) => string): DialectSql {
  return { sqlite: sql('sqlite'), postgres: sql('postgres') };
}

/** A use of a lot by a batch, as the walks read it. */
export interface UseRow {
  readonly id: number;
  readonly batch_id: number;
  readonly receipt_id: number | null;
  readonly source_batch_id: number | null;
  readonly item: string;
  readonly amount: string;
  readonly used_on: string;
}

const USE_COLUMNS =
  'u.id, u.batch_id, u.receipt_id, u.source_batch_id, u.item, u.amount, u.used_on';

/**
 * Going back from one batch (?1): every batch it was made from, level by level to ?2 levels
 * (UNION drops a batch met again at the same level, so a loop ends at the level limit), then
 * the uses of each batch reached: received lots and batches alike.
 */
const backUsesSql = (dialect: Dialect): string => `WITH RECURSIVE walk(batch_id, level) AS (
    VALUES (${typedParameter(dialect, '?1', 'integer')}, 0)
    UNION
    SELECT u.source_batch_id, w.level + 1 FROM walk w
      JOIN lot_uses u ON u.batch_id = w.batch_id AND u.replaced_at IS NULL
     WHERE u.source_batch_id IS NOT NULL AND w.level < ?2
  )
  SELECT ${USE_COLUMNS}
    FROM (SELECT DISTINCT batch_id FROM walk) w
    JOIN lot_uses u ON u.batch_id = w.batch_id AND u.replaced_at IS NULL
   ORDER BY u.batch_id, u.id`;

/** BACK_USES_SQL's statement on each database. */
export const BACK_USES_SQL = bothDialects(backUsesSql);

/**
 * Going forward from received lots (?1, a JSON array of receipt ids) and batches (?2, a JSON
 * array of batch ids): every batch that used them, then every batch made from those, to ?3
 * levels; the uses that link them. A batch's uses as an ingredient are read once however often
 * the walk meets it.
 */
const forwardUsesSql = (dialect: Dialect): string => `WITH RECURSIVE walk(batch_id, level) AS (
    SELECT u.batch_id, 1 FROM ${jsonIdTable(dialect, '?1')} rj
      JOIN lot_uses u ON u.receipt_id = rj.value AND u.receipt_id IS NOT NULL AND u.replaced_at IS NULL
    UNION
    SELECT bj.value, 0 FROM ${jsonIdTable(dialect, '?2')} bj
    UNION
    SELECT u.batch_id, w.level + 1 FROM walk w
      JOIN lot_uses u ON u.source_batch_id = w.batch_id AND u.source_batch_id IS NOT NULL AND u.replaced_at IS NULL
     WHERE w.level < ?3
  )
  SELECT ${USE_COLUMNS} FROM ${jsonIdTable(dialect, '?1')} rj
    JOIN lot_uses u ON u.receipt_id = rj.value AND u.receipt_id IS NOT NULL AND u.replaced_at IS NULL
  UNION ALL
  SELECT ${USE_COLUMNS} FROM (SELECT DISTINCT batch_id FROM walk) w
    JOIN lot_uses u ON u.source_batch_id = w.batch_id AND u.source_batch_id IS NOT NULL AND u.replaced_at IS NULL
  ORDER BY 1`;

/** FORWARD_USES_SQL's statement on each database. */
export const FORWARD_USES_SQL = bothDialects(forwardUsesSql);

/** A received lot as a trace reads it. */
export interface ReceiptRow {
  readonly id: number;
  readonly lot_code: string;
  readonly item: string;
  readonly item_name: string;
  readonly supplier: string;
  readonly supplier_lot: string;
  readonly establishment: string | null;
  readonly packed_on: string | null;
  readonly use_by: string | null;
  readonly received_on: string;
  readonly unit: string;
  readonly amount: string;
  readonly remaining: string;
  readonly emptied_on: string | null;
  readonly decision: 'accepted' | 'accepted-with-action' | 'refused';
  readonly site_id: number;
}

const RECEIPT_COLUMNS = `r.id, r.lot_code, r.item, r.item_name, r.supplier, r.supplier_lot,
  r.establishment, r.packed_on, r.use_by, r.received_on, r.unit, r.amount, r.remaining,
  r.emptied_on, r.decision, r.site_id`;

/** Received lots by id (?1, a JSON array). */
export const RECEIPTS_BY_ID_SQL = bothDialects(
  (dialect) => `SELECT ${RECEIPT_COLUMNS} FROM ${jsonIdTable(dialect, '?1')} j
  JOIN receipts r ON r.id = j.value`,
);

/** A received lot by the kitchen's lot code (?1). */
export const RECEIPT_BY_LOT_SQL = `SELECT ${RECEIPT_COLUMNS} FROM receipts r WHERE r.lot_code = ?1`;

/**
 * Every receipt of a supplier's lot (?1), of one supplier when ?2 is not null (in any case, as
 * people type a name), oldest first: a lot delivered on several days is several receipts.
 */
export const RECEIPTS_BY_SUPPLIER_LOT_SQL = bothDialects(
  (dialect) => `SELECT ${RECEIPT_COLUMNS} FROM receipts r
  WHERE r.supplier_lot = ?1 AND (${typedParameter(dialect, '?2', 'text')} IS NULL OR ${equalsIgnoringCase(dialect, 'r.supplier', '?2')})
  ORDER BY r.received_on, r.id`,
);

/** A batch as a trace reads it. */
export interface BatchRow {
  readonly id: number;
  readonly lot_code: string;
  readonly formula_id: string;
  readonly formula_title: string;
  readonly status: string;
  readonly started_on: string;
  readonly ready_on: string | null;
  readonly notes: string | null;
  readonly site_id: number;
}

const BATCH_COLUMNS =
  'b.id, b.lot_code, b.formula_id, b.formula_title, b.status, b.started_on, b.ready_on, b.notes, b.site_id';

/** Batches by id (?1, a JSON array). */
export const BATCHES_BY_ID_SQL = bothDialects(
  (dialect) => `SELECT ${BATCH_COLUMNS} FROM ${jsonIdTable(dialect, '?1')} j
  JOIN batches b ON b.id = j.value`,
);

/** A batch by its lot code (?1). */
export const BATCH_BY_LOT_SQL = `SELECT ${BATCH_COLUMNS} FROM batches b WHERE b.lot_code = ?1`;
