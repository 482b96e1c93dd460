import type { QueryInterface } from 'sequelize';
import { onPostgres, runStatements } from './run-statements.ts';

/** The first schema: people, sessions, the audit log, formula revisions, batches and their events. */
export const name = '001-initial';

const STATEMENTS = [
  `CREATE TABLE people (
    id INTEGER PRIMARY KEY AUTOINCREMENT,
    username TEXT NOT NULL UNIQUE COLLATE NOCASE,
    display_name TEXT NOT NULL,
    email TEXT,
    role TEXT NOT NULL CHECK (role IN ('admin', 'cook', 'reviewer')),
    password_hash TEXT NOT NULL,
    active INTEGER NOT NULL DEFAULT 1,
    demo INTEGER NOT NULL DEFAULT 0,
    created_at TEXT NOT NULL,
    updated_at TEXT NOT NULL
  )`,
  // The table connect-session-sequelize expects; created here so the store never syncs schema.
  `CREATE TABLE "Sessions" (
    sid VARCHAR(36) PRIMARY KEY,
    expires DATETIME,
    data TEXT,
    "createdAt" DATETIME NOT NULL,
    "updatedAt" DATETIME NOT NULL
  )`,
  `CREATE TABLE audit_events (
    id INTEGER PRIMARY KEY AUTOINCREMENT,
    at TEXT NOT NULL,
    actor_id INTEGER REFERENCES people(id),
    actor_name TEXT,
    action TEXT NOT NULL,
    subject TEXT,
    detail TEXT,
    ip TEXT
  )`,
  'CREATE INDEX audit_events_at ON audit_events (at, id)',
  `CREATE TABLE formula_revisions (
    id INTEGER PRIMARY KEY AUTOINCREMENT,
    formula_id TEXT NOT NULL,
    revision TEXT NOT NULL,
    yaml TEXT NOT NULL,
    title TEXT,
    kind TEXT,
    message TEXT NOT NULL,
    source TEXT NOT NULL CHECK (source IN ('save', 'upload', 'disk', 'create', 'delete')),
    author_id INTEGER REFERENCES people(id),
    commit_sha TEXT,
    created_at TEXT NOT NULL
  )`,
  'CREATE INDEX formula_revisions_formula ON formula_revisions (formula_id, id)',
  'CREATE INDEX formula_revisions_revision ON formula_revisions (formula_id, revision)',
  `CREATE TABLE batches (
    id INTEGER PRIMARY KEY AUTOINCREMENT,
    lot_code TEXT NOT NULL UNIQUE,
    formula_id TEXT NOT NULL,
    formula_revision TEXT NOT NULL,
    formula_title TEXT NOT NULL,
    kind TEXT NOT NULL,
    status TEXT NOT NULL CHECK (status IN ('planned', 'in-progress', 'curing', 'proofing', 'done', 'discarded')),
    operator_id INTEGER NOT NULL REFERENCES people(id),
    started_on TEXT NOT NULL,
    ready_on TEXT,
    recorded_at TEXT NOT NULL,
    updated_at TEXT NOT NULL,
    units TEXT NOT NULL,
    inputs TEXT NOT NULL,
    result TEXT NOT NULL,
    checks_passed INTEGER NOT NULL,
    nitrite_ppm TEXT,
    signed_off_by INTEGER REFERENCES people(id),
    signed_off_at TEXT,
    discard_reason TEXT,
    notes TEXT
  )`,
  // Every list filter pairs with the default order (recorded_at, id) for keyset pages.
  'CREATE INDEX batches_recorded ON batches (recorded_at, id)',
  'CREATE INDEX batches_formula ON batches (formula_id, recorded_at, id)',
  'CREATE INDEX batches_kind ON batches (kind, recorded_at, id)',
  'CREATE INDEX batches_status ON batches (status, recorded_at, id)',
  'CREATE INDEX batches_operator ON batches (operator_id, recorded_at, id)',
  'CREATE INDEX batches_ready ON batches (status, ready_on)',
  `CREATE TABLE batch_events (
    id INTEGER PRIMARY KEY AUTOINCREMENT,
    batch_id INTEGER NOT NULL REFERENCES batches(id),
    at TEXT NOT NULL,
    actor_id INTEGER REFERENCES people(id),
    type TEXT NOT NULL CHECK (type IN ('recorded', 'status', 'sign-off', 'note')),
    from_status TEXT,
    to_status TEXT,
    reason TEXT
  )`,
  'CREATE INDEX batch_events_batch ON batch_events (batch_id, id)',
];

export async function up(queryInterface: QueryInterface): Promise<void> {
  // PostgreSQL's case-insensitive text (usernames, as SQLite's COLLATE NOCASE), a trusted
  // extension the database's owner may create.
  if (onPostgres(queryInterface))
    await queryInterface.sequelize.query('CREATE EXTENSION IF NOT EXISTS citext');
  await runStatements(queryInterface, STATEMENTS);
}
