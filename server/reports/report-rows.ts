import type { PersonRef } from '../../shared/api/batch-record.ts';
import type {
  CorrectiveAction,
  Deviation,
  Disposition,
  DeviationKind,
  Reading,
  ReadingSource,
  Verification,
  Weighing,
} from '../../shared/api/process-record.ts';
import type { ReportCalibration } from '../../shared/api/haccp-report.ts';

/** Who wrote an entry and when, with what it corrects: the columns every correctable row has. */
export interface StampRow {
  id: number;
  recorded_by: number | null;
  by_name: string | null;
  recorded_at: string;
  corrects_id: number | null;
  reason: string | null;
}

/** A readings row with the name of who recorded it. */
export interface ReadingRow extends StampRow {
  batch_id: number | null;
  equipment_id: number | null;
  control: string;
  taken_at: string;
  value: string;
  entered_as: string | null;
  source: ReadingSource;
}

/** A deviations row with the name of who opened it. */
export interface DeviationRow {
  id: number;
  batch_id: number | null;
  equipment_id: number | null;
  control: string | null;
  kind: DeviationKind;
  what: string;
  opened_at: string;
  opened_by: number | null;
  opener_name: string | null;
  reading_id: number | null;
}

/** A corrective_actions row. */
export interface ActionRow extends StampRow {
  deviation_id: number;
  cause: string;
  restored: string;
  prevention: string;
  disposition: Disposition;
  disposition_grams: string | null;
}

/** A weighings row. */
export interface WeighingRow extends StampRow {
  batch_id: number;
  kind: 'line' | 'stage';
  name: string;
  planned_grams: string | null;
  grams: string;
  weighed_at: string;
}

/** A verifications row. */
export interface VerificationRow extends StampRow {
  batch_id: number;
  note: string | null;
}

/** A calibrations row. */
export interface CalibrationRow extends StampRow {
  equipment_id: number;
  checked_at: string;
  reading: string;
  outcome: string;
  note: string | null;
}

/** The SQL of a stamp's columns with the recorder's name; `x` is the table, `p` people. */
export const STAMP_COLUMNS =
  'x.id, x.recorded_by, p.display_name AS by_name, x.recorded_at, x.corrects_id, x.reason';

function person(id: number | null, name: string | null): PersonRef | null {
  return id === null ? null : { id, displayName: name ?? `person ${id}` };
}

/**
 * The ids of the rows another row corrects: a corrected entry stays, marked by its correction.
 * @returns the id of the correction of each corrected row
 */
export function correctionsOf(rows: readonly StampRow[]): Map<number, number> {
  const by = new Map<number, number>();
  for (const row of rows) if (row.corrects_id !== null) by.set(row.corrects_id, row.id);
  return by;
}

function stamp(row: StampRow, corrected: ReadonlyMap<number, number>) {
  return {
    id: row.id,
    by: person(row.recorded_by, row.by_name),
    recordedAt: row.recorded_at,
    corrects: row.corrects_id,
    reason: row.reason,
    correctedBy: corrected.get(row.id) ?? null,
  };
}

/** A reading as the API sends it. */
export function readingOf(row: ReadingRow, corrected: ReadonlyMap<number, number>): Reading {
  return {
    ...stamp(row, corrected),
    control: row.control,
    at: row.taken_at,
    value: row.value,
    enteredAs: row.entered_as,
    source: row.source,
  };
}

/** A weighing as the API sends it. */
export function weighingOf(row: WeighingRow, corrected: ReadonlyMap<number, number>): Weighing {
  return {
    ...stamp(row, corrected),
    kind: row.kind,
    name: row.name,
    plannedGrams: row.planned_grams,
    grams: row.grams,
    weighedAt: row.weighed_at,
  };
}

/** A verification as the API sends it. */
export function verificationOf(
  row: VerificationRow,
  corrected: ReadonlyMap<number, number>,
): Verification {
  return { ...stamp(row, corrected), note: row.note };
}

/** A calibration as the report lists it. */
export function calibrationOf(row: CalibrationRow): ReportCalibration {
  return {
    id: row.id,
    checkedAt: row.checked_at,
    reading: row.reading,
    outcome: row.outcome,
    note: row.note,
    by: person(row.recorded_by, row.by_name),
    corrects: row.corrects_id,
    reason: row.reason,
  };
}

function actionOf(row: ActionRow, corrected: ReadonlyMap<number, number>): CorrectiveAction {
  return {
    ...stamp(row, corrected),
    cause: row.cause,
    restored: row.restored,
    prevention: row.prevention,
    disposition: row.disposition,
    dispositionGrams: row.disposition_grams,
  };
}

/**
 * A deviation with its corrective actions: the standing one (the last not replaced), and the
 * earlier ones it replaced, oldest first.
 */
export function deviationOf(row: DeviationRow, actions: readonly ActionRow[]): Deviation {
  const corrected = correctionsOf(actions);
  const all = actions.map((action) => actionOf(action, corrected));
  const standing = all.filter((action) => action.correctedBy === null).at(-1) ?? null;
  return {
    id: row.id,
    control: row.control,
    kind: row.kind,
    what: row.what,
    openedAt: row.opened_at,
    openedBy: person(row.opened_by, row.opener_name),
    action: standing,
    earlierActions: all.filter((action) => action !== standing),
  };
}

/** Rows grouped by a key, in the order they came. */
export function groupBy<T, K>(rows: readonly T[], key: (row: T) => K): Map<K, T[]> {
  const groups = new Map<K, T[]>();
  for (const row of rows) {
    const group = groups.get(key(row));
    if (group) group.push(row);
    else groups.set(key(row), [row]);
  }
  return groups;
}
