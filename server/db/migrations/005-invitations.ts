import type { QueryInterface } from 'sequelize';
import { runStatements } from './run-statements.ts';

/**
 * Invitations to set a password: a single-use token per invitation, of which only the sha-256
 * hash is kept. A newer invitation for the same person replaces the older ones.
 */
export const name = '005-invitations';

const STATEMENTS = [
  `CREATE TABLE invitations (
    id INTEGER PRIMARY KEY AUTOINCREMENT,
    person_id INTEGER NOT NULL REFERENCES people(id),
    token_hash TEXT NOT NULL UNIQUE,
    created_at TEXT NOT NULL,
    created_by INTEGER REFERENCES people(id),
    expires_at TEXT NOT NULL,
    used_at TEXT,
    replaced_at TEXT
  )`,
  'CREATE INDEX invitations_person ON invitations (person_id, id)',
];

export async function up(queryInterface: QueryInterface): Promise<void> {
  await runStatements(queryInterface, STATEMENTS);
}
