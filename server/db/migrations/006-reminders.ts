import type { QueryInterface } from 'sequelize';
import { runStatements } from './run-statements.ts';

/**
 * Reminders: each person's choices (no row means the defaults of their role), and one row per
 * reminder decided, UNIQUE on (batch, kind, day due), written in the same transaction as its
 * outbox messages, so that no reminder is ever sent twice or lost, across restarts too.
 */
export const name = '006-reminders';

const STATEMENTS = [
  `CREATE TABLE reminder_prefs (
    person_id INTEGER PRIMARY KEY REFERENCES people(id),
    flip INTEGER NOT NULL CHECK (flip IN (0, 1)),
    ready INTEGER NOT NULL CHECK (ready IN (0, 1)),
    overdue INTEGER NOT NULL CHECK (overdue IN (0, 1)),
    updated_at TEXT NOT NULL
  )`,
  `CREATE TABLE reminders_sent (
    id INTEGER PRIMARY KEY AUTOINCREMENT,
    batch_id INTEGER NOT NULL REFERENCES batches(id),
    kind TEXT NOT NULL CHECK (kind IN ('flip', 'ready', 'overdue')),
    due_on TEXT NOT NULL,
    sent_at TEXT NOT NULL,
    recipients INTEGER NOT NULL,
    UNIQUE (batch_id, kind, due_on)
  )`,
];

export async function up(queryInterface: QueryInterface): Promise<void> {
  await runStatements(queryInterface, STATEMENTS);
}
