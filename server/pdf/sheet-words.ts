const DAY = new Intl.DateTimeFormat('en-GB', {
  day: 'numeric',
  month: 'short',
  year: 'numeric',
  timeZone: 'UTC',
});
const MOMENT = new Intl.DateTimeFormat('en-GB', {
  day: 'numeric',
  month: 'short',
  year: 'numeric',
  hour: '2-digit',
  minute: '2-digit',
});

/** A calendar day YYYY-MM-DD in words, "2 Dec 2026", the same in every time zone. */
export function dayInWords(day: string): string {
  const [year, month, date] = day.split('-').map(Number);
  return DAY.format(new Date(Date.UTC(year, month - 1, date)));
}

/** Moments already put in words: a report names the same times again and again. */
const moments = new Map<string, string>();
/** Kept short of growing without end over a long-running server's many sheets. */
const MOMENTS_MOST = 10_000;

/** An ISO timestamp in words in this machine's time zone (the kitchen's), "3 Dec 2026, 14:05". */
export function momentInWords(moment: string): string {
  const known = moments.get(moment);
  if (known !== undefined) return known;
  const date = new Date(moment);
  const words = Number.isNaN(date.getTime()) ? moment : MOMENT.format(date);
  if (moments.size >= MOMENTS_MOST) moments.clear();
  moments.set(moment, words);
  return words;
}

/** A formula kind as a sheet names it: "Cure". */
export function kindWords(kind: string): string {
  return kind.charAt(0).toUpperCase() + kind.slice(1);
}
