import type { Sequelize } from 'sequelize';
import type {
  HaccpReport,
  ReportBatch,
  ReportControl,
  ReportEquipment,
  ReportHead,
  ReportRefusal,
} from '../../shared/api/haccp-report.ts';
import type { Reading } from '../../shared/api/process-record.ts';
import type { ControlState, ResolvedControl } from '../../shared/process/control-types.ts';
import { evaluateControl, type Clock } from '../../shared/process/evaluate-control.ts';
import { limitWords } from '../../shared/process/limit-words.ts';
import type { BatchControls } from './batch-controls.ts';
import { readingsShown } from './control-summary.ts';
import {
  batchRecords,
  periodBatchIds,
  periodEquipment,
  periodRefusals,
  type RefusalRow,
  type ReportBatchRow,
} from './haccp-queries.ts';
import type { ReportPeriod } from './report-period.ts';
import {
  calibrationOf,
  correctionsOf,
  deviationOf,
  groupBy,
  readingOf,
  verificationOf,
  weighingOf,
  type ReadingRow,
} from './report-rows.ts';

/** Batches read at a time: their readings (up to 1,440 a control from a logger) stay in memory. */
export const BATCHES_A_PAGE = 50;

/** What producing a report reads from. */
export interface ReportSource {
  readonly sequelize: Sequelize;
  /** The controls of a batch's formula revision. */
  readonly controls: BatchControls;
  /** Whose report, in which time zone, and the moment controls are judged at. */
  readonly clock: Clock;
}

const person = (id: number | null, name: string | null) =>
  id === null ? null : { id, displayName: name ?? `person ${id}` };

/** The statuses after which a batch's steps are all behind it. */
const FINISHED = new Set(['done', 'discarded']);

/** A control's state in words: "met", "missed: 26.7 °C at 15:02 …". */
function stateWords(state: ControlState | null): string {
  if (!state) return 'not judged';
  return state.summary ? `${state.status}: ${state.summary}` : state.status;
}

/**
 * Judges a control on its standing readings; null when it cannot be (a control no longer in
 * the formula, or judging that fails): the report still lists every reading.
 */
function judge(
  control: ResolvedControl | undefined,
  readings: readonly Reading[],
  clock: Clock,
  stepOver: boolean,
): ControlState | null {
  if (!control) return null;
  const standing = readings
    .filter((r) => r.correctedBy === null)
    .map((r) => ({ at: r.at, value: r.value }))
    .sort((a, b) => Date.parse(a.at) - Date.parse(b.at));
  try {
    return evaluateControl(control, standing, clock, { stepOver });
  } catch {
    return null;
  }
}

/** The controls of one batch: the formula's, in its order, then any read against since removed. */
function reportControls(
  row: ReportBatchRow,
  controls: readonly ResolvedControl[],
  readingRows: readonly ReadingRow[],
  clock: Clock,
): ReportControl[] {
  const corrected = correctionsOf(readingRows);
  const byControl = groupBy(
    readingRows.map((r) => readingOf(r, corrected)),
    (r) => r.control,
  );
  const ids = [...new Set([...controls.map((c) => c.id), ...byControl.keys()])];
  return ids.map((id, index) => {
    const control = controls.find((c) => c.id === id);
    const readings = byControl.get(id) ?? [];
    // A step is behind the batch once it is finished or a later control has readings.
    const stepOver =
      FINISHED.has(row.status) || ids.slice(index + 1).some((later) => byControl.has(later));
    const state = judge(control, readings, clock, stepOver);
    return {
      id,
      title: control?.title ?? id,
      limit: control ? limitWords(control.limit, control.unit) : 'not in the formula',
      source: control?.source ?? '',
      unit: control?.unit ?? '',
      state: stateWords(state),
      ...readingsShown(readings, state),
    };
  });
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
    const weighings = groupBy(page.weighings, (r) => r.batch_id);
    const deviations = groupBy(page.deviations, (r) => r.batch_id);
    const actions = groupBy(page.actions, (r) => r.deviation_id);
    const verifications = groupBy(page.verifications, (r) => r.batch_id);
    for (const row of page.batches) {
      const weighed = weighings.get(row.id) ?? [];
      const verified = verifications.get(row.id) ?? [];
      const weighingCorrections = correctionsOf(weighed);
      const verificationCorrections = correctionsOf(verified);
      yield {
        lotCode: row.lot_code,
        formula: { id: row.formula_id, revision: row.formula_revision, title: row.formula_title },
        status: row.status,
        startedOn: row.started_on,
        startedAt: row.started_at,
        operator: person(row.operator_id, row.operator_name),
        plannedBy: person(row.planned_by, row.planner_name),
        startedBy: person(row.started_by, row.starter_name),
        controls: reportControls(
          row,
          await source.controls(row.formula_id, row.formula_revision),
          readings.get(row.id) ?? [],
          source.clock,
        ),
        weighings: weighed.map((w) => weighingOf(w, weighingCorrections)),
        deviations: (deviations.get(row.id) ?? []).map((d) =>
          deviationOf(d, actions.get(d.id) ?? []),
        ),
        verifications: verified.map((v) => verificationOf(v, verificationCorrections)),
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
    by: person(row.person_id, row.person_name),
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
  const corrected = correctionsOf(records.readings);
  const readings = groupBy(records.readings, (r) => r.equipment_id);
  const calibrations = groupBy(records.calibrations, (r) => r.equipment_id);
  const deviations = groupBy(records.deviations, (r) => r.equipment_id);
  const actions = groupBy(records.actions, (r) => r.deviation_id);
  return records.equipment.map((item) => {
    const opened = (deviations.get(item.id) ?? []).map((d) =>
      deviationOf(d, actions.get(d.id) ?? []),
    );
    // An equipment log's misses are its deviations, each naming the reading that opened it.
    const logged = (readings.get(item.id) ?? []).map((r) => readingOf(r, corrected));
    const missedAt = (deviations.get(item.id) ?? []).map((d) => ({
      kind: 'reading' as const,
      at: logged.find((r) => r.id === d.reading_id)?.at ?? '',
      what: d.what,
      key: String(d.id),
    }));
    return {
      name: item.name,
      kind: item.kind,
      ...readingsShown(logged, {
        status: 'in-progress',
        summary: '',
        stage: null,
        nextDue: null,
        misses: missedAt,
      }),
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
  };
}
