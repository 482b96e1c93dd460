import type { Sequelize } from 'sequelize';
import type {
  HaccpReport,
  ReportBatch,
  ReportControl,
  ReportEquipment,
  ReportHead,
  ReportRefusal,
} from '../../shared/api/haccp-report.ts';
import type { ResolvedControl } from '../../shared/process/control-types.ts';
import type { Clock } from '../../shared/process/evaluate-control.ts';
import { limitWords } from '../../shared/process/limit-words.ts';
import {
  correctedByOf,
  personRef,
  toAction,
  toDeviation,
  toReading,
  toVerification,
  toWeighing,
} from '../process/process-rows.ts';
import { readingsShown } from './control-summary.ts';
import {
  batchRecords,
  periodBatchIds,
  periodEquipment,
  periodRefusals,
  type LoggerRow,
  type RefusalRow,
} from './haccp-queries.ts';
import type { ReportPeriod } from './report-period.ts';
import { reportReceiving } from './report-receiving.ts';
import {
  calibrationOf,
  groupBy,
  type ReportActionRow,
  type ReportDeviationRow,
  type ReportReadingRow,
} from './report-rows.ts';

/** Batches read at a time: their readings (up to 1,440 a control from a logger) stay in memory. */
export const BATCHES_A_PAGE = 50;

/** What producing a report reads from. */
export interface ReportSource {
  readonly sequelize: Sequelize;
  /** The controls of a batch's formula revision (server/process/formula-controls.ts). */
  readonly controls: (formulaId: string, revision: string) => Promise<readonly ResolvedControl[]>;
  /** Whose report, in which time zone, and the moment controls are judged at. */
  readonly clock: Clock;
}

/** What the deviations of a control say of it: "no deviation", "2 deviations, 1 OPEN". */
function deviationWords(deviations: readonly ReportDeviationRow[], closed: ReadonlySet<number>) {
  if (!deviations.length) return 'no deviation';
  const open = deviations.filter((d) => !closed.has(d.id)).length;
  const count = `${deviations.length} deviation${deviations.length === 1 ? '' : 's'}`;
  return open ? `${count}, ${open} OPEN` : `${count}, closed`;
}

/**
 * The controls of one batch from its records, in the formula's order, then any control read
 * against that the formula revision does not have. A control's misses are the deviations the
 * judging opened as readings came in (and the deadline scan as deadlines passed): the report
 * lists what was recorded, and does not judge a month of readings again.
 */
function reportControls(
  controls: readonly ResolvedControl[],
  readingRows: readonly ReportReadingRow[],
  logged: readonly LoggerRow[],
  deviations: readonly ReportDeviationRow[],
  closed: ReadonlySet<number>,
): ReportControl[] {
  const corrected = correctedByOf(readingRows);
  const listed = groupBy(
    readingRows.map((r) => toReading(r, r.recorder_name, corrected)),
    (r) => r.control,
  );
  const figures = new Map(logged.map((row) => [row.control, row]));
  const missed = new Set(deviations.map((d) => d.reading_id).filter((id) => id !== null));
  const byControl = groupBy(deviations, (d) => d.control);
  const ids = [...new Set([...controls.map((c) => c.id), ...listed.keys(), ...figures.keys()])];
  return ids.map((id) => {
    const control = controls.find((c) => c.id === id);
    return {
      id,
      title: control?.title ?? id,
      limit: control ? limitWords(control.limit, control.unit) : 'not in the formula',
      source: control?.source ?? '',
      unit: control?.unit ?? '',
      state: deviationWords(byControl.get(id) ?? [], closed),
      ...readingsShown(listed.get(id) ?? [], figures.get(id), missed),
    };
  });
}

/** A deviation with its corrective actions, earlier ones first. */
function deviationOf(row: ReportDeviationRow, actions: readonly ReportActionRow[]) {
  const corrected = correctedByOf(actions);
  return toDeviation(
    row,
    actions.map((a) => toAction(a, corrected)),
  );
}

/**
 * The period's batches (by id, from periodBatchIds), whole, a page at a time: a month of a busy
 * kitchen is a thousand batches with their loggers' readings, more than is kept in memory at once.
 */
export async function* reportBatches(
  source: ReportSource,
  ids: readonly number[],
): AsyncGenerator<ReportBatch> {
  for (let at = 0; at < ids.length; at += BATCHES_A_PAGE) {
    const page = await batchRecords(source.sequelize, ids.slice(at, at + BATCHES_A_PAGE));
    const readings = groupBy(page.readings, (r) => r.batch_id);
    const logged = groupBy(page.logged, (r) => r.owner);
    const closed = new Set(page.actions.map((a) => a.deviation_id));
    const weighings = groupBy(page.weighings, (r) => r.batch_id);
    const deviations = groupBy(page.deviations, (r) => r.batch_id);
    const actions = groupBy(page.actions, (r) => r.deviation_id);
    const verifications = groupBy(page.verifications, (r) => r.batch_id);
    for (const row of page.batches) {
      const weighed = weighings.get(row.id) ?? [];
      const verified = verifications.get(row.id) ?? [];
      const weighingCorrections = correctedByOf(weighed);
      yield {
        lotCode: row.lot_code,
        formula: { id: row.formula_id, revision: row.formula_revision, title: row.formula_title },
        status: row.status,
        startedOn: row.started_on,
        startedAt: row.started_at,
        operator: personRef(row.operator_id, row.operator_name),
        plannedBy: personRef(row.planned_by, row.planner_name),
        startedBy: personRef(row.started_by, row.starter_name),
        controls: reportControls(
          await source.controls(row.formula_id, row.formula_revision),
          readings.get(row.id) ?? [],
          logged.get(row.id) ?? [],
          deviations.get(row.id) ?? [],
          closed,
        ),
        weighings: weighed.map((w) => toWeighing(w, weighingCorrections)),
        deviations: (deviations.get(row.id) ?? []).map((d) =>
          deviationOf(d, actions.get(d.id) ?? []),
        ),
        verifications: verified.map(toVerification),
      };
    }
  }
}

/** The inputs of a refused calculation as "key=value; …", whatever JSON they were kept as. */
function inputsText(json: string): string {
  try {
    const inputs = JSON.parse(json) as unknown;
    if (inputs && typeof inputs === 'object' && !Array.isArray(inputs))
      return Object.entries(inputs)
        .map(
          ([key, value]) => `${key}=${typeof value === 'string' ? value : JSON.stringify(value)}`,
        )
        .join('; ');
  } catch {
    // Not JSON: shown as kept.
  }
  return json;
}

/** The failed checks of a refusal in words: their sentences, or as kept. */
function failedText(json: string): string {
  try {
    const failed = JSON.parse(json) as unknown;
    if (Array.isArray(failed))
      return failed
        .map((f) =>
          f && typeof f === 'object' && 'sentence' in f ? String(f.sentence) : JSON.stringify(f),
        )
        .join(' ');
    if (typeof failed === 'string') return failed;
  } catch {
    // Not JSON: shown as kept.
  }
  return json;
}

function refusalOf(row: RefusalRow): ReportRefusal {
  return {
    at: row.at,
    by: personRef(row.person_id, row.person_name),
    formula: row.formula_id,
    revision: row.formula_revision,
    inputs: inputsText(row.inputs),
    failed: failedText(row.failed),
    lotCode: row.lot_code,
  };
}

/** The calculations refused in the period. */
export async function reportRefusals(
  source: ReportSource,
  period: ReportPeriod,
): Promise<ReportRefusal[]> {
  return (await periodRefusals(source.sequelize, period)).map(refusalOf);
}

/** The equipment logs of the period: readings (a logger's summed up), checks, deviations. */
export async function reportEquipment(
  source: ReportSource,
  period: ReportPeriod,
): Promise<ReportEquipment[]> {
  const records = await periodEquipment(source.sequelize, period);
  const logged = new Map(records.logged.map((row) => [row.owner, row]));
  const corrected = correctedByOf(records.readings);
  const readings = groupBy(records.readings, (r) => r.equipment_id);
  const calibrations = groupBy(records.calibrations, (r) => r.equipment_id);
  const deviations = groupBy(records.deviations, (r) => r.equipment_id);
  const actions = groupBy(records.actions, (r) => r.deviation_id);
  return records.equipment.map((item) => {
    const opened = (deviations.get(item.id) ?? []).map((d) =>
      deviationOf(d, actions.get(d.id) ?? []),
    );
    // An equipment log's misses are its deviations, each naming the reading that opened it.
    const listed = (readings.get(item.id) ?? []).map((r) =>
      toReading(r, r.recorder_name, corrected),
    );
    const missed = new Set(
      (deviations.get(item.id) ?? []).map((d) => d.reading_id).filter((id) => id !== null),
    );
    return {
      name: item.name,
      kind: item.kind,
      ...readingsShown(listed, logged.get(item.id), missed),
      calibrations: (calibrations.get(item.id) ?? []).map(calibrationOf),
      deviations: opened,
    };
  });
}

/** The whole report in memory, for --json and the console; the PDF and CSV stream instead. */
export async function haccpReport(
  source: ReportSource,
  period: ReportPeriod,
  head: ReportHead,
): Promise<HaccpReport> {
  const batches: ReportBatch[] = [];
  const ids = await periodBatchIds(source.sequelize, period);
  for await (const batch of reportBatches(source, ids)) batches.push(batch);
  return {
    ...head,
    batches,
    refusals: await reportRefusals(source, period),
    equipment: await reportEquipment(source, period),
    receiving: await reportReceiving(source.sequelize, period),
  };
}
