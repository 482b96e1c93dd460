import type {
  FormulaKind,
  PresentedResult,
  RawBatchOptions,
  UnitSystem,
} from '../../shared/index.ts';
import { recordedAllergenName } from '../../shared/calculation/allergens.ts';
import type {
  Batch,
  BatchEvent,
  BatchListItem,
  BatchStatus,
  BatchSummary,
  BatchTurn,
} from '../../shared/api/batch-record.ts';
import {
  jsonEach,
  jsonMember,
  jsonNumberAt,
  jsonObjectText,
  type Dialect,
} from '../db/dialect-sql.ts';
import { lastTurnColumn, lastTurnOf } from './batch-turns.ts';

/** A batch row joined with the names of its operator and reviewer. */
export interface BatchRow {
  id: number;
  lot_code: string;
  formula_id: string;
  formula_revision: string;
  formula_title: string;
  kind: FormulaKind;
  status: BatchStatus;
  operator_id: number;
  operator_name: string | null;
  started_on: string;
  ready_on: string | null;
  recorded_at: string;
  updated_at: string;
  units: UnitSystem;
  inputs: string;
  checks_passed: number;
  nitrite_ppm: string | null;
  signed_off_by: number | null;
  signer_name: string | null;
  signed_off_at: string | null;
  discard_reason: string | null;
  notes: string | null;
  /** Only when the full batch is read. */
  result?: string;
  /** Only in a list: the 'nitrite-max' check's limit and status as JSON (LIST_COLUMNS). */
  nitrite_max?: string | null;
  /** Only in a list: a curing batch's turning rule, days (LIST_COLUMNS). */
  flip_every_days?: number | null;
  /** Only in a list: a curing batch's latest turn as JSON (lastTurnColumn). */
  last_turn?: string | null;
}

/** A batch event row joined with the name of whoever made it. */
export interface BatchEventRow {
  id: number;
  at: string;
  actor_id: number | null;
  actor_name: string | null;
  type: BatchEvent['type'];
  from_status: BatchStatus | null;
  to_status: BatchStatus | null;
  reason: string | null;
}

/** The columns of a summary, with the people's names; `b` is batches. */
export const SUMMARY_COLUMNS = `b.id, b.lot_code, b.formula_id, b.formula_revision, b.formula_title, b.kind,
  b.status, b.operator_id, op.display_name AS operator_name, b.started_on, b.ready_on,
  b.recorded_at, b.updated_at, b.units, b.inputs, b.checks_passed, b.nitrite_ppm,
  b.signed_off_by, so.display_name AS signer_name, b.signed_off_at, b.discard_reason, b.notes`;

/**
 * The columns of a list item: a summary, and the limit and status of the batch's 'nitrite-max'
 * check picked out of its stored result by the database, at about 15 µs a cure on SQLite. Parsing
 * every result in JavaScript and sending it whole was most of the list's time (240 kB for a page
 * of 50, eight times the summaries). Only a batch with a nitrite figure (a cure) has the check.
 */
function listColumnsOf(dialect: Dialect): string {
  const check = jsonObjectText(
    dialect,
    `'limit', ${jsonMember(dialect, 'c.value', 'limit')}, 'status', ${jsonMember(dialect, 'c.value', 'status')}`,
  );
  return `${SUMMARY_COLUMNS},
  CASE WHEN b.nitrite_ppm IS NOT NULL THEN (
    SELECT ${check}
    FROM ${jsonEach(dialect, 'b.result', 'checks', 'c')} WHERE c.value ->> 'id' = 'nitrite-max'
  ) END AS nitrite_max,
  CASE WHEN b.status = 'curing' THEN ${jsonNumberAt(dialect, 'b.result', ['schedule', 'flipEveryDays'])} END AS flip_every_days,
  ${lastTurnColumn(dialect)}`;
}

/** The columns of a list item (see listColumnsOf) in each database's words. */
export const LIST_COLUMNS: Readonly<Record<Dialect, string>> = {
  sqlite: listColumnsOf('sqlite'),
  postgres: listColumnsOf('postgres'),
};

/**
 * batches joined to the people it names. LEFT JOINs keep batches the outer loop of the query,
 * so the planner walks a batches index in the requested order instead of sorting.
 */
export const BATCHES_WITH_PEOPLE = `batches b
  LEFT JOIN people op ON op.id = b.operator_id
  LEFT JOIN people so ON so.id = b.signed_off_by`;

/** A row as the summary the API, CSV and CLI share. */
export function toSummary(row: BatchRow): BatchSummary {
  return {
    lotCode: row.lot_code,
    formula: { id: row.formula_id, revision: row.formula_revision, title: row.formula_title },
    kind: row.kind,
    status: row.status,
    operator: {
      id: row.operator_id,
      displayName: row.operator_name ?? `person ${row.operator_id}`,
    },
    startedOn: row.started_on,
    readyOn: row.ready_on,
    recordedAt: row.recorded_at,
    updatedAt: row.updated_at,
    units: row.units,
    inputs: JSON.parse(row.inputs) as RawBatchOptions,
    checksPassed: row.checks_passed === 1,
    nitritePpm: row.nitrite_ppm,
    signedOff:
      row.signed_off_by !== null && row.signed_off_at !== null
        ? {
            by: {
              id: row.signed_off_by,
              displayName: row.signer_name ?? `person ${row.signed_off_by}`,
            },
            at: row.signed_off_at,
          }
        : null,
    discardReason: row.discard_reason,
    notes: row.notes,
  };
}

/** A row read with LIST_COLUMNS as the API lists it. */
export function toListItem(row: BatchRow): BatchListItem {
  return {
    ...toSummary(row),
    nitriteMax: row.nitrite_max
      ? (JSON.parse(row.nitrite_max) as BatchListItem['nitriteMax'])
      : null,
    flipEveryDays: row.flip_every_days ?? null,
    lastTurn: lastTurnOf(row.last_turn),
  };
}

/** A row read with its result column as the full batch. */
export function toBatch(
  row: BatchRow,
  events?: readonly BatchEvent[],
  turns?: readonly BatchTurn[],
): Batch {
  return {
    ...toSummary(row),
    result: withRecordedAllergens(JSON.parse(row.result ?? 'null') as PresentedResult | null),
    ...(events ? { events } : {}),
    ...(turns ? { turns } : {}),
  };
}

/** Older batches stored allergen keys ("tree-nuts"); they read as names ("tree nuts"). */
function withRecordedAllergens(result: PresentedResult | null): PresentedResult {
  if (!result?.allergens) return result as PresentedResult;
  return { ...result, allergens: result.allergens.map(recordedAllergenName) };
}

/** An event row as the API shows it. */
export function toEvent(row: BatchEventRow): BatchEvent {
  return {
    type: row.type,
    at: row.at,
    by:
      row.actor_id === null
        ? null
        : { id: row.actor_id, displayName: row.actor_name ?? `person ${row.actor_id}` },
    from: row.from_status,
    to: row.to_status,
    reason: row.reason,
  };
}
