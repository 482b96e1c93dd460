import { QueryTypes, type Transaction } from 'sequelize';
import type { Database } from './database.ts';

/**
 * Runs one INSERT (which may say ON CONFLICT … DO NOTHING) inside a transaction and gives the new
 * row's id, or null when nothing was inserted. Sequelize runs any statement starting with INSERT
 * without reading rows back, so a RETURNING clause gives nothing: the statement's own last id and
 * change count say it instead.
 */
export async function insertRow(
  db: Database,
  sql: string,
  replacements: readonly unknown[],
  transaction: Transaction,
): Promise<number | null> {
  const [id, changes] = (await db.sequelize.query(sql, {
    type: QueryTypes.INSERT,
    replacements: [...replacements],
    transaction,
  })) as unknown as [number, number];
  return changes > 0 ? id : null;
}

/** Runs one INSERT that always inserts (no ON CONFLICT) and gives the new row's id. */
export async function insertNew(
  db: Database,
  sql: string,
  replacements: readonly unknown[],
  transaction: Transaction,
): Promise<number> {
  const id = await insertRow(db, sql, replacements, transaction);
  if (id === null) throw new Error('the row was not inserted');
  return id;
}
