import type { QueryInterface } from 'sequelize';
import { postgresDdl } from './postgres-ddl.ts';

/** Whether the migrations run on PostgreSQL (else SQLite). */
export function onPostgres(queryInterface: QueryInterface): boolean {
  return queryInterface.sequelize.getDialect() === 'postgres';
}

/**
 * Runs a migration's statements in one transaction: on SQLite exactly as written, on PostgreSQL
 * through postgresDdl, so one list of statements serves both.
 */
export async function runStatements(
  queryInterface: QueryInterface,
  statements: readonly string[],
): Promise<void> {
  await queryInterface.sequelize.transaction(async (transaction) => {
    for (const sql of statements)
      await queryInterface.sequelize.query(statementFor(queryInterface, sql), { transaction });
  });
}

/** One statement of the SQLite schema in the words of the database the migrations run on. */
export function statementFor(queryInterface: QueryInterface, sql: string): string {
  return onPostgres(queryInterface) ? postgresDdl(sql) : sql;
}
