import { QueryTypes, type Transaction } from 'sequelize';
import type { Database } from './database.ts';

/**
 * Runs an INSERT in the caller's write and returns the last row id it made and how many rows it
 * made (0 when ON CONFLICT DO NOTHING skipped it). Sequelize runs any statement that starts with
 * INSERT INTO without reading rows back, so RETURNING answers nothing through it; the rows of a
 * multi-row INSERT under the write lock get consecutive ids ending at `lastId`.
 */
export async function insertRow(
  db: Database,
  t: Transaction,
  sql: string,
  values: readonly unknown[],
): Promise<{ lastId: number; changes: number }> {
  const [lastId, changes] = (await db.sequelize.query(sql, {
    replacements: [...values],
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
): Promise<number> {
  const { lastId, changes } = await insertRow(db, t, sql, values);
  if (changes === 0) throw new Error('the row was not inserted');
  return lastId;
}
