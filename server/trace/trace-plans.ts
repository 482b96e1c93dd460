import type { Sequelize } from 'sequelize';
import { readRows } from '../db/read-row.ts';
import {
  BACK_USES_SQL,
  BATCH_BY_LOT_SQL,
  BATCHES_BY_ID_SQL,
  FORWARD_USES_SQL,
  MOST_LEVELS,
  RECEIPT_BY_LOT_SQL,
  RECEIPTS_BY_ID_SQL,
  RECEIPTS_BY_SUPPLIER_LOT_SQL,
  type DialectSql,
} from './trace-sql.ts';

/** A statement of the trace, with values to plan it with and the indexes its steps must use. */
export interface TraceStatement {
  readonly name: string;
  readonly sql: string | DialectSql;
  readonly values: readonly (string | number)[];
  readonly indexes: readonly string[];
}

/** Every statement a trace or recall runs (server/trace/trace-sql.ts). */
export const TRACE_STATEMENTS: readonly TraceStatement[] = [
  {
    name: 'lot by code (received)',
    sql: RECEIPT_BY_LOT_SQL,
    values: ['R261203-01'],
    indexes: ['sqlite_autoindex_receipts_1'],
  },
  {
    name: 'lot by code (batch)',
    sql: BATCH_BY_LOT_SQL,
    values: ['261203-QB-01'],
    indexes: ['sqlite_autoindex_batches_1'],
  },
  {
    name: 'receipts of a supplier lot',
    sql: RECEIPTS_BY_SUPPLIER_LOT_SQL,
    values: ['4471', 'Hollin Farm'],
    indexes: ['receipts_supplier_lot'],
  },
  { name: 'trace back', sql: BACK_USES_SQL, values: [1, MOST_LEVELS], indexes: ['lot_uses_batch'] },
  {
    name: 'trace forward',
    sql: FORWARD_USES_SQL,
    values: ['[1,2]', '[3]', MOST_LEVELS],
    indexes: ['lot_uses_receipt', 'lot_uses_source'],
  },
  {
    name: 'received lots by id',
    sql: RECEIPTS_BY_ID_SQL,
    values: ['[1,2]'],
    indexes: ['INTEGER PRIMARY KEY'],
  },
  {
    name: 'batches by id',
    sql: BATCHES_BY_ID_SQL,
    values: ['[1,2]'],
    indexes: ['INTEGER PRIMARY KEY'],
  },
];

/** The lines of a statement's EXPLAIN QUERY PLAN, as SQLite words them. */
export async function planOf(sequelize: Sequelize, statement: TraceStatement): Promise<string[]> {
  const rows = await readRows<{ detail: string }>(
    sequelize,
    `EXPLAIN QUERY PLAN ${sqliteText(statement)}`,
    statement.values as (string | number)[],
  );
  return rows.map((row) => row.detail);
}

/**
 * The lines of a plan that read a table of the records whole: a SCAN of lot_uses, batches or
 * receipts (by name or by the statements' aliases u, b, r) rather than a SEARCH through an index,
 * or an automatic index, which SQLite builds for the one query by reading the whole table.
 */
export function fullScans(plan: readonly string[]): string[] {
  return plan.filter(
    (line) => /^SCAN (lot_uses|batches|receipts|u|b|r)\b/.test(line) || /AUTOMATIC/.test(line),
  );
}

/** The statement's text on SQLite. */
function sqliteText(statement: TraceStatement): string {
  return typeof statement.sql === 'string' ? statement.sql : statement.sql.sqlite;
}
