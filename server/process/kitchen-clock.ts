import { clockWords } from '../../shared/process/control-words.ts';
import type { Clock } from '../../shared/process/evaluate-control.ts';

/** The zone last asked for, with the TZ it was asked under. */
let zone: { tz: string | undefined; name: string } | null = null;

/**
 * The kitchen's IANA time zone: the one the server runs in (TZ), so that "by 14:32" and a data
 * logger's local times mean the clock on the kitchen's wall.
 */
export function kitchenTimeZone(): string {
  // Asking Intl builds a formatter; the zone changes only when TZ is set again (tests do).
  if (zone === null || zone.tz !== process.env.TZ) {
    zone = { tz: process.env.TZ, name: Intl.DateTimeFormat().resolvedOptions().timeZone };
  }
  return zone.name;
}

/** The judging clock at a moment (the context's clock, which tests move) in the kitchen's zone. */
export function kitchenClock(now: Date | string): Clock {
  return {
    now: typeof now === 'string' ? now : now.toISOString(),
    timeZone: kitchenTimeZone(),
  };
}

/**
 * A moment as the kitchen's clock shows it in the product's words: "14:32" today, "Thu 3 Dec,
 * 14:32" on another day (the process record's words, shared/process/control-words.ts).
 */
export function kitchenTime(iso: string, today: string = new Date().toISOString()): string {
  return clockWords(iso, kitchenTimeZone(), today);
}
