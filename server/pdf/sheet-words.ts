import { dayWords, momentWords } from '../../shared/presentation/date-words.ts';

/** A calendar day YYYY-MM-DD in words, "2 Dec 2026", the same in every time zone. */
export function dayInWords(day: string): string {
  return dayWords(day);
}

/** An ISO timestamp in words in this machine's time zone (the kitchen's), "3 Dec 2026, 14:05". */
export function momentInWords(moment: string): string {
  return momentWords(moment);
}

/** A formula kind as a sheet names it: "Cure". */
export function kindWords(kind: string): string {
  return kind.charAt(0).toUpperCase() + kind.slice(1);
}
