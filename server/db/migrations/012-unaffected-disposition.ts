import type { QueryInterface } from 'sequelize';
import { onPostgres, runStatements } from './run-statements.ts';

/**
 * A corrective action may say the product was not affected: the server closes so a deadline
 * deviation opened before readings taken in time were entered, once they show the limit was met
 * (the deviation stays on the record, closed with the reason). SQLite cannot change a CHECK in
 * place, so corrective_actions is copied into a table with the new CHECK, every row and id as
 * they were.
 */
export const name = '012-unaffected-disposition';

const COLUMNS = `id, deviation_id, cause, restored, prevention, disposition, disposition_grams,
  recorded_by, recorded_at, corrects_id, reason`;

const STATEMENTS = [
  `CREATE TABLE corrective_actions_next (
    id INTEGER PRIMARY KEY AUTOINCREMENT,
    deviation_id INTEGER NOT NULL REFERENCES deviations(id),
    cause TEXT NOT NULL,
    restored TEXT NOT NULL,
    prevention TEXT NOT NULL,
    disposition TEXT NOT NULL CHECK (disposition IN ('recooked', 'rechilled', 'reworked', 'diverted', 'discarded', 'unaffected')),
    disposition_grams TEXT,
    recorded_by INTEGER REFERENCES people(id),
    recorded_at TEXT NOT NULL,
    corrects_id INTEGER,
    reason TEXT
  )`,
  `INSERT INTO corrective_actions_next (${COLUMNS}) SELECT ${COLUMNS} FROM corrective_actions ORDER BY id`,
  'DROP TABLE corrective_actions',
  'ALTER TABLE corrective_actions_next RENAME TO corrective_actions',
  'CREATE INDEX corrective_actions_deviation ON corrective_actions (deviation_id, id)',
];

/** PostgreSQL changes a CHECK in place (its name is PostgreSQL's own for a column's CHECK). */
const POSTGRES_STATEMENTS = [
  `ALTER TABLE corrective_actions DROP CONSTRAINT corrective_actions_disposition_check,
    ADD CONSTRAINT corrective_actions_disposition_check CHECK (disposition IN
      ('recooked', 'rechilled', 'reworked', 'diverted', 'discarded', 'unaffected'))`,
];

export async function up(queryInterface: QueryInterface): Promise<void> {
  await runStatements(
    queryInterface,
    onPostgres(queryInterface) ? POSTGRES_STATEMENTS : STATEMENTS,
  );
}
