import { jsonArrayText, jsonObject, type Dialect } from '../db/dialect-sql.ts';
import { QueryTypes, type Transaction } from 'sequelize';
import type { BatchStatus } from '../../shared/api/batch-record.ts';
import type {
  BatchControl,
  Deviation,
  ProcessRecord,
  Reading,
  Verification,
} from '../../shared/api/process-record.ts';
import type { ResolvedControl } from '../../shared/process/control-types.ts';
import { andSite, type SiteScope } from '../sites/site-scope.ts';
import type { Database } from '../db/database.ts';
import { readRows } from '../db/read-row.ts';
import { notFound } from '../http/app-error.ts';
import type { FormulaControls } from './formula-controls.ts';
import { judgeBatch, judgeStanding } from './judge-batch.ts';
import { kitchenClock } from './kitchen-clock.ts';
import { recordJson, type RecordRest } from './record-json.ts';
import { recordReadings } from './record-readings.ts';
import { weighedPart } from './weighed-record.ts';
import { WEIGHINGS_SQL } from './weighing-rows.ts';
import {
  STAMP_COLUMNS,
  correctedByOf,
  personRef,
  toAction,
  toDeviation,
  toReading,
  toVerification,
  toWeighing,
  type ActionRow,
  type DeviationRow,
  type ReadingRow,
  type VerificationRow,
  type WeighingRow,
} from './process-rows.ts';

/** What the process record needs of a batch row. */
export interface ProcessBatch {
  readonly id: number;
  readonly lotCode: string;
  readonly status: BatchStatus;
  readonly formulaId: string;
  readonly formulaRevision: string;
  readonly formulaTitle: string;
  readonly operatorId: number;
}

interface BatchRow {
  id: number;
  lot_code: string;
  status: BatchStatus;
  formula_id: string;
  formula_revision: string;
  formula_title: string;
  operator_id: number;
  planned_by: number | null;
  planner_name: string | null;
  started_by: number | null;
  starter_name: string | null;
  started_at: string | null;
}

const BATCH_SQL = `SELECT b.id, b.lot_code, b.status, b.formula_id, b.formula_revision, b.formula_title,
  b.operator_id, b.planned_by, pp.display_name AS planner_name, b.started_by,
  sp.display_name AS starter_name, b.started_at
  FROM batches b LEFT JOIN people pp ON pp.id = b.planned_by LEFT JOIN people sp ON sp.id = b.started_by
  WHERE b.lot_code = ?`;

// One query for every reading of a batch, walked along readings_batch (batch_id, control,
// taken_at, id): oldest first within each control, corrected readings included. The recorders'
// names come after, once per person: joining people on each of a day's logger points doubled
// the time of the read. SQLite hands the rows over as one JSON array, parsed in one go: the
// driver building each of a day's thousands of rows as an object, column by column, took about
// a third longer. The keys are the columns' names and SQLite's types are kept (integers as
// numbers, text as strings, NULL as null), so each element is the row the driver would give.
const readingsSql = (dialect: Dialect) => `SELECT ${jsonArrayText(
  dialect,
  jsonObject(
    dialect,
    `'id', x.id,
  'recorded_by', x.recorded_by, 'recorded_at', x.recorded_at, 'corrects_id', x.corrects_id,
  'reason', x.reason, 'control', x.control, 'taken_at', x.taken_at, 'value', x.value,
  'entered_as', x.entered_as, 'source', x.source`,
  ),
  ' ORDER BY x.control, x.taken_at, x.id',
)} AS rows
  FROM readings x WHERE x.batch_id = ?`;
const READINGS_SQL = { sqlite: readingsSql('sqlite'), postgres: readingsSql('postgres') };

const DEVIATIONS_SQL = `SELECT d.id, d.control, d.kind, d.what, d.opened_at, d.opened_by,
  op.display_name AS opener_name, d.dedupe_key
  FROM deviations d LEFT JOIN people op ON op.id = d.opened_by WHERE d.batch_id = ? ORDER BY d.id`;

const ACTIONS_SQL = `SELECT ${STAMP_COLUMNS}, x.deviation_id, x.cause, x.restored, x.prevention,
  x.disposition, x.disposition_grams
  FROM deviations d JOIN corrective_actions x ON x.deviation_id = d.id
  LEFT JOIN people rp ON rp.id = x.recorded_by WHERE d.batch_id = ? ORDER BY x.id`;

/** One deviation (of a batch or a piece of equipment) by id, and its actions. */
const DEVIATION_SQL = DEVIATIONS_SQL.replace('WHERE d.batch_id = ?', 'WHERE d.id = ?');
const DEVIATION_ACTIONS_SQL = ACTIONS_SQL.replace('WHERE d.batch_id = ?', 'WHERE d.id = ?');

const VERIFICATION_SQL = `SELECT ${STAMP_COLUMNS}, x.note
  FROM verifications x LEFT JOIN people rp ON rp.id = x.recorded_by
  WHERE x.batch_id = ? ORDER BY x.id DESC LIMIT 1`;

/** The statuses of a batch being made: its controls are watched. */
export const BEING_MADE: readonly BatchStatus[] = ['in-progress', 'curing', 'proofing'];

// `site` is a site condition on b (` AND b.site_id = ?`) or nothing.
const BEING_MADE_SQL = (site = '') => `SELECT b.id, b.lot_code, b.status, b.formula_id,
  b.formula_revision, b.formula_title, b.operator_id FROM batches b
  WHERE b.status IN (${BEING_MADE.map((s) => `'${s}'`).join(', ')})${site} ORDER BY b.id`;

// Open: no corrective action. Discarded product needs none; it is gone.
const OPEN_DEVIATIONS_SQL = (
  site = '',
) => `SELECT d.id, d.control, d.kind, d.what, d.opened_at, d.opened_by,
  op.display_name AS opener_name, d.dedupe_key, b.lot_code, b.formula_title,
  b.formula_id, b.formula_revision
  FROM deviations d JOIN batches b ON b.id = d.batch_id LEFT JOIN people op ON op.id = d.opened_by
  WHERE b.status <> 'discarded'${site}
    AND NOT EXISTS (SELECT 1 FROM corrective_actions a WHERE a.deviation_id = d.id)
  ORDER BY d.opened_at, d.id`;

/** An open deviation with the batch it holds. */
export type OpenDeviationRow = DeviationRow & {
  lot_code: string;
  formula_title: string;
  formula_id: string;
  formula_revision: string;
};

/** A deviation with the dedupe key that names its miss, for the release check. */
export type KeyedDeviation = Deviation & { readonly key: string };

/**
 * The process records of batches, read: controls from the formula revision each batch was
 * recorded with, readings, deviations with their corrective actions, weighings, verification.
 * Reads inside a write transaction when given one (to judge what is about to be committed),
 * otherwise straight from SQLite.
 */
export class ProcessRepository {
  constructor(
    private readonly db: Database,
    readonly controls: FormulaControls,
  ) {}

  private select<T extends object>(
    sql: string,
    values: readonly (string | number)[],
    t?: Transaction,
  ): Promise<T[]> {
    if (!t) return readRows<T>(this.db.sequelize, sql, values);
    return this.db.sequelize.query<T>(sql, {
      replacements: [...values],
      type: QueryTypes.SELECT,
      transaction: t,
    });
  }

  private async batchRow(lot: string, t?: Transaction): Promise<BatchRow> {
    const [row] = await this.select<BatchRow>(BATCH_SQL, [lot], t);
    if (!row) throw notFound(`no batch with lot code ${lot}`);
    return row;
  }

  /** The batch a lot code names. @throws AppError 404 */
  async batch(lot: string, t?: Transaction): Promise<ProcessBatch> {
    return toBatch(await this.batchRow(lot, t));
  }

  /** The resolved controls of the formula revision the batch was recorded with. */
  controlsOf(batch: ProcessBatch): Promise<readonly ResolvedControl[]> {
    return this.controls.of(batch.formulaId, batch.formulaRevision);
  }

  /** Every reading of a batch, corrected ones included (marked correctedBy). */
  async readings(batchId: number, t?: Transaction): Promise<Reading[]> {
    const [array] = await this.select<{ rows: string }>(
      READINGS_SQL[this.db.dialect],
      [batchId],
      t,
    );
    const rows = JSON.parse(array.rows) as Omit<ReadingRow, 'recorder_name'>[];
    const ids = [
      ...new Set(rows.flatMap((row) => (row.recorded_by === null ? [] : [row.recorded_by]))),
    ];
    const names = new Map(
      ids.length === 0
        ? []
        : (
            await this.select<{ id: number; display_name: string }>(
              `SELECT id, display_name FROM people WHERE id IN (${ids.map(() => '?').join(', ')})`,
              ids,
              t,
            )
          ).map((person) => [person.id, person.display_name]),
    );
    const correctedBy = correctedByOf(rows);
    return rows.map((row) =>
      toReading(
        row,
        row.recorded_by === null ? null : (names.get(row.recorded_by) ?? null),
        correctedBy,
      ),
    );
  }

  /** Every deviation of a batch, oldest first, with its actions and dedupe key. */
  async deviations(batchId: number, t?: Transaction): Promise<KeyedDeviation[]> {
    const rows = await this.select<DeviationRow>(DEVIATIONS_SQL, [batchId], t);
    if (rows.length === 0) return [];
    const actionRows = await this.select<ActionRow>(ACTIONS_SQL, [batchId], t);
    const correctedBy = correctedByOf(actionRows);
    return rows.map((row) => ({
      ...toDeviation(
        row,
        actionRows.filter((a) => a.deviation_id === row.id).map((a) => toAction(a, correctedBy)),
      ),
      key: row.dedupe_key,
    }));
  }

  /** One deviation by id, of a batch or of a piece of equipment, with its actions. */
  async deviation(id: number, t?: Transaction): Promise<KeyedDeviation | null> {
    const [row] = await this.select<DeviationRow>(DEVIATION_SQL, [id], t);
    if (!row) return null;
    const actionRows = await this.select<ActionRow>(DEVIATION_ACTIONS_SQL, [id], t);
    const correctedBy = correctedByOf(actionRows);
    return {
      ...toDeviation(
        row,
        actionRows.map((a) => toAction(a, correctedBy)),
      ),
      key: row.dedupe_key,
    };
  }

  /** The verification that released a batch, if any. */
  async verification(batchId: number, t?: Transaction): Promise<Verification | null> {
    const [row] = await this.select<VerificationRow>(VERIFICATION_SQL, [batchId], t);
    return row ? toVerification(row) : null;
  }

  /**
   * The batches being made (in progress, curing, proofing), oldest first; with a site, that
   * site's only (the jobs that chase them work for the whole group and give none).
   */
  async beingMade(site?: SiteScope): Promise<ProcessBatch[]> {
    const atSite = andSite(site, 'b.site_id');
    return (await this.select<BatchRow>(BEING_MADE_SQL(atSite.sql), atSite.values)).map(toBatch);
  }

  /**
   * Every deviation without a corrective action, of batches not discarded, oldest first; with a
   * site, of that site's batches only.
   */
  openDeviations(site?: SiteScope): Promise<OpenDeviationRow[]> {
    const atSite = andSite(site, 'b.site_id');
    return this.select<OpenDeviationRow>(OPEN_DEVIATIONS_SQL(atSite.sql), atSite.values);
  }

  /** Every control of a batch judged at `now`, with its readings. */
  async judged(
    batch: ProcessBatch,
    now: string,
    t?: Transaction,
  ): Promise<{ controls: BatchControl[]; readings: Reading[] }> {
    const [controls, readings] = await Promise.all([
      this.controlsOf(batch),
      this.readings(batch.id, t),
    ]);
    return {
      controls: judgeBatch(controls, readings, batch.status, kitchenClock(now)),
      readings,
    };
  }

  /** The whole process record at `now`, as the API sends it. */
  async record(lot: string, now: string, t?: Transaction): Promise<ProcessRecord> {
    const row = await this.batchRow(lot, t);
    const batch = toBatch(row);
    const [{ controls }, rest] = await Promise.all([
      this.judged(batch, now, t),
      this.recordRest(row, t),
    ]);
    return { lotCode: batch.lotCode, controls, ...rest };
  }

  /**
   * GET /api/batches/:lot/process: the process record at `now` as UTF-8 JSON in pieces, the same
   * text as `JSON.stringify(record(…))`; the readings are written by SQLite, never objects.
   */
  async recordJson(lot: string, now: string): Promise<Buffer[]> {
    const row = await this.batchRow(lot);
    const batch = toBatch(row);
    const [controls, readings, rest] = await Promise.all([
      this.controlsOf(batch),
      recordReadings((sql, values) => this.select(sql, values), batch.id, this.db.dialect),
      this.recordRest(row),
    ]);
    const standing = new Map([...readings].map(([id, r]) => [id, r.standing]));
    const judged = judgeStanding(controls, standing, batch.status, kitchenClock(now));
    return recordJson(batch.lotCode, judged, readings, rest);
  }

  /** All of a process record but its controls. */
  private async recordRest(row: BatchRow, t?: Transaction): Promise<RecordRest> {
    const [deviations, weighingRows, verification] = await Promise.all([
      this.deviations(row.id, t),
      this.select<WeighingRow>(WEIGHINGS_SQL, [row.id], t),
      this.verification(row.id, t),
    ]);
    const weighingCorrections = correctedByOf(weighingRows);
    const weighings = weighingRows.map((w) => toWeighing(w, weighingCorrections));
    return {
      weighings,
      // The ingoing nitrite and yields on the weights as weighed, the plan a start replaced.
      ...(await weighedPart(this.db, this.controls.history, row.id, weighings, t)),
      deviations: deviations.map(({ key: _key, ...deviation }) => deviation),
      onHold: deviations.some((d) => d.action === null),
      // A deadline the readings later showed was met is no miss: its deviation stays, closed.
      nonconforming: deviations.some((d) => d.action?.disposition !== 'unaffected'),
      verification,
      plannedBy: personRef(row.planned_by, row.planner_name),
      startedBy: personRef(row.started_by, row.starter_name),
      startedAt: row.started_at,
    };
  }
}

function toBatch(row: BatchRow): ProcessBatch {
  return {
    id: row.id,
    lotCode: row.lot_code,
    status: row.status,
    formulaId: row.formula_id,
    formulaRevision: row.formula_revision,
    formulaTitle: row.formula_title,
    operatorId: row.operator_id,
  };
}
