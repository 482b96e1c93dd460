/** Instants and seconds for the judging: ISO text in, milliseconds inside, ISO text out. */
import { Decimal } from '../decimal.ts';

/** The digits at `from` to `to` (exclusive) as a number; -1 when any is not a digit. */
function digitsAt(text: string, from: number, to: number): number {
  let n = 0;
  for (let i = from; i < to; i++) {
    const digit = text.charCodeAt(i) - 48;
    if (digit < 0 || digit > 9) return -1;
    n = n * 10 + digit;
  }
  return n;
}

/**
 * Milliseconds since the epoch of an ISO time, NaN when it is not one: `Date.parse`, read
 * straight for the one form the records write ("2026-03-02T12:00:00.000Z", `toISOString`). A day
 * of logger points is thousands of times, and the general parser was most of the judging's time.
 * Anything else (another form, a day past the 28th, which the general parser may roll over) goes
 * to `Date.parse`.
 */
export function isoMs(iso: string): number {
  if (
    iso.length !== 24 ||
    iso[4] !== '-' ||
    iso[7] !== '-' ||
    iso[10] !== 'T' ||
    iso[13] !== ':' ||
    iso[16] !== ':' ||
    iso[19] !== '.' ||
    iso[23] !== 'Z'
  )
    return Date.parse(iso);
  const year = digitsAt(iso, 0, 4);
  const month = digitsAt(iso, 5, 7);
  const day = digitsAt(iso, 8, 10);
  const hour = digitsAt(iso, 11, 13);
  const minute = digitsAt(iso, 14, 16);
  const second = digitsAt(iso, 17, 19);
  const ms = digitsAt(iso, 20, 23);
  // Date.UTC takes years 0–99 as 1900–1999; the ranges checked are those that need no calendar.
  if (
    year < 1000 ||
    month < 1 ||
    month > 12 ||
    day < 1 ||
    day > 28 ||
    hour < 0 ||
    hour > 23 ||
    minute < 0 ||
    minute > 59 ||
    second < 0 ||
    second > 59 ||
    ms < 0
  )
    return Date.parse(iso);
  return Date.UTC(year, month - 1, day, hour, minute, second, ms);
}

/** Milliseconds since the epoch of an ISO time. */
export function instantMs(iso: string): number {
  const ms = isoMs(iso);
  if (Number.isNaN(ms)) throw new RangeError(`"${iso}" is not an ISO time`);
  return ms;
}

/** An ISO time a number of seconds after another. */
export function addSeconds(iso: string | number, seconds: string): string {
  const start = typeof iso === 'number' ? iso : instantMs(iso);
  const ms = new Decimal(seconds).times(1000).toDecimalPlaces(0).toNumber();
  return new Date(start + ms).toISOString();
}

/** Seconds between two instants, as a decimal string. */
export function secondsBetween(fromMs: number, toMs: number): string {
  return new Decimal(toMs - fromMs).div(1000).toString();
}

/** The normal ISO form of a time, so that one instant always gives one key. */
export function normalIso(iso: string): string {
  return new Date(instantMs(iso)).toISOString();
}
