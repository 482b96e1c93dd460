import { addDays } from './dates.ts';

/** A held batch's dates, from its result's schedule (or its ready date alone). */
export interface HoldDates {
  /** ISO date the hold starts. */
  readonly start: string;
  /** ISO date it is ready. */
  readonly ready: string;
  /** Turn or overhaul every this many days, when the formula says so. */
  readonly flipEveryDays?: number | null;
}

/**
 * The days a held cure is turned (or overhauled): start + k × every, for k = 1, 2, …, before the
 * ready day. None when the formula gives no turning rule. The reminders and the console's board
 * both count turns from here.
 */
export function flipDays(hold: HoldDates): string[] {
  const every = hold.flipEveryDays ?? 0;
  if (!Number.isInteger(every) || every < 1) return [];
  const days: string[] = [];
  for (let k = 1; ; k++) {
    const day = addDays(hold.start, k * every);
    if (day >= hold.ready) return days;
    days.push(day);
  }
}
