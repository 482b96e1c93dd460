import type { QueryInterface } from 'sequelize';
import { runStatements } from './run-statements.ts';

/**
 * Process records (the HACCP side of a batch): readings at each control, weights as weighed,
 * deviations and the corrective actions that close them, verifications that release a batch,
 * refused calculations, equipment with its readings and thermometer calibrations, and the alerts
 * sent. Nothing here is updated in place: a correction is a new row whose corrects_id names the
 * row it replaces. One table per record kind, each with an index for how it is read.
 */
export const name = '007-process-records';

/** The columns every correctable entry has: who, when, and what it replaces and why. */
const STAMP = `recorded_by INTEGER REFERENCES people(id),
    recorded_at TEXT NOT NULL,
    corrects_id INTEGER,
    reason TEXT`;

const STATEMENTS = [
  `CREATE TABLE equipment (
    id INTEGER PRIMARY KEY AUTOINCREMENT,
    name TEXT NOT NULL UNIQUE COLLATE NOCASE,
    kind TEXT NOT NULL CHECK (kind IN ('cooler', 'freezer', 'smoker', 'hot-holding', 'thermometer')),
    control TEXT NOT NULL,
    active INTEGER NOT NULL DEFAULT 1,
    created_at TEXT NOT NULL
  )`,
  // control is the formula control's id for a batch, or 'log' for a piece of equipment.
  `CREATE TABLE readings (
    id INTEGER PRIMARY KEY AUTOINCREMENT,
    batch_id INTEGER REFERENCES batches(id),
    equipment_id INTEGER REFERENCES equipment(id),
    control TEXT NOT NULL,
    taken_at TEXT NOT NULL,
    value TEXT NOT NULL,
    entered_as TEXT,
    source TEXT NOT NULL CHECK (source IN ('console', 'command', 'api', 'logger')),
    ${STAMP},
    CHECK ((batch_id IS NULL) <> (equipment_id IS NULL))
  )`,
  'CREATE INDEX readings_batch ON readings (batch_id, control, taken_at, id)',
  'CREATE INDEX readings_equipment ON readings (equipment_id, taken_at, id)',
  'CREATE INDEX readings_corrects ON readings (corrects_id)',
  `CREATE TABLE weighings (
    id INTEGER PRIMARY KEY AUTOINCREMENT,
    batch_id INTEGER NOT NULL REFERENCES batches(id),
    kind TEXT NOT NULL CHECK (kind IN ('line', 'stage')),
    name TEXT NOT NULL,
    planned_grams TEXT,
    grams TEXT NOT NULL,
    weighed_at TEXT NOT NULL,
    ${STAMP}
  )`,
  'CREATE INDEX weighings_batch ON weighings (batch_id, id)',
  // dedupe_key names the miss exactly ("12/chill/stage-1"), so it is opened once, by one process.
  `CREATE TABLE deviations (
    id INTEGER PRIMARY KEY AUTOINCREMENT,
    batch_id INTEGER REFERENCES batches(id),
    equipment_id INTEGER REFERENCES equipment(id),
    control TEXT,
    kind TEXT NOT NULL CHECK (kind IN ('reading', 'deadline', 'nitrite', 'pump', 'check')),
    what TEXT NOT NULL,
    opened_at TEXT NOT NULL,
    opened_by INTEGER REFERENCES people(id),
    reading_id INTEGER REFERENCES readings(id),
    dedupe_key TEXT NOT NULL UNIQUE
  )`,
  'CREATE INDEX deviations_batch ON deviations (batch_id, id)',
  'CREATE INDEX deviations_opened ON deviations (opened_at, id)',
  `CREATE TABLE corrective_actions (
    id INTEGER PRIMARY KEY AUTOINCREMENT,
    deviation_id INTEGER NOT NULL REFERENCES deviations(id),
    cause TEXT NOT NULL,
    restored TEXT NOT NULL,
    prevention TEXT NOT NULL,
    disposition TEXT NOT NULL CHECK (disposition IN ('recooked', 'rechilled', 'reworked', 'diverted', 'discarded')),
    disposition_grams TEXT,
    ${STAMP}
  )`,
  'CREATE INDEX corrective_actions_deviation ON corrective_actions (deviation_id, id)',
  `CREATE TABLE verifications (
    id INTEGER PRIMARY KEY AUTOINCREMENT,
    batch_id INTEGER NOT NULL REFERENCES batches(id),
    note TEXT,
    ${STAMP}
  )`,
  'CREATE INDEX verifications_batch ON verifications (batch_id, id)',
  // A calculation refused at the bench: who tried what, and which limit refused it.
  `CREATE TABLE refusals (
    id INTEGER PRIMARY KEY AUTOINCREMENT,
    at TEXT NOT NULL,
    person_id INTEGER REFERENCES people(id),
    formula_id TEXT NOT NULL,
    formula_revision TEXT,
    inputs TEXT NOT NULL,
    failed TEXT NOT NULL,
    lot_code TEXT
  )`,
  'CREATE INDEX refusals_at ON refusals (at, id)',
  `CREATE TABLE calibrations (
    id INTEGER PRIMARY KEY AUTOINCREMENT,
    equipment_id INTEGER NOT NULL REFERENCES equipment(id),
    checked_at TEXT NOT NULL,
    reading TEXT NOT NULL,
    outcome TEXT NOT NULL CHECK (outcome IN ('ok', 'adjusted', 'retired')),
    note TEXT,
    ${STAMP}
  )`,
  'CREATE INDEX calibrations_equipment ON calibrations (equipment_id, checked_at, id)',
  // One row per alert decided, written with its outbox messages: never sent twice, never lost.
  `CREATE TABLE process_alerts_sent (
    id INTEGER PRIMARY KEY AUTOINCREMENT,
    dedupe_key TEXT NOT NULL UNIQUE,
    kind TEXT NOT NULL CHECK (kind IN ('reading-due', 'stage-deadline', 'deviation', 'equipment-due')),
    batch_id INTEGER REFERENCES batches(id),
    equipment_id INTEGER REFERENCES equipment(id),
    sent_at TEXT NOT NULL,
    recipients INTEGER NOT NULL
  )`,
  // Who planned a batch (recorded it as planned) and who started it with what was really there.
  'ALTER TABLE batches ADD COLUMN planned_by INTEGER REFERENCES people(id)',
  'ALTER TABLE batches ADD COLUMN started_by INTEGER REFERENCES people(id)',
  'ALTER TABLE batches ADD COLUMN started_at TEXT',
];

export async function up(queryInterface: QueryInterface): Promise<void> {
  await runStatements(queryInterface, STATEMENTS);
}
