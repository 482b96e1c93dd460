/** Instants and seconds for the judging: ISO text in, milliseconds inside, ISO text out. */
import { Decimal } from '../decimal.ts';

/** Milliseconds since the epoch of an ISO time. */
export function instantMs(iso: string): number {
  const ms = Date.parse(iso);
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
