import { BatchError } from './batch-error.ts';
import { dayWords } from '../presentation/date-words.ts';
import { addDays, isIsoDate } from './dates.ts';

// A batch's start day lies within a year either side of today. A year back lets a kitchen record
// a batch made on paper (a power cut, a lost tablet) long after the event; a year ahead covers
// planning for the next season's holidays. A narrower window would refuse real records; a wider
// one would let a lot code's two-digit year (YYMMDD, lot-code.ts) name two different years, and
// a start in 9999 would make a ready date past the calendar. 365 days either way keeps every start
// within one calendar year of today's, so 26 in a lot code can only be this century's 2026.
// (common practice, no source)

/** How many days before today a batch may start: a batch made on paper, recorded later. */
export const START_DAYS_BACK = 365;

/** How many days after today a batch may start: a batch planned ahead. */
export const START_DAYS_AHEAD = 365;

/** The first and last day a batch may start on, ISO YYYY-MM-DD, both included. */
export interface StartWindow {
  readonly earliest: string;
  readonly latest: string;
}

/**
 * The days a batch may start on, counted from today.
 * @param today the caller's today, YYYY-MM-DD (the core never reads a clock)
 */
export function startWindow(today: string): StartWindow {
  if (!isIsoDate(today)) throw new Error(`today must be a date written YYYY-MM-DD, not "${today}"`);
  return { earliest: addDays(today, -START_DAYS_BACK), latest: addDays(today, START_DAYS_AHEAD) };
}

/**
 * Checks that a start day (already a real YYYY-MM-DD date) lies within a year of today.
 * @param option the option or field named in the refusal (`--start`)
 * @returns the start day
 * @throws BatchError naming the option and the days allowed
 */
export function checkStartDate(start: string, today: string, option = 'start'): string {
  const { earliest, latest } = startWindow(today);
  if (start >= earliest && start <= latest) return start;
  const side = start > latest ? 'ahead' : 'back';
  // The console shows it with the option in a field's words: the days are said in words too.
  throw new BatchError(
    `--${option} ${dayWords(start)} is more than a year ${side}: a batch can start from ` +
      `${dayWords(earliest)} to ${dayWords(latest)} (a year either side of today, ${dayWords(today)})`,
    option,
  );
}
