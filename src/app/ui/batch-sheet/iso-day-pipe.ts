import { Pipe, PipeTransform } from '@angular/core';
import {
  dayWords,
  momentWords,
  shortMomentWords,
} from '../../../../shared/presentation/date-words.ts';

/** How much of a date to write: the day, the day and time, or the short form of a board. */
export type DateForm = 'day' | 'moment' | 'short';

const FORMS: Readonly<Record<DateForm, (value: string) => string>> = {
  day: (value) => dayWords(value),
  moment: (value) => momentWords(value),
  short: (value) => shortMomentWords(value),
};

/**
 * A calendar day (YYYY-MM-DD) or an ISO timestamp in the console's one form
 * (shared/presentation/date-words.ts): "3 Dec 2026", "3 Dec 2026, 14:32" (`'moment'`, or
 * `true`), "Thu 3 Dec, 14:32" (`'short'`). Calendar days never shift with the time zone.
 */
@Pipe({ name: 'isoDay' })
export class IsoDayPipe implements PipeTransform {
  /**
   * @param value YYYY-MM-DD, an ISO timestamp, or nothing
   * @param form which form; `true` is `'moment'`, for the pipe's earlier callers
   * @returns the date in words, or "—" for nothing
   */
  transform(value: string | null | undefined, form: DateForm | boolean = 'day'): string {
    if (!value) return '—';
    const chosen: DateForm = form === true ? 'moment' : form === false ? 'day' : form;
    // A calendar day has no time to show.
    return /^\d{4}-\d{2}-\d{2}$/.test(value) ? dayWords(value) : FORMS[chosen](value);
  }
}

/** A local calendar day as YYYY-MM-DD, or null for no (or an invalid) date. */
export function isoDateOf(date: Date | null): string | null {
  if (!date || Number.isNaN(date.getTime())) return null;
  const pad = (n: number): string => String(n).padStart(2, '0');
  return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}`;
}

/** YYYY-MM-DD as a local date at midnight (never shifted by the time zone). */
export function localDateOf(iso: string): Date {
  const [year, month, day] = iso.split('-').map(Number);
  return new Date(year, month - 1, day);
}
