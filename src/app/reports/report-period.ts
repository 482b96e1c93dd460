/** A report's period as the form holds it: days YYYY-MM-DD. */
export interface ReportPeriod {
  readonly from: string;
  readonly to: string;
}

/** A day YYYY-MM-DD of this machine's calendar. */
function localDay(date: Date): string {
  const pad = (n: number): string => String(n).padStart(2, '0');
  return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}`;
}

/** The period the server gives without one: the last 30 days, today included. */
export function lastThirtyDays(today: Date = new Date()): ReportPeriod {
  const from = new Date(today.getFullYear(), today.getMonth(), today.getDate() - 29);
  return { from: localDay(from), to: localDay(today) };
}

/**
 * What is wrong with a period, in words, or null when it can be asked for. The server checks it
 * again (a year at most; 400 otherwise).
 */
export function periodProblem({ from, to }: ReportPeriod): string | null {
  if (!from || !to) return 'Choose the first and the last day.';
  if (from > to) return 'The last day comes before the first.';
  return null;
}

/** The report's address in a format, for the period. */
export function reportUrl(format: 'pdf' | 'csv', { from, to }: ReportPeriod): string {
  return `/api/reports/haccp.${format}?${new URLSearchParams({ from, to })}`;
}
