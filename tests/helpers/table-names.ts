import type { Database } from '../../server/db/database.ts';

/** The names of the tables a test server's database holds, sorted, on SQLite or PostgreSQL. */
export async function tableNames(db: Database): Promise<string[]> {
  const tables = (await db.sequelize.getQueryInterface().showAllTables()) as unknown[];
  // Sequelize names a table by its name, or on some dialects as { tableName, schema }.
  return tables
    .map((table) =>
      typeof table === 'string' ? table : (table as { tableName: string }).tableName,
    )
    .sort();
}
