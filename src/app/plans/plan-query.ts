import { isFormulaId } from '../../../shared/formula/formula-id.ts';
import type { PlanRequest, PlanUnits } from './plan-types';

/** The most units one plan may serve (the API's limit). */
export const MAX_COUNT = 100_000;

/** A plan as the address bar holds it (?assembly=…&count=…&for=…&units=us); parts may be missing. */
export interface PlanQuery {
  readonly assembly: string | null;
  readonly count: number | null;
  /** The day of service, YYYY-MM-DD. */
  readonly for: string | null;
  readonly units: PlanUnits;
}

const DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/** Whether text is a real calendar day written YYYY-MM-DD (not 2026-02-30). */
export function isIsoDay(text: string): boolean {
  const match = DATE.exec(text);
  if (!match) return false;
  const [year, month, day] = match.slice(1).map(Number);
  const date = new Date(Date.UTC(year, month - 1, day));
  return (
    date.getUTCFullYear() === year && date.getUTCMonth() === month - 1 && date.getUTCDate() === day
  );
}

/**
 * Reads a plan from the address bar. What cannot be read is left out, so an old or hand-edited
 * link still opens the page with what it can use.
 */
export function planQueryFrom(params: Readonly<Record<string, string | undefined>>): PlanQuery {
  const assembly = params['assembly'];
  const count = params['count'];
  const day = params['for'];
  const number = count !== undefined && /^\d+$/.test(count) ? Number(count) : NaN;
  return {
    assembly: assembly !== undefined && isFormulaId(assembly) ? assembly : null,
    count: number >= 1 && number <= MAX_COUNT ? number : null,
    for: day !== undefined && isIsoDay(day) ? day : null,
    units: params['units'] === 'us' ? 'us' : 'metric',
  };
}

/** The address-bar parameters of a plan: metric units are the default and left out. */
export function paramsOfPlan(query: PlanQuery): Record<string, string | null> {
  return {
    assembly: query.assembly,
    count: query.count === null ? null : String(query.count),
    for: query.for,
    units: query.units === 'us' ? 'us' : null,
  };
}

/** The request for a plan, or null while the assembly, the count or the day is missing. */
export function requestOf(query: PlanQuery): PlanRequest | null {
  if (query.assembly === null || query.count === null || query.for === null) return null;
  return { assembly: query.assembly, count: query.count, for: query.for, units: query.units };
}

/** The calendar day `days` after a day (YYYY-MM-DD), across month and year ends. */
export function addDays(day: string, days: number): string {
  const [year, month, date] = day.split('-').map(Number);
  return new Date(Date.UTC(year, month - 1, date + days)).toISOString().slice(0, 10);
}

/** The file name of a plan's PDF, as the server names it: plan-smokehouse-burger-2026-12-18.pdf. */
export function pdfFileName(request: PlanRequest): string {
  return `plan-${request.assembly}-${request.for}.pdf`;
}
