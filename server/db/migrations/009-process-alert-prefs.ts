import type { QueryInterface } from 'sequelize';
import { onPostgres, runStatements } from './run-statements.ts';

/**
 * Process alerts (a reading overdue, a cooling stage near its deadline, a deviation opened):
 * each person's choice beside their reminder choices (NULL: their role's default), and the
 * outbox's kinds widened to hold them. SQLite cannot change a CHECK in place, so the outbox is
 * copied into a table with the new CHECK, every row and id as they were.
 */
export const name = '009-process-alert-prefs';

const OUTBOX_COLUMNS = `id, created_at, to_address, to_name, person_id, subject, text, html, kind,
  related, message_id, transport, state, attempts, last_attempt_at, sent_at, result`;

const STATEMENTS = [
  'ALTER TABLE reminder_prefs ADD COLUMN process INTEGER CHECK (process IN (0, 1))',
  `CREATE TABLE outbox_next (
    id INTEGER PRIMARY KEY AUTOINCREMENT,
    created_at TEXT NOT NULL,
    to_address TEXT NOT NULL,
    to_name TEXT,
    person_id INTEGER REFERENCES people(id),
    subject TEXT NOT NULL,
    text TEXT NOT NULL,
    html TEXT NOT NULL,
    kind TEXT NOT NULL CHECK (kind IN ('invitation', 'reminder-flip', 'reminder-ready', 'reminder-overdue', 'process-alert')),
    related TEXT,
    message_id TEXT NOT NULL UNIQUE,
    transport TEXT NOT NULL CHECK (transport IN ('local', 'smtp')),
    state TEXT NOT NULL CHECK (state IN ('pending', 'sending', 'sent', 'failed')),
    attempts INTEGER NOT NULL DEFAULT 0,
    last_attempt_at TEXT,
    sent_at TEXT,
    result TEXT
  )`,
  `INSERT INTO outbox_next (${OUTBOX_COLUMNS}) SELECT ${OUTBOX_COLUMNS} FROM outbox ORDER BY id`,
  'DROP TABLE outbox',
  'ALTER TABLE outbox_next RENAME TO outbox',
  "CREATE INDEX outbox_waiting ON outbox (id) WHERE state IN ('pending', 'sending')",
];

/** PostgreSQL changes a CHECK in place (its name is PostgreSQL's own for a column's CHECK). */
const POSTGRES_STATEMENTS = [
  STATEMENTS[0],
  `ALTER TABLE outbox DROP CONSTRAINT outbox_kind_check, ADD CONSTRAINT outbox_kind_check
    CHECK (kind IN ('invitation', 'reminder-flip', 'reminder-ready', 'reminder-overdue', 'process-alert'))`,
];

export async function up(queryInterface: QueryInterface): Promise<void> {
  await runStatements(
    queryInterface,
    onPostgres(queryInterface) ? POSTGRES_STATEMENTS : STATEMENTS,
  );
}
