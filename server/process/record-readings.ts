/**
 * The readings of a batch for its process record, read so that thousands of logger points are
 * never built as objects: SQLite writes each control's readings as the API's JSON text (the
 * `Reading` shape, spliced into the answer unparsed), and hands the judging only the times and
 * values of the standing readings.
 */
import type { ReadingPoint } from '../../shared/process/control-types.ts';
import { jsonArrayText, type Dialect } from '../db/dialect-sql.ts';

/** A control's readings as the process record sends them, and what the judging needs. */
export interface ControlReadings {
  /** Every reading, corrected ones included, oldest first: the API's JSON array, UTF-8. */
  readonly json: Buffer;
  /** The standing readings (not corrected), oldest first. */
  readonly standing: readonly ReadingPoint[];
}

interface ControlRow {
  control: string;
  readings: Buffer;
  ids: string;
  times: string;
  vals: string;
  fixes: string;
}

/** Runs a read; the repository's, inside its transaction when it has one. */
export type Select = <T extends object>(sql: string, values: readonly number[]) => Promise<T[]>;

// One row per control, along readings_batch (batch_id, control, taken_at, id). Each reading is
// written in the order and with the values of `toReading` (server/process/process-rows.ts): the
// recorder's name by a lookup on people's primary key (a few people record a batch; a join
// planned on every logger point once doubled the read), correctedBy by readings_corrects. The
// ids, times and values come beside it for the judging, and the ids a reading of the batch
// corrects. The readings come as a BLOB, the bytes of the text: as a string, a megabyte of
// logger points was decoded into the JavaScript heap only to be encoded again for the answer,
// and collecting those strings took longer than the rest of the request. Without an ORDER BY in the aggregates, SQLite hands them the rows in the index's
// order (sorting them again cost about a quarter of the read); every aggregate gets the same
// rows in the same order, so the check below proves the text's order from the ids and times.
function readingsSql(dialect: Dialect, ordered: boolean): string {
  const order = ordered ? ' ORDER BY x.taken_at, x.id' : '';
  const readings =
    dialect === 'postgres'
      ? `convert_to('[' || string_agg(to_json(r)::text, ','${order}) || ']', 'UTF8')`
      : `CAST(json_group_array(json_object('id', x.id,
    'by', CASE WHEN x.recorded_by IS NULL THEN NULL ELSE json_object('id', x.recorded_by,
      'displayName', coalesce((SELECT p.display_name FROM people p WHERE p.id = x.recorded_by), ''))
    END,
    'recordedAt', x.recorded_at, 'corrects', x.corrects_id, 'reason', x.reason,
    'correctedBy', (SELECT c.id FROM readings c WHERE c.corrects_id = x.id),
    'control', x.control, 'at', x.taken_at, 'value', x.value, 'enteredAs', x.entered_as,
    'source', x.source)${order}) AS BLOB)`;
  return `SELECT x.control,
  ${readings} AS readings,
  ${jsonArrayText(dialect, 'x.id', order)} AS ids,
  ${jsonArrayText(dialect, 'x.taken_at', order)} AS times,
  ${jsonArrayText(dialect, 'x.value', order)} AS vals,
  ${jsonArrayText(dialect, 'x.corrects_id', '', ' FILTER (WHERE x.corrects_id IS NOT NULL)')} AS fixes
  FROM readings x${dialect === 'postgres' ? POSTGRES_READING : ''} WHERE x.batch_id = ? GROUP BY x.control`;
}

// PostgreSQL's json_build_object spaces its text (`"id" : 1`), which would not be the bytes
// res.json sends; a row's own JSON (to_json) is compact, its nested row (the recorder) an object
// or null, so each reading is built as a row with the API's names, in toReading's order.
const POSTGRES_READING = ` CROSS JOIN LATERAL (SELECT x.id AS "id",
    (SELECT p FROM (SELECT x.recorded_by AS "id", coalesce((SELECT d.display_name FROM people d
      WHERE d.id = x.recorded_by), '') AS "displayName") p WHERE x.recorded_by IS NOT NULL) AS "by",
    x.recorded_at AS "recordedAt", x.corrects_id AS "corrects", x.reason AS "reason",
    (SELECT c.id FROM readings c WHERE c.corrects_id = x.id) AS "correctedBy",
    x.control AS "control", x.taken_at AS "at", x.value AS "value", x.entered_as AS "enteredAs",
    x.source AS "source") r`;

/** The record's readings query as SQLite runs it first (the benchmark prints its plan). */
export const RECORD_READINGS_SQL = readingsSql('sqlite', false);
const ORDERED_SQL = readingsSql('sqlite', true);
// PostgreSQL's grouping hands an aggregate its rows in no set order: there, always sorted.
const POSTGRES_SQL = readingsSql('postgres', true);

/** Whether readings are oldest first: by time, then by id (the judging's order, and the API's). */
export function inTakenOrder(ids: readonly number[], times: readonly string[]): boolean {
  for (let i = 1; i < ids.length; i++) {
    const before = times[i - 1];
    const at = times[i];
    if (before > at || (before === at && ids[i - 1] > ids[i])) return false;
  }
  return true;
}

/**
 * Every reading of a batch, by control: the API's text and the standing points. Read a second
 * time with the aggregates sorted when SQLite ever hands the rows over out of order.
 * @param ordered sort in the aggregates from the start (tests; always on PostgreSQL)
 */
export async function recordReadings(
  select: Select,
  batchId: number,
  dialect: Dialect,
  ordered = dialect === 'postgres',
): Promise<Map<string, ControlReadings>> {
  const sql = dialect === 'postgres' ? POSTGRES_SQL : ordered ? ORDERED_SQL : RECORD_READINGS_SQL;
  const rows = await select<ControlRow>(sql, [batchId]);
  const parsed = rows.map((row) => ({
    row,
    ids: JSON.parse(row.ids) as number[],
    times: JSON.parse(row.times) as string[],
  }));
  if (!ordered && !parsed.every(({ ids, times }) => inTakenOrder(ids, times)))
    return recordReadings(select, batchId, dialect, true);
  // A reading is corrected when a reading of the batch names it (correctedByOf's rule).
  const corrected = new Set<number>();
  for (const { row } of parsed)
    for (const id of JSON.parse(row.fixes) as number[]) corrected.add(id);
  const byControl = new Map<string, ControlReadings>();
  for (const { row, ids, times } of parsed) {
    const values = JSON.parse(row.vals) as string[];
    const standing: ReadingPoint[] = [];
    for (let i = 0; i < ids.length; i++)
      if (!corrected.has(ids[i])) standing.push({ at: times[i], value: values[i] });
    byControl.set(row.control, { json: row.readings, standing });
  }
  return byControl;
}
