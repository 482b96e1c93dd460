/**
 * The one way Larderbook writes dates and times for people, on the console, in e-mails, on
 * PDFs and in the CLI: a day "3 Dec 2026", a moment "3 Dec 2026, 14:32", the short form of
 * a board or a log "Thu 3 Dec, 14:32", and the clock alone "14:32" for a time of today. Day and month in words, so neither is read the wrong way
 * round; a 24-hour clock. Month and weekday names are our own, not the runtime's locale data,
 * so Node and every browser write the same ("Sep", never "Sept").
 */
import { wallClockOf } from '../process/local-time.ts';

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
const WEEKDAYS = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'];
const ISO_DAY = /^(\d{4})-(\d{2})-(\d{2})$/;

/** A day on the calendar, and a time on the wall clock. */
type Wall = Omit<ReturnType<typeof wallClockOf>, 'second'>;

const two = (n: number): string => String(n).padStart(2, '0');
const weekday = (w: Wall): string =>
  WEEKDAYS[new Date(Date.UTC(w.year, w.month - 1, w.day)).getUTCDay()];
const dayText = (w: Wall): string => `${w.day} ${MONTHS[w.month - 1]} ${w.year}`;
const timeText = (w: Wall): string => `${two(w.hour)}:${two(w.minute)}`;

/** A calendar day YYYY-MM-DD as its wall fields, or null when it is not one. */
function calendarDay(text: string): Wall | null {
  const match = ISO_DAY.exec(text);
  if (!match) return null;
  const [year, month, day] = match.slice(1).map(Number);
  return { year, month, day, hour: 0, minute: 0 };
}

/** An ISO timestamp (or a Date) in a zone, or null when it is not a time. */
function momentOf(value: string | Date, timeZone: string | undefined): Wall | null {
  const date = typeof value === 'string' ? new Date(value) : value;
  return Number.isNaN(date.getTime()) ? null : wallClockOf(date, timeZone);
}

/**
 * A day: "3 Dec 2026". A calendar day YYYY-MM-DD is written as it is, in every time zone; a
 * timestamp is written as the day it falls on in `timeZone`. Text that is neither comes back
 * as it is.
 * @param timeZone an IANA zone; by default the zone this program runs in (the kitchen's)
 */
export function dayWords(value: string | Date, timeZone?: string): string {
  const wall = (typeof value === 'string' && calendarDay(value)) || momentOf(value, timeZone);
  return wall ? dayText(wall) : String(value);
}

/** A day with its weekday, for a page's heading: "Thu 3 Dec 2026". Read as {@link dayWords} reads it. */
export function weekdayDayWords(value: string | Date, timeZone?: string): string {
  const wall = (typeof value === 'string' && calendarDay(value)) || momentOf(value, timeZone);
  return wall ? `${weekday(wall)} ${dayText(wall)}` : String(value);
}

/** A day in short, for a board with the year plain: "Wed 2 Dec" (a calendar day as it is). */
export function shortDayWords(value: string | Date, timeZone?: string): string {
  const wall = (typeof value === 'string' && calendarDay(value)) || momentOf(value, timeZone);
  return wall ? `${weekday(wall)} ${wall.day} ${MONTHS[wall.month - 1]}` : String(value);
}

/**
 * A day in short, for a chart's axis where the year is plain: "3 Dec". Read as {@link dayWords}
 * reads its value.
 */
export function dayMonthWords(value: string | Date, timeZone?: string): string {
  const wall = (typeof value === 'string' && calendarDay(value)) || momentOf(value, timeZone);
  return wall ? `${wall.day} ${MONTHS[wall.month - 1]}` : String(value);
}

/** A moment: "3 Dec 2026, 14:32", on the wall clock of `timeZone` (by default this program's). */
export function momentWords(value: string | Date, timeZone?: string): string {
  const wall = momentOf(value, timeZone);
  return wall ? `${dayText(wall)}, ${timeText(wall)}` : String(value);
}

const shortText = (w: Wall): string =>
  `${weekday(w)} ${w.day} ${MONTHS[w.month - 1]}, ${timeText(w)}`;

/** A moment in short, for a board or a log with the year plain: "Thu 3 Dec, 14:32". */
export function shortMomentWords(value: string | Date, timeZone?: string): string {
  const wall = momentOf(value, timeZone);
  return wall ? shortText(wall) : String(value);
}

// A process record says thousands of times against the same today: its day is read once.
let lastToday: { key: string; wall: Wall | null } | null = null;

function todayOf(today: string | Date, timeZone: string | undefined): Wall | null {
  const key = `${String(today instanceof Date ? today.getTime() : today)}|${timeZone ?? ''}`;
  if (lastToday?.key !== key) lastToday = { key, wall: momentOf(today, timeZone) };
  return lastToday.wall;
}

/**
 * A moment of a record being worked, said against today: the clock alone "14:32" today, the
 * short moment "Thu 3 Dec, 14:32" on another day of the year, the whole moment
 * "3 Dec 2025, 14:32" in another year. Days are the wall clock's of `timeZone`.
 * @param today now, or any moment of the day to say times against
 */
export function clockMomentWords(
  value: string | Date,
  today: string | Date,
  timeZone?: string,
): string {
  const wall = momentOf(value, timeZone);
  const now = todayOf(today, timeZone);
  if (!wall || !now) return String(value);
  if (wall.year !== now.year) return `${dayText(wall)}, ${timeText(wall)}`;
  if (wall.month === now.month && wall.day === now.day) return timeText(wall);
  return shortText(wall);
}
