import { addDays } from '../../shared/calculation/dates.ts';
import { turnOwedSince, type HoldDates as TurnHold } from '../../shared/calculation/turn-days.ts';

/** The three reminders: turn the meat, it is ready, it is past ready and still held. */
export const REMINDER_KINDS = ['flip', 'ready', 'overdue'] as const;

/** One of {@link REMINDER_KINDS}. */
export type ReminderKind = (typeof REMINDER_KINDS)[number];

/** A held batch's dates, and the day it was recorded on. */
export interface HoldDates extends TurnHold {
  /**
   * ISO date the batch was recorded on (the server's time zone). A batch made on paper and
   * recorded later starts in the past: nothing due before this day is sent.
   */
  readonly recordedOn?: string;
  /** The latest day a turn was recorded on, YYYY-MM-DD; none when never turned. */
  readonly lastTurnedOn?: string | null;
}

/** A reminder that has come due: which, and the day it is for. */
export interface DueReminder {
  readonly kind: ReminderKind;
  /** ISO date the reminder is for. */
  readonly dueOn: string;
}

/**
 * The reminders due on `today` for a batch still curing or proofing, each named by the day it
 * is for, so that it can be sent once and only once:
 * - flip: the latest flip day up to today, while the ready day has not come. One missed while
 *   the server was down is sent late; an older one that a newer flip day has replaced is not
 *   (turning the meat twice for two missed days would be wrong); nor one already turned for: a
 *   turn recorded on or after its day settles it (the board's rule, turnOwedSince).
 * - ready: the ready day, from that day on (late if need be).
 * - overdue: the day after the ready day, from then on.
 * None is owed for a day before the batch was recorded: a batch recorded after the event (from
 * paper) is not flipped, readied or chased for days already past when it was entered; what falls
 * due from the day it was recorded on is sent as for any batch.
 * The caller leaves out batches that are done or discarded, and reminders already sent.
 */
export function dueReminders(hold: HoldDates, today: string): DueReminder[] {
  const due: DueReminder[] = [];
  const flip = turnOwedSince(hold, hold.lastTurnedOn ?? null, today);
  if (flip) due.push({ kind: 'flip', dueOn: flip });
  if (today >= hold.ready) due.push({ kind: 'ready', dueOn: hold.ready });
  const overdue = addDays(hold.ready, 1);
  if (today >= overdue) due.push({ kind: 'overdue', dueOn: overdue });
  const { recordedOn } = hold;
  return recordedOn ? due.filter((reminder) => reminder.dueOn >= recordedOn) : due;
}

/** The local calendar date of an instant (the server's time zone, TZ), as YYYY-MM-DD. */
export function localDate(instant: Date): string {
  const pad = (n: number): string => String(n).padStart(2, '0');
  return `${instant.getFullYear()}-${pad(instant.getMonth() + 1)}-${pad(instant.getDate())}`;
}
