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

/** What an upload stored: how many readings, and the deviations it opened. */
export interface UploadAnswer {
  readonly added: number;
  readonly deviations: readonly Deviation[];
}

const MEASURED_BY_LOGGERS = new Set(['internal-temperature', 'chamber-temperature']);

/** Words for a file over the limits. */
export const TOO_LARGE_WORDS = `a logger file is at most 2 MB and ${MAX_LOG_LINES.toLocaleString('en')} lines; split it by day`;

/** Whether a logger file is over the limits (the API answers 413 before reading it). */
export function overLogLimits(text: string): boolean {
  return Buffer.byteLength(text) > MAX_LOG_BYTES || text.split('\n').length > MAX_LOG_LINES;
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

/**
 * A data logger's CSV export stored as readings of one control, all or nothing: any line that
 * cannot be read refuses the whole file, naming the line. Judged once at the end.
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
    await insertReadings(deps, t, batch.id, readings, by);
    const judgement = await judgeAndOpen(deps, t, batch, controls, now, by);
    await deps.audit.append(
      {
        actor: by.actor,
        action: 'readings-upload',
        subject: lot,
        detail: {
          control: control.id,
          count: readings.length,
          from: readings[0]!.at,
          to: readings.at(-1)!.at,
        },
        ...(by.ip === undefined ? {} : { ip: by.ip }),
      },
      t,
    );
    const opened = new Set(judgement.opened.map((o) => o.id));
    const deviations = (await deps.process.deviations(batch.id, t))
      .filter((d) => opened.has(d.id))
      .map(({ key: _key, ...d }) => d);
    return { added: readings.length, deviations };
  });
}
