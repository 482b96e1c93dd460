import type { Sequelize } from 'sequelize';
import { asReal, dialectOf, type Dialect } from '../db/dialect-sql.ts';
import { readRows } from '../db/read-row.ts';
import { andSite } from '../sites/site-scope.ts';
import type { ReportPeriod } from './report-period.ts';
import {
  STAMP_COLUMNS,
  type CalibrationRow,
  type ReportActionRow as ActionRow,
  type ReportDeviationRow as DeviationRow,
  type ReportReadingRow as ReadingRow,
  type ReportVerificationRow as VerificationRow,
  type ReportWeighingRow as WeighingRow,
} from './report-rows.ts';

/** A batch row as the report reads it, with the names of the people it names. */
export interface ReportBatchRow {
  id: number;
  lot_code: string;
  formula_id: string;
  formula_revision: string;
  formula_title: string;
  status: string;
  started_on: string;
  started_at: string | null;
  operator_id: number | null;
  operator_name: string | null;
  planned_by: number | null;
  planner_name: string | null;
  started_by: number | null;
  starter_name: string | null;
}

/** Everything recorded against a few batches, each list in the order the report shows it. */
export interface BatchRecords {
  readonly batches: ReportBatchRow[];
  /** Readings entered by hand, logger readings corrected, and logger readings that missed. */
  readonly readings: ReadingRow[];
  /** Each control's standing logger readings, summed up by SQLite. */
  readonly logged: LoggerRow[];
  readonly weighings: WeighingRow[];
  readonly deviations: DeviationRow[];
  readonly actions: ActionRow[];
  readonly verifications: VerificationRow[];
}

/** `?, ?, ?` for a list of values. */
const marks = (values: readonly unknown[]): string => values.map(() => '?').join(', ');

/**
 * The batches of a period, in the order they started: started in it (a planned batch not yet
 * started is not), or with any process record written in it. Each part walks an index on its
 * time, but readings, which have none on time alone: one pass over them (see bench/README.md).
 */
export const PERIOD_BATCHES_SQL = `SELECT b.id FROM batches b WHERE b.id IN (
    SELECT id FROM batches WHERE started_on >= ? AND started_on <= ? AND status <> 'planned'
    UNION SELECT batch_id FROM readings WHERE taken_at >= ? AND taken_at < ? AND batch_id IS NOT NULL
    UNION SELECT batch_id FROM deviations WHERE opened_at >= ? AND opened_at < ? AND batch_id IS NOT NULL
    UNION SELECT d.batch_id FROM corrective_actions a JOIN deviations d ON d.id = a.deviation_id
      WHERE a.recorded_at >= ? AND a.recorded_at < ? AND d.batch_id IS NOT NULL
    UNION SELECT batch_id FROM verifications WHERE recorded_at >= ? AND recorded_at < ?
    UNION SELECT batch_id FROM weighings WHERE weighed_at >= ? AND weighed_at < ?
  )`;
const PERIOD_BATCHES_ORDER = ' ORDER BY b.started_on, b.id';
/** The period's batches as one site's report reads them (`AND b.site_id = ?`), or every one. */
const periodBatchesSql = (site: string): string =>
  `${PERIOD_BATCHES_SQL.replace(PERIOD_BATCHES_ORDER, '')}${site}${PERIOD_BATCHES_ORDER}`;

/** The ids of the period's batches, in the order they started. */
export async function periodBatchIds(
  sequelize: Sequelize,
  period: ReportPeriod,
): Promise<number[]> {
  const { from, to, start, end } = period;
  const atSite = andSite(period.site, 'b.site_id');
  const rows = await readRows<{ id: number }>(sequelize, periodBatchesSql(atSite.sql), [
    from,
    to,
    ...Array<string[]>(5).fill([start, end]).flat(),
    ...atSite.values,
  ]);
  return rows.map((row) => row.id);
}

/** A control's standing logger readings summed up: how many, first and last, lowest and highest. */
export interface LoggerRow {
  owner: number;
  control: string;
  count: number;
  first: string;
  last: string;
  /** The stored text of the lowest and highest reading. */
  min: string;
  max: string;
}

/** A logger reading that stands: no correction names it. */
const STANDING_LOGGER = `x.source = 'logger'
  AND NOT EXISTS (SELECT 1 FROM readings c WHERE c.corrects_id = x.id)`;

/**
 * The logger readings of some batches (or equipment) summed up per control by SQLite, along the
 * readings_batch index: a month's million readings never become objects. The lowest and highest
 * are found on the value as a number (SQLite keeps the text of the row it picked): a summary to
 * read, not a judgement against a limit — the misses are the deviations the judging opened. Among
 * equal values, the earlier entry's text. A batch's are kept summed up as they are written
 * (LOGGER_SUMMARIES_SQL); this sums up an equipment log's readings of a period.
 */
export const LOGGER_SUMMARY_SQL = (
  dialect: Dialect,
  owner: 'batch_id' | 'equipment_id',
  n: number,
  period = false,
) =>
  `SELECT x.${owner} AS owner, x.control, COUNT(*) AS count, MIN(x.taken_at) AS first,
     MAX(x.taken_at) AS last,
     (SELECT m.value FROM readings m WHERE m.${owner} = x.${owner} AND m.control = x.control
        AND m.source = 'logger' ${period ? 'AND m.taken_at >= ? AND m.taken_at < ?' : ''}
        AND NOT EXISTS (SELECT 1 FROM readings c WHERE c.corrects_id = m.id)
        ORDER BY ${asReal(dialect, 'm.value')}, m.id LIMIT 1) AS min,
     (SELECT m.value FROM readings m WHERE m.${owner} = x.${owner} AND m.control = x.control
        AND m.source = 'logger' ${period ? 'AND m.taken_at >= ? AND m.taken_at < ?' : ''}
        AND NOT EXISTS (SELECT 1 FROM readings c WHERE c.corrects_id = m.id)
        ORDER BY ${asReal(dialect, 'm.value')} DESC, m.id LIMIT 1) AS max
   FROM readings x WHERE x.${owner} IN (${Array.from({ length: n }, () => '?').join(', ')})
     ${period ? 'AND x.taken_at >= ? AND x.taken_at < ?' : ''} AND ${STANDING_LOGGER}
   GROUP BY x.${owner}, x.control ORDER BY x.${owner}, x.control`;

/**
 * The standing logger readings of some batches summed up per control, as the triggers of the
 * logger_summaries table keep them (migration 013): the same figures as LOGGER_SUMMARY_SQL,
 * without reading the batches' thousands of readings.
 */
export const LOGGER_SUMMARIES_SQL = (n: number): string =>
  `SELECT batch_id AS owner, control, readings AS count, first_at AS first, last_at AS last,
     lowest AS min, highest AS max
   FROM logger_summaries WHERE batch_id IN (${Array.from({ length: n }, () => '?').join(', ')})
   ORDER BY batch_id, control`;

/**
 * The readings of some batches the report lists one by one: every reading entered by hand (the
 * readings_by_hand index), every logger reading corrected (the readings_corrects index; the
 * corrections of all time are few), and every logger reading a deviation names (the judging's
 * misses); by batch, control and time. None of a logger's thousands is read to find them.
 */
export const BATCH_READINGS_SQL = (ids: readonly number[]): string =>
  `SELECT ${STAMP_COLUMNS}, x.batch_id, x.equipment_id, x.control, x.taken_at, x.value,
     x.entered_as, x.source
   FROM readings x LEFT JOIN people rp ON rp.id = x.recorded_by
   WHERE x.id IN (
       SELECT id FROM readings WHERE batch_id IN (${marks(ids)}) AND source <> 'logger'
       UNION SELECT corrects_id FROM readings WHERE corrects_id IS NOT NULL
       UNION SELECT reading_id FROM deviations WHERE batch_id IN (${marks(ids)}))
     AND x.batch_id IN (${marks(ids)})
   ORDER BY x.batch_id, x.control, x.taken_at, x.id`;

/** Reads the whole record of a few batches (a page of the report), a query per kind of entry. */
export async function batchRecords(
  sequelize: Sequelize,
  ids: readonly number[],
): Promise<BatchRecords> {
  const read = <T>(sql: string, values: readonly number[] = ids): Promise<T[]> =>
    readRows<T>(sequelize, sql, values);
  const batches = await read<ReportBatchRow>(
    `SELECT b.id, b.lot_code, b.formula_id, b.formula_revision, b.formula_title, b.status,
       b.started_on, b.started_at, b.operator_id, op.display_name AS operator_name,
       b.planned_by, pl.display_name AS planner_name, b.started_by, st.display_name AS starter_name
     FROM batches b LEFT JOIN people op ON op.id = b.operator_id
       LEFT JOIN people pl ON pl.id = b.planned_by LEFT JOIN people st ON st.id = b.started_by
     WHERE b.id IN (${marks(ids)}) ORDER BY b.started_on, b.id`,
  );
  const readings = await read<ReadingRow>(BATCH_READINGS_SQL(ids), [...ids, ...ids, ...ids]);
  const logged = await read<LoggerRow>(LOGGER_SUMMARIES_SQL(ids.length), ids);
  const weighings = await read<WeighingRow>(
    `SELECT ${STAMP_COLUMNS}, x.batch_id, x.kind, x.name, x.planned_grams, x.grams, x.weighed_at
     FROM weighings x LEFT JOIN people rp ON rp.id = x.recorded_by
     WHERE x.batch_id IN (${marks(ids)}) ORDER BY x.batch_id, x.id`,
  );
  const deviations = await read<DeviationRow>(
    `${DEVIATION_SELECT} WHERE d.batch_id IN (${marks(ids)}) ORDER BY d.batch_id, d.id`,
  );
  const actions = await read<ActionRow>(
    `${ACTION_SELECT} WHERE x.deviation_id IN (SELECT id FROM deviations WHERE batch_id IN (${marks(ids)}))
     ORDER BY x.deviation_id, x.id`,
  );
  const verifications = await read<VerificationRow>(
    `SELECT ${STAMP_COLUMNS}, x.batch_id, x.note
     FROM verifications x LEFT JOIN people rp ON rp.id = x.recorded_by
     WHERE x.batch_id IN (${marks(ids)}) ORDER BY x.batch_id, x.id`,
  );
  return { batches, readings, logged, weighings, deviations, actions, verifications };
}

export const DEVIATION_SELECT = `SELECT d.id, d.batch_id, d.equipment_id, d.control, d.kind, d.what,
    d.opened_at, d.opened_by, p.display_name AS opener_name, d.dedupe_key, d.reading_id
  FROM deviations d LEFT JOIN people p ON p.id = d.opened_by`;

export const ACTION_SELECT = `SELECT ${STAMP_COLUMNS}, x.deviation_id, x.cause, x.restored, x.prevention,
    x.disposition, x.disposition_grams
  FROM corrective_actions x LEFT JOIN people rp ON rp.id = x.recorded_by`;

/** A refusals row with the name of who was refused. */
export interface RefusalRow {
  at: string;
  person_id: number | null;
  person_name: string | null;
  formula_id: string;
  formula_revision: string | null;
  inputs: string;
  failed: string;
  lot_code: string | null;
}

/** The calculations refused in the period, oldest first (the refusals_at index). */
export function periodRefusals(sequelize: Sequelize, period: ReportPeriod): Promise<RefusalRow[]> {
  return readRows<RefusalRow>(
    sequelize,
    `SELECT r.at, r.person_id, p.display_name AS person_name, r.formula_id, r.formula_revision,
       r.inputs, r.failed, r.lot_code
     FROM refusals r LEFT JOIN people p ON p.id = r.person_id
     WHERE r.at >= ? AND r.at < ?${andSite(period.site, 'r.site_id').sql} ORDER BY r.at, r.id`,
    [period.start, period.end, ...andSite(period.site, 'r.site_id').values],
  );
}

/** An equipment row. */
export interface EquipmentRow {
  id: number;
  name: string;
  kind: string;
}

/** The equipment's records of the period: its readings, checks and deviations. */
export interface EquipmentRecords {
  readonly equipment: EquipmentRow[];
  /** Readings entered by hand, logger readings corrected or named by a deviation. */
  readonly readings: ReadingRow[];
  /** Each piece's standing logger readings of the period, summed up. */
  readonly logged: LoggerRow[];
  readonly calibrations: CalibrationRow[];
  readonly deviations: DeviationRow[];
  readonly actions: ActionRow[];
}

/** Every piece of equipment with a reading, a check or a deviation in the period, and those. */
export async function periodEquipment(
  sequelize: Sequelize,
  period: ReportPeriod,
): Promise<EquipmentRecords> {
  const span = [period.start, period.end];
  const read = <T>(sql: string, values: readonly (string | number)[] = span): Promise<T[]> =>
    readRows<T>(sequelize, sql, values);
  const atSite = andSite(period.site, 'e.site_id');
  const equipment = await read<EquipmentRow>(
    `SELECT e.id, e.name, e.kind FROM equipment e WHERE (
       EXISTS (SELECT 1 FROM readings r WHERE r.equipment_id = e.id AND r.taken_at >= ? AND r.taken_at < ?)
       OR EXISTS (SELECT 1 FROM calibrations c WHERE c.equipment_id = e.id AND c.checked_at >= ? AND c.checked_at < ?)
       OR EXISTS (SELECT 1 FROM deviations d WHERE d.equipment_id = e.id AND d.opened_at >= ? AND d.opened_at < ?)
     )${atSite.sql} ORDER BY e.name`,
    [...span, ...span, ...span, ...atSite.values],
  );
  const ids = equipment.map((e) => e.id);
  if (!ids.length)
    return { equipment, readings: [], logged: [], calibrations: [], deviations: [], actions: [] };
  const deviations = await read<DeviationRow>(
    `${DEVIATION_SELECT} WHERE d.equipment_id IN (${marks(ids)}) AND d.opened_at >= ? AND d.opened_at < ?
     ORDER BY d.equipment_id, d.id`,
    [...ids, ...span],
  );
  const readings = await read<ReadingRow>(
    `SELECT ${STAMP_COLUMNS}, x.batch_id, x.equipment_id, x.control, x.taken_at, x.value,
       x.entered_as, x.source
     FROM readings x LEFT JOIN people rp ON rp.id = x.recorded_by
     WHERE x.equipment_id IN (${marks(ids)}) AND x.taken_at >= ? AND x.taken_at < ?
       AND (x.source <> 'logger' OR EXISTS (SELECT 1 FROM readings c WHERE c.corrects_id = x.id)
         OR x.id IN (SELECT reading_id FROM deviations WHERE equipment_id IN (${marks(ids)})))
     ORDER BY x.equipment_id, x.taken_at, x.id`,
    [...ids, ...span, ...ids],
  );
  const logged = await read<LoggerRow>(
    LOGGER_SUMMARY_SQL(dialectOf(sequelize), 'equipment_id', ids.length, true),
    [...span, ...span, ...ids, ...span],
  );
  const calibrations = await read<CalibrationRow>(
    `SELECT ${STAMP_COLUMNS}, x.equipment_id, x.checked_at, x.reading, x.outcome, x.note
     FROM calibrations x LEFT JOIN people rp ON rp.id = x.recorded_by
     WHERE x.equipment_id IN (${marks(ids)}) AND x.checked_at >= ? AND x.checked_at < ?
     ORDER BY x.equipment_id, x.checked_at, x.id`,
    [...ids, ...span],
  );
  const deviationIds = deviations.map((d) => d.id);
  const actions = deviationIds.length
    ? await read<ActionRow>(
        `${ACTION_SELECT} WHERE x.deviation_id IN (${marks(deviationIds)}) ORDER BY x.deviation_id, x.id`,
        deviationIds,
      )
    : [];
  return { equipment, readings, logged, calibrations, deviations, actions };
}
