import type { PersonRef } from '../../shared/api/batch-record.ts';
import type {
  CorrectiveAction,
  Deviation,
  DeviationKind,
  Disposition,
  Reading,
  ReadingSource,
  Verification,
  Weighing,
} from '../../shared/api/process-record.ts';

/** The stamp columns every correctable row has, with the name of who wrote it. */
interface StampRow {
  id: number;
  recorded_by: number | null;
  recorder_name: string | null;
  recorded_at: string;
  corrects_id: number | null;
  reason: string | null;
}

/** A readings row joined with its recorder's name. */
export interface ReadingRow extends StampRow {
  control: string;
  taken_at: string;
  value: string;
  entered_as: string | null;
  source: ReadingSource;
}

/** A deviations row joined with its opener's name. */
export interface DeviationRow {
  id: number;
  control: string | null;
  kind: DeviationKind;
  what: string;
  opened_at: string;
  opened_by: number | null;
  opener_name: string | null;
  dedupe_key: string;
}

/** A corrective_actions row joined with its recorder's name. */
export interface ActionRow extends StampRow {
  deviation_id: number;
  cause: string;
  restored: string;
  prevention: string;
  disposition: Disposition;
  disposition_grams: string | null;
}

/** A weighings row joined with its recorder's name. */
export interface WeighingRow extends StampRow {
  kind: 'line' | 'stage';
  name: string;
  planned_grams: string | null;
  grams: string;
  weighed_at: string;
}

/** A verifications row joined with its recorder's name. */
export interface VerificationRow extends StampRow {
  note: string | null;
}

/** `recorded_by` and the recorder's name, for a table aliased `x`; people is `rp`. */
export const STAMP_COLUMNS = `x.id, x.recorded_by, rp.display_name AS recorder_name, x.recorded_at,
  x.corrects_id, x.reason`;

/** The person a row names, or null. */
export function personRef(id: number | null, name: string | null): PersonRef | null {
  return id === null ? null : { id, displayName: name ?? '' };
}

/**
 * Each row with the row that corrects it: a correction names what it replaces (corrects_id);
 * the replaced row is the one marked, so the map goes from the replaced id to its replacement.
 */
export function correctedByOf(rows: readonly { id: number; corrects_id: number | null }[]) {
  const by = new Map<number, number>();
  for (const row of rows) if (row.corrects_id !== null) by.set(row.corrects_id, row.id);
  return by;
}

function stampOf(row: StampRow, correctedBy: ReadonlyMap<number, number>) {
  return {
    id: row.id,
    by: personRef(row.recorded_by, row.recorder_name),
    recordedAt: row.recorded_at,
    corrects: row.corrects_id,
    reason: row.reason,
    correctedBy: correctedBy.get(row.id) ?? null,
  };
}

/**
 * A reading as the API sends it. Written out field by field: a day of logger points is thousands
 * of rows, and building each through spreads was most of the process record's time.
 */
export function toReading(
  row: Omit<ReadingRow, 'recorder_name'>,
  recorderName: string | null,
  correctedBy: ReadonlyMap<number, number>,
): Reading {
  return {
    id: row.id,
    by: row.recorded_by === null ? null : { id: row.recorded_by, displayName: recorderName ?? '' },
    recordedAt: row.recorded_at,
    corrects: row.corrects_id,
    reason: row.reason,
    correctedBy: correctedBy.get(row.id) ?? null,
    control: row.control,
    at: row.taken_at,
    value: row.value,
    enteredAs: row.entered_as,
    source: row.source,
  };
}

/** A corrective action as the API sends it. */
export function toAction(
  row: ActionRow,
  correctedBy: ReadonlyMap<number, number>,
): CorrectiveAction {
  return {
    ...stampOf(row, correctedBy),
    cause: row.cause,
    restored: row.restored,
    prevention: row.prevention,
    disposition: row.disposition,
    dispositionGrams: row.disposition_grams,
  };
}

/** A deviation with its standing action and the earlier ones it replaced, oldest first. */
export function toDeviation(row: DeviationRow, actions: readonly CorrectiveAction[]): Deviation {
  return {
    id: row.id,
    control: row.control,
    kind: row.kind,
    what: row.what,
    openedAt: row.opened_at,
    openedBy: personRef(row.opened_by, row.opener_name),
    action: actions.find((a) => a.correctedBy === null) ?? null,
    earlierActions: actions.filter((a) => a.correctedBy !== null),
  };
}

/** A weighing as the API sends it. */
export function toWeighing(row: WeighingRow, correctedBy: ReadonlyMap<number, number>): Weighing {
  return {
    ...stampOf(row, correctedBy),
    kind: row.kind,
    name: row.name,
    plannedGrams: row.planned_grams,
    grams: row.grams,
    weighedAt: row.weighed_at,
  };
}

/** A verification as the API sends it. */
export function toVerification(row: VerificationRow): Verification {
  return { ...stampOf(row, new Map()), note: row.note };
}
