import type { QueryInterface } from 'sequelize';
import { runStatements } from './run-statements.ts';

/**
 * Plans as they are made: one row for each assembly, count and day of service, who first worked
 * it out and when, and who last recorded its batches as planned, when and how many.
 */
export const name = '010-plans';

const STATEMENTS = [
  `CREATE TABLE plans (
    id INTEGER PRIMARY KEY AUTOINCREMENT,
    assembly_id TEXT NOT NULL,
    assembly_title TEXT NOT NULL,
    count INTEGER NOT NULL,
    service_date TEXT NOT NULL,
    made_by INTEGER REFERENCES people(id),
    made_at TEXT NOT NULL,
    recorded_by INTEGER REFERENCES people(id),
    recorded_at TEXT,
    recorded_batches INTEGER NOT NULL DEFAULT 0,
    UNIQUE (assembly_id, count, service_date)
  )`,
  'CREATE INDEX plans_made ON plans (made_at, id)',
];

export async function up(queryInterface: QueryInterface): Promise<void> {
  await runStatements(queryInterface, STATEMENTS);
}
