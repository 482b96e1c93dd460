import type { QueryInterface } from 'sequelize';
import { onPostgres, runStatements } from './run-statements.ts';

/**
 * Names unique within a site, not across the group: two shops may each have a "Walk-in cooler",
 * and each may plan the same menu item, count and day. A piece of equipment's name stays unique
 * at its own site (case-blind, as before); a plan's menu item, count and day too.
 *
 * SQLite cannot drop a column's UNIQUE in place, so each table is copied out and back, every row
 * and id as they were. Readings, deviations and calibrations refer to equipment: while the table
 * is away their references dangle, so foreign keys are checked at commit (defer_foreign_keys,
 * which a transaction may set and which ends with it), when every id is back. The copy goes
 * through a temporary table rather than a rename, because renaming a table rewrites the
 * references of the tables that point at it.
 */
export const name = '022-site-unique-names';

const EQUIPMENT_COLUMNS = 'id, name, kind, control, active, created_at, site_id';
const PLAN_COLUMNS = `id, assembly_id, assembly_title, count, service_date, made_by, made_at,
  recorded_by, recorded_at, recorded_batches, site_id`;

const SQLITE_STATEMENTS = [
  'PRAGMA defer_foreign_keys = ON',
  `CREATE TEMP TABLE equipment_copy AS SELECT ${EQUIPMENT_COLUMNS} FROM equipment`,
  'DROP TABLE equipment',
  `CREATE TABLE equipment (
    id INTEGER PRIMARY KEY AUTOINCREMENT,
    name TEXT NOT NULL COLLATE NOCASE,
    kind TEXT NOT NULL CHECK (kind IN ('cooler', 'freezer', 'smoker', 'hot-holding', 'thermometer')),
    control TEXT NOT NULL,
    active INTEGER NOT NULL DEFAULT 1,
    created_at TEXT NOT NULL,
    site_id INTEGER NOT NULL DEFAULT 1,
    UNIQUE (site_id, name)
  )`,
  `INSERT INTO equipment (${EQUIPMENT_COLUMNS}) SELECT ${EQUIPMENT_COLUMNS} FROM equipment_copy ORDER BY id`,
  'DROP TABLE equipment_copy',
  'CREATE INDEX equipment_site ON equipment (site_id, id)',
  `CREATE TEMP TABLE plans_copy AS SELECT ${PLAN_COLUMNS} FROM plans`,
  'DROP TABLE plans',
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
    site_id INTEGER NOT NULL DEFAULT 1,
    UNIQUE (site_id, assembly_id, count, service_date)
  )`,
  `INSERT INTO plans (${PLAN_COLUMNS}) SELECT ${PLAN_COLUMNS} FROM plans_copy ORDER BY id`,
  'DROP TABLE plans_copy',
  'CREATE INDEX plans_made ON plans (made_at, id)',
  'CREATE INDEX plans_site ON plans (site_id, made_at, id)',
];

/**
 * PostgreSQL changes the constraints in place (their names are PostgreSQL's own for a UNIQUE
 * column and a UNIQUE list). The equipment name is CITEXT, so the new pair is case-blind too.
 */
const POSTGRES_STATEMENTS = [
  `ALTER TABLE equipment DROP CONSTRAINT equipment_name_key,
    ADD CONSTRAINT equipment_site_name_key UNIQUE (site_id, name)`,
  `ALTER TABLE plans DROP CONSTRAINT plans_assembly_id_count_service_date_key,
    ADD CONSTRAINT plans_site_id_assembly_id_count_service_date_key
      UNIQUE (site_id, assembly_id, count, service_date)`,
];

export async function up(queryInterface: QueryInterface): Promise<void> {
  await runStatements(
    queryInterface,
    onPostgres(queryInterface) ? POSTGRES_STATEMENTS : SQLITE_STATEMENTS,
  );
}
