import { addDays, daysBetween, isIsoDate } from '../../shared/calculation/dates.ts';
import { localDate } from '../reminders/reminder-schedule.ts';
import { RecordsError } from '../records/records-error.ts';
import type { SiteScope } from '../sites/site-scope.ts';

/** Days a report covers when no period is given: the last 30, today included. */
export const DEFAULT_DAYS = 30;
/** The longest period one report covers, days: a year, leap day included. */
export const MAX_DAYS = 366;

/** A report's period: days in the kitchen's time zone, and the instants they run between. */
export interface ReportPeriod {
  /** YYYY-MM-DD, both included. */
  readonly from: string;
  readonly to: string;
  /** ISO instants: local midnight starting `from`, and local midnight ending `to` (excluded). */
  readonly start: string;
  readonly end: string;
  /** The site whose records the report holds; none: every record (a single-site install). */
  readonly site?: SiteScope;
}

/** Local midnight (the server's time zone, TZ) starting a day, as an ISO instant. */
function midnight(day: string): string {
  const [year, month, date] = day.split('-').map(Number);
  return new Date(year, month - 1, date).toISOString();
}

function bad(message: string, option: string): RecordsError {
  return new RecordsError('bad-input', 'bad-period', message, [{ option }]);
}

/**
 * The period asked for: `from` and `to` as YYYY-MM-DD, both optional; without them the last
 * {@link DEFAULT_DAYS} days to today. Refuses a day that is not one, `to` before `from`, or more
 * than {@link MAX_DAYS} days.
 */
export function reportPeriod(query: { from?: unknown; to?: unknown }, now: Date): ReportPeriod {
  for (const option of ['from', 'to'] as const) {
    const value = query[option];
    if (value !== undefined && (typeof value !== 'string' || !isIsoDate(value)))
      throw bad(`${option} must be a day written YYYY-MM-DD`, option);
  }
  const to = (query.to as string | undefined) ?? localDate(now);
  const from = (query.from as string | undefined) ?? addDays(to, 1 - DEFAULT_DAYS);
  if (from > to) throw bad(`the period ends (${to}) before it begins (${from})`, 'to');
  if (daysBetween(from, to) + 1 > MAX_DAYS)
    throw bad(`a report covers at most ${MAX_DAYS} days; ask for a shorter period`, 'from');
  return { from, to, start: midnight(from), end: midnight(addDays(to, 1)) };
}
