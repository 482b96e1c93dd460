import type { ReportCalibration } from '../../shared/api/haccp-report.ts';
import {
  personRef,
  type ActionRow,
  type DeviationRow,
  type ReadingRow,
  type VerificationRow,
  type WeighingRow,
} from '../process/process-rows.ts';

export { STAMP_COLUMNS } from '../process/process-rows.ts';

/** A readings row with the batch or equipment it belongs to. */
export interface ReportReadingRow extends ReadingRow {
  batch_id: number | null;
  equipment_id: number | null;
}

/** A deviations row with the batch or equipment it belongs to and the reading that opened it. */
export interface ReportDeviationRow extends DeviationRow {
  batch_id: number | null;
  equipment_id: number | null;
  reading_id: number | null;
}

/** A corrective_actions row. */
export type ReportActionRow = ActionRow;

/** A weighings row with its batch. */
export interface ReportWeighingRow extends WeighingRow {
  batch_id: number;
}

/** A verifications row with its batch. */
export interface ReportVerificationRow extends VerificationRow {
  batch_id: number;
}

/** A calibrations row with the name of who recorded it. */
export interface CalibrationRow {
  id: number;
  equipment_id: number;
  checked_at: string;
  reading: string;
  outcome: string;
  note: string | null;
  recorded_by: number | null;
  recorder_name: string | null;
  corrects_id: number | null;
  reason: string | null;
}

/** A thermometer check as the report lists it. */
export function calibrationOf(row: CalibrationRow): ReportCalibration {
  return {
    id: row.id,
    checkedAt: row.checked_at,
    reading: row.reading,
    outcome: row.outcome,
    note: row.note,
    by: personRef(row.recorded_by, row.recorder_name),
    corrects: row.corrects_id,
    reason: row.reason,
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
