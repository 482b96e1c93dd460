/**
 * A standing reading made ready for judging once: its instant in milliseconds and its value as an
 * exact decimal. A day of logger points is thousands of readings, each compared against a limit
 * several times; parsing the text again on every comparison was most of the judging's time.
 */
import { Decimal } from '../decimal.ts';
import type { ReadingPoint } from './control-types.ts';
import { instantMs, isoMs } from './judge-time.ts';

/** A reading with its time and value parsed. */
export interface JudgedPoint extends ReadingPoint {
  /** Milliseconds since the epoch of `at`; NaN when `at` is not an ISO time. */
  readonly ms: number;
  /** `value`, exact: limits are compared on it, never on a float. */
  readonly decimal: Decimal;
}

/** The readings, in their order, each parsed once. */
export function judgedPoints(readings: readonly ReadingPoint[]): JudgedPoint[] {
  // A logger repeats a few hundred values over a day's points: each text is parsed once (a
  // decimal never changes, so the points may share it).
  const decimals = new Map<string, Decimal>();
  return readings.map((reading) => {
    let decimal = decimals.get(reading.value);
    if (!decimal) {
      decimal = new Decimal(reading.value);
      decimals.set(reading.value, decimal);
    }
    return { at: reading.at, value: reading.value, ms: isoMs(reading.at), decimal };
  });
}

/** Milliseconds since the epoch of a point. @throws RangeError when its time is not ISO */
export function pointMs(point: JudgedPoint): number {
  // instantMs throws the judging's own error for a time that is not ISO.
  return Number.isNaN(point.ms) ? instantMs(point.at) : point.ms;
}
