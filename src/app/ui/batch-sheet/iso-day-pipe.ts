import { Pipe, PipeTransform } from '@angular/core';

const DAY = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });
const MOMENT = new Intl.DateTimeFormat('en-GB', {
  day: 'numeric',
  month: 'short',
  year: 'numeric',
  hour: '2-digit',
  minute: '2-digit',
});

/**
 * A calendar day (YYYY-MM-DD) or an ISO timestamp in words: "1 Dec 2026", "1 Dec 2026, 07:46".
 * Calendar days are read as local days, so they never shift a day with the time zone.
 */
@Pipe({ name: 'isoDay' })
export class IsoDayPipe implements PipeTransform {
  /**
   * @param value YYYY-MM-DD, an ISO timestamp, or nothing
   * @param withTime whether to add the time of a timestamp
   * @returns the day in words, or "—" for nothing
   */
  transform(value: string | null | undefined, withTime = false): string {
    if (!value) return '—';
    const day = /^(\d{4})-(\d{2})-(\d{2})$/.exec(value);
    if (day) return DAY.format(localDateOf(value));
    const moment = new Date(value);
    if (Number.isNaN(moment.getTime())) return value;
    return (withTime ? MOMENT : DAY).format(moment);
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
