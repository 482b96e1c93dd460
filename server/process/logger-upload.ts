import { QueryTypes, type Transaction } from 'sequelize';
import type { Deviation } from '../../shared/api/process-record.ts';
import {
  LoggerCsvError,
  parseLoggerCsv,
  type LoggedPoint,
} from '../../shared/process/logger-csv.ts';
import type { ChangeOptions } from '../batches/batch.ts';
import { AppError } from '../http/app-error.ts';
import { RecordsError } from '../records/records-error.ts';
import { judgeAndOpen, type ProcessDeps } from './judge-and-open.ts';
import { kitchenTimeZone } from './kitchen-clock.ts';
import { controlNamed, readingTime, refuseReadingsOn } from './reading-input.ts';
import { insertReadings } from './reading-writes.ts';
import { refuseOnReleased } from './released.ts';

/** The largest logger file read: a day at one point a minute is about 40 kB. common practice, no source */
export const MAX_LOG_BYTES = 2 * 1024 * 1024;
/** The most lines of a logger file: two weeks at one point a minute. common practice, no source */
export const MAX_LOG_LINES = 20_000;

/** What an upload stored: how many readings, how many were there already, the deviations. */
export interface UploadAnswer {
  /** Points of the file stored now. */
  readonly added: number;
  /** Points of the file the batch had from a logger already (same control, time and value). */
  readonly alreadyStored: number;
  readonly deviations: readonly Deviation[];
  /** What was stored, in a cook's words. */
  readonly message: string;
}

const MEASURED_BY_LOGGERS = new Set(['internal-temperature', 'chamber-temperature']);

/** Words for a file over the limits. */
export const TOO_LARGE_WORDS = `a logger file is at most 2 MB and ${MAX_LOG_LINES.toLocaleString('en')} lines; split it by day`;

/** Whether a logger file is over the limits (the API answers 413 before reading it). */
export function overLogLimits(text: string): boolean {
  return Buffer.byteLength(text) > MAX_LOG_BYTES || text.split('\n').length > MAX_LOG_LINES;
}

/**
 * The points not stored before: the batch's logger readings of the control over the file's span
 * are read along readings_batch (batch_id, control, taken_at, id), and a point with the same time
 * and value as one of them, or as an earlier point of the same file, is left out. A reading typed
 * by hand is not the logger's, so a logger point beside it is stored.
 */
async function newPoints<P extends { readonly at: string; readonly value: string }>(
  deps: ProcessDeps,
  t: Transaction,
  batchId: number,
  control: string,
  points: readonly P[],
): Promise<P[]> {
  let from = points[0]!.at;
  let to = from;
  for (const { at } of points) {
    if (at < from) from = at;
    if (at > to) to = at;
  }
  const stored = await deps.db.sequelize.query<{ taken_at: string; value: string }>(
    `SELECT taken_at, value FROM readings
     WHERE batch_id = ? AND control = ? AND taken_at >= ? AND taken_at <= ? AND source = 'logger'`,
    { replacements: [batchId, control, from, to], type: QueryTypes.SELECT, transaction: t },
  );
  const seen = new Set(stored.map((r) => `${r.taken_at} ${r.value}`));
  return points.filter((p) => {
    const key = `${p.at} ${p.value}`;
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

/** Every point of the file, or the first line that cannot be read as a 422 bad-log. */
function pointsOf(text: string): LoggedPoint[] {
  if (overLogLimits(text)) throw new RecordsError('bad-input', 'too-large', TOO_LARGE_WORDS);
  try {
    return parseLoggerCsv(text, kitchenTimeZone());
  } catch (error) {
    if (!(error instanceof LoggerCsvError)) throw error;
    throw new AppError(
      422,
      'bad-log',
      `the logger file cannot be read: ${error.message}; nothing was stored`,
      [{ line: error.line, message: error.message }],
    );
  }
}

/** What an upload stored, in a cook's words. */
export function uploadWords(added: number, alreadyStored: number): string {
  const number = (n: number): string => n.toLocaleString('en');
  const readings = (n: number): string => (n === 1 ? 'reading' : 'readings');
  const were = alreadyStored === 1 ? 'was' : 'were';
  if (added === 0)
    return alreadyStored === 1
      ? 'Nothing new: the one reading in this file was stored already.'
      : `Nothing new: all ${number(alreadyStored)} readings in this file were stored already.`;
  if (alreadyStored === 0) return `${number(added)} ${readings(added)} stored.`;
  return `${number(added)} new ${readings(added)} stored; ${number(alreadyStored)} in this file ${were} stored already and ${were} not stored again.`;
}

/**
 * A data logger's CSV export stored as readings of one control, all or nothing: any line that
 * cannot be read refuses the whole file, naming the line. A point the batch has from a logger
 * already (the same control, time and value: the same file sent twice, or files that overlap) is
 * not stored again; a file with nothing new stores nothing and says so. Judged once at the end.
 * @throws AppError 404 no such lot; 409 not-started, discarded or released; 413 too-large; 422 bad-log,
 *   unknown-control, bad-time, not-temperature
 */
export async function uploadReadings(
  deps: ProcessDeps,
  lot: string,
  controlId: string,
  text: string,
  by: ChangeOptions,
): Promise<UploadAnswer> {
  const now = by.at ?? new Date().toISOString();
  const found = await deps.process.batch(lot);
  const controls = await deps.process.controlsOf(found);
  const control = controlNamed(controls, controlId, lot);
  if (!MEASURED_BY_LOGGERS.has(control.measure))
    throw new AppError(
      422,
      'not-temperature',
      `a logger file holds temperatures; ${control.title} is not measured as a temperature`,
      [{ field: 'control', message: 'is not a temperature control' }],
    );
  const points = pointsOf(text);
  if (points.length === 0)
    throw new AppError(422, 'bad-log', 'the logger file holds no readings; nothing was stored', [
      { line: 1, message: 'no readings' },
    ]);
  const readings = points.map((p) => ({
    control: control.id,
    at: readingTime(p.at, now),
    value: p.value,
    enteredAs: p.enteredAs === p.value ? null : p.enteredAs,
    source: 'logger' as const,
  }));
  return deps.db.write(async (t) => {
    const batch = await deps.process.batch(lot, t);
    refuseReadingsOn(lot, batch.status);
    await refuseOnReleased(deps.db, t, batch);
    const fresh = await newPoints(deps, t, batch.id, control.id, readings);
    const alreadyStored = readings.length - fresh.length;
    if (fresh.length === 0)
      return { added: 0, alreadyStored, deviations: [], message: uploadWords(0, alreadyStored) };
    await insertReadings(deps, t, batch.id, fresh, by);
    const judgement = await judgeAndOpen(deps, t, batch, controls, now, by, 'readings');
    await deps.audit.append(
      {
        actor: by.actor,
        action: 'readings-upload',
        subject: lot,
        detail: {
          control: control.id,
          count: fresh.length,
          ...(alreadyStored > 0 ? { alreadyStored } : {}),
          from: fresh[0]!.at,
          to: fresh.at(-1)!.at,
        },
        ...(by.ip === undefined ? {} : { ip: by.ip }),
      },
      t,
    );
    const opened = new Set(judgement.opened.map((o) => o.id));
    const deviations = (await deps.process.deviations(batch.id, t))
      .filter((d) => opened.has(d.id))
      .map(({ key: _key, ...d }) => d);
    return {
      added: fresh.length,
      alreadyStored,
      deviations,
      message: uploadWords(fresh.length, alreadyStored),
    };
  });
}
