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

/** An ISO timestamp in words in this machine's time zone (the kitchen's), "3 Dec 2026, 14:05". */
export function momentInWords(moment: string): string {
  const date = new Date(moment);
  return Number.isNaN(date.getTime()) ? moment : MOMENT.format(date);
}

/** A formula kind as a sheet names it: "Cure". */
export function kindWords(kind: string): string {
  return kind.charAt(0).toUpperCase() + kind.slice(1);
}
