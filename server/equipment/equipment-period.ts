import type { Period } from './equipment-rows.ts';

/** The longest period one log shows: a year and a day. */
const MAX_DAYS = 366;
const DAY_MS = 86_400_000;
/** The period shown when none is asked for: the last week. */
const DEFAULT_DAYS = 7;

/**
 * One end of a period: an ISO date-time as given, or a date as the start (`from`) or the end
 * (`to`) of that day in the kitchen's time zone.
 */
function endOf(text: string, which: 'from' | 'to'): Date | null {
  if (/^\d{4}-\d{2}-\d{2}$/.test(text)) {
    const day = new Date(`${text}T00:00:00`);
    if (Number.isNaN(day.getTime())) return null;
    return which === 'from' ? day : new Date(day.getTime() + DAY_MS - 1);
  }
  if (!/^\d{4}-\d{2}-\d{2}T/.test(text)) return null;
  const at = new Date(text);
  return Number.isNaN(at.getTime()) ? null : at;
}

/**
 * The period of ?from&to (dates or date-times; the last week up to now by default), or what is
 * wrong with it in words.
 */
export function logPeriod(query: { from?: string; to?: string }, now: Date): Period | string {
  const to = query.to === undefined ? now : endOf(query.to, 'to');
  if (!to) return `“${query.to}” is not a date such as 2026-12-03`;
  const from =
    query.from === undefined
      ? new Date(to.getTime() - DEFAULT_DAYS * DAY_MS)
      : endOf(query.from, 'from');
  if (!from) return `“${query.from}” is not a date such as 2026-12-03`;
  if (from > to) return 'the period starts after it ends: give from before to';
  if (to.getTime() - from.getTime() > MAX_DAYS * DAY_MS)
    return `a log shows at most ${MAX_DAYS} days: ask for a shorter period`;
  return { from: from.toISOString(), to: to.toISOString() };
}
