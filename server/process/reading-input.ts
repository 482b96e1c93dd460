import type { BatchStatus } from '../../shared/api/batch-record.ts';
import type { ReadingSource } from '../../shared/api/process-record.ts';
import type { Decimal } from '../../shared/decimal.ts';
import type { ResolvedControl } from '../../shared/process/control-types.ts';
import { parseReadingValue } from '../../shared/process/reading-value.ts';
import { QuantityError } from '../../shared/units/quantity-error.ts';
import { AppError, conflict } from '../http/app-error.ts';

/** How far ahead of the server's clock a reading may be taken: clocks of phones and probes drift. common practice, no source */
export const FUTURE_TOLERANCE_MS = 5 * 60_000;

/** An ISO 8601 time with its zone (Z or ±hh:mm), as the API takes times. */
const ISO_WITH_ZONE = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d{1,9})?)?(Z|[+-]\d{2}:\d{2})$/;

/** A reading value ready to store: canonical, and as it was entered when that differs. */
export interface ParsedValue {
  readonly value: string;
  readonly enteredAs: string | null;
}

/** The control a reading names, among the batch's. @throws AppError 422 unknown-control */
export function controlNamed(
  controls: readonly ResolvedControl[],
  id: string,
  lot: string,
): ResolvedControl {
  const control = controls.find((c) => c.id === id);
  if (control) return control;
  const known = controls.map((c) => `${c.id} (${c.title})`).join(', ');
  throw new AppError(
    422,
    'unknown-control',
    known
      ? `batch ${lot} has no control "${id}"; its controls are ${known}`
      : `batch ${lot} has no process controls: its formula lists none`,
    [{ field: 'control', message: 'is not a control of this batch' }],
  );
}

/** The text without a trailing canonical unit, when it has one. */
function withoutUnit(text: string, unit: string): string {
  const units = unit === '°C' ? ['°C', '°c', 'C', 'c'] : [unit];
  for (const u of units) if (text.endsWith(u)) return text.slice(0, -u.length).trim();
  return text;
}

/**
 * A typed value in the control's canonical unit; entered-as is kept unless it was typed in that
 * unit already ("71.5", "71.5 °C").
 * @throws AppError 422 bad-reading with the field at fault
 */
export function readingValue(text: string, control: ResolvedControl, field = 'value'): ParsedValue {
  let value: Decimal;
  try {
    value = parseReadingValue(text, control.measure);
  } catch (error) {
    if (!(error instanceof QuantityError)) throw error;
    throw new AppError(422, 'bad-reading', `${control.title}: ${error.message}`, [
      { field, message: error.message },
    ]);
  }
  const typed = text.trim();
  const plain = withoutUnit(typed, control.unit);
  const canonical = /^-?\d+(\.\d+)?$/.test(plain) && value.eq(plain);
  return { value: value.toFixed(), enteredAs: canonical ? null : typed };
}

/**
 * The moment a reading was taken, as UTC ISO (so that times sort as text): `at`, or now.
 * @throws AppError 422 bad-time for a time that is not ISO with a zone, or over 5 minutes ahead
 */
export function readingTime(at: string | undefined, now: string, field = 'at'): string {
  if (at === undefined) return now;
  const ms = Date.parse(at);
  if (!ISO_WITH_ZONE.test(at) || Number.isNaN(ms))
    throw new AppError(422, 'bad-time', `"${at}" is not a time with its zone`, [
      { field, message: 'must be an ISO time with its zone, e.g. 2026-03-02T14:05:00+01:00' },
    ]);
  if (ms - Date.parse(now) > FUTURE_TOLERANCE_MS)
    throw new AppError(422, 'bad-time', 'a reading cannot be taken more than 5 minutes from now', [
      { field, message: 'is in the future' },
    ]);
  return new Date(ms).toISOString();
}

/**
 * Refuses readings on a batch not being made: planned (not started) or discarded.
 * @throws AppError 409 not-started or discarded
 */
export function refuseReadingsOn(lot: string, status: BatchStatus): void {
  if (status === 'planned')
    throw conflict(
      'not-started',
      `batch ${lot} is planned and not started yet; start it before recording readings`,
    );
  if (status === 'discarded')
    throw conflict('discarded', `batch ${lot} was discarded; no more readings are recorded on it`);
}

/** Where a request's reading comes from: the console's session, the larder command, a script. */
export function readingSource(
  authVia: 'session' | 'basic' | undefined,
  client?: string,
): ReadingSource {
  if (authVia !== 'basic') return 'console';
  return client?.trim().toLowerCase() === 'larder' ? 'command' : 'api';
}
