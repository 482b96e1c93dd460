import type { QueryInterface } from 'sequelize';
import { runStatements } from './run-statements.ts';

/**
 * The turns (overhauls) of curing batches: the kitchen's calendar day a batch was turned, when it
 * was recorded, by whom, with an optional note. One a batch a day: the UNIQUE index refuses a
 * second, and is also the index the batch log reads a curing batch's latest turn along (its last
 * entry for the batch), so a page of the log stays a walk of the batches index.
 */
export const name = '014-turns';

const STATEMENTS = [
  `CREATE TABLE batch_turns (
    id INTEGER PRIMARY KEY AUTOINCREMENT,
    batch_id INTEGER NOT NULL REFERENCES batches(id),
    turned_on TEXT NOT NULL,
    recorded_at TEXT NOT NULL,
    person_id INTEGER NOT NULL REFERENCES people(id),
    note TEXT
  )`,
  'CREATE UNIQUE INDEX batch_turns_day ON batch_turns (batch_id, turned_on)',
];

export async function up(queryInterface: QueryInterface): Promise<void> {
  await runStatements(queryInterface, STATEMENTS);
}
