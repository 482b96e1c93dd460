import { QueryTypes, type Transaction } from 'sequelize';
import type { Database } from './database.ts';

/** How the values reach the statement. */
export interface InsertOptions {
  /**
   * Bound as $1, $2… parameters rather than replaced into the SQL's ? marks: for text that may
   * hold any character (a NUL would end a replaced statement early).
   */
  readonly bound?: boolean;
}

/**
 * Runs an INSERT in the caller's write and returns the last row id it made and how many rows it
 * made (0 when ON CONFLICT DO NOTHING skipped it). On SQLite, Sequelize runs any statement that
 * starts with INSERT INTO without reading rows back, so RETURNING answers nothing through it and
 * the statement's last row id is read instead; PostgreSQL has no last row id, so there the
 * statement returns its ids. Only the last id is given: with several writers at once, the ids of
 * a multi-row INSERT on PostgreSQL need not be consecutive.
 */
export async function insertRow(
  db: Database,
  t: Transaction,
  sql: string,
  values: readonly unknown[],
  { bound = false }: InsertOptions = {},
): Promise<{ lastId: number; changes: number }> {
  const parameters = bound ? { bind: [...values] } : { replacements: [...values] };
  if (db.dialect === 'postgres') {
    const rows = await db.sequelize.query<{ id: number }>(`${sql} RETURNING id`, {
      ...parameters,
      type: QueryTypes.SELECT,
      transaction: t,
    });
    return { lastId: rows.at(-1)?.id ?? 0, changes: rows.length };
  }
  const [lastId, changes] = (await db.sequelize.query(sql, {
    ...parameters,
    type: QueryTypes.INSERT,
    transaction: t,
  })) as unknown as [number, number];
  return { lastId, changes };
}

/** Runs one INSERT that always inserts (no ON CONFLICT) and gives the new row's id. */
export async function insertNew(
  db: Database,
  sql: string,
  values: readonly unknown[],
  t: Transaction,
  options: InsertOptions = {},
): Promise<number> {
  const { lastId, changes } = await insertRow(db, t, sql, values, options);
  if (changes === 0) throw new Error('the row was not inserted');
  return lastId;
}
