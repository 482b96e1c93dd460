import type { QueryInterface } from 'sequelize';
import { runStatements } from './run-statements.ts';

/**
 * The outbox: every message Larderbook sends (invitations, reminders), written in the same
 * transaction as whatever caused it, then handed to the mail transport. With no mail server set
 * the outbox is where messages stay ("local"); with one, each row keeps its delivery result.
 * Rows are never deleted.
 */
export const name = '004-outbox';

const STATEMENTS = [
  `CREATE TABLE outbox (
    id INTEGER PRIMARY KEY AUTOINCREMENT,
    created_at TEXT NOT NULL,
    to_address TEXT NOT NULL,
    to_name TEXT,
    person_id INTEGER REFERENCES people(id),
    subject TEXT NOT NULL,
    text TEXT NOT NULL,
    html TEXT NOT NULL,
    kind TEXT NOT NULL CHECK (kind IN ('invitation', 'reminder-flip', 'reminder-ready', 'reminder-overdue')),
    related TEXT,
    message_id TEXT NOT NULL UNIQUE,
    transport TEXT NOT NULL CHECK (transport IN ('local', 'smtp')),
    state TEXT NOT NULL CHECK (state IN ('pending', 'sending', 'sent', 'failed')),
    attempts INTEGER NOT NULL DEFAULT 0,
    last_attempt_at TEXT,
    sent_at TEXT,
    result TEXT
  )`,
  // The delivery worker's queue: only the messages still to send.
  "CREATE INDEX outbox_waiting ON outbox (id) WHERE state IN ('pending', 'sending')",
];

export async function up(queryInterface: QueryInterface): Promise<void> {
  await runStatements(queryInterface, STATEMENTS);
}
