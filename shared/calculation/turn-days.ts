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

/**
 * The turning day a cure still owes a turn for on `today`, or null when none is owed: the latest
 * turning day on or before today, while the ready day has not come, unless a turn is recorded on
 * or after it. A turn missed yesterday is still owed today; an older one that a newer turning day
 * has replaced is not owed twice (one turn puts the meat right). The board and the reminders both
 * decide from here. The rule that a missed turn stays owed until done: common practice, no source.
 * @param lastTurnedOn the latest day a turn was recorded on, YYYY-MM-DD, or null for none
 * @param today the kitchen's calendar day, YYYY-MM-DD
 */
export function turnOwedSince(
  hold: HoldDates,
  lastTurnedOn: string | null,
  today: string,
): string | null {
  if (today >= hold.ready) return null;
  const latest = flipDays(hold)
    .filter((day) => day <= today)
    .at(-1);
  if (!latest) return null;
  return lastTurnedOn !== null && lastTurnedOn >= latest ? null : latest;
}
