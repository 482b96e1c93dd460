import { dayWords, momentWords } from '../../shared/presentation/date-words.ts';

/** A calendar day YYYY-MM-DD in words, "2 Dec 2026", the same in every time zone. */
export function dayInWords(day: string): string {
  return dayWords(day);
}

/** A calendar day without its year, "2 Dec", where the year is printed close by. */
export function shortDayInWords(day: string): string {
  return dayWords(day).replace(/ \d{4}$/, '');
}

/** Moments already put in words: a report names the same times again and again. */
const moments = new Map<string, string>();
/** Kept short of growing without end over a long-running server's many sheets. */
const MOMENTS_MOST = 10_000;

/** An ISO timestamp in words in this machine's time zone (the kitchen's), "3 Dec 2026, 14:05". */
export function momentInWords(moment: string): string {
  const known = moments.get(moment);
  if (known !== undefined) return known;
  const words = momentWords(moment);
  if (moments.size >= MOMENTS_MOST) moments.clear();
  moments.set(moment, words);
  return words;
}

/** A formula kind as a sheet names it: "Cure". */
export function kindWords(kind: string): string {
  return kind.charAt(0).toUpperCase() + kind.slice(1);
}
