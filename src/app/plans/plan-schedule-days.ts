import { daysBetween } from '../curing/days-left';
import type { PresentedPlan, PresentedPlanBatch } from './plan-types';

/** One start day of a plan with the batches that start on it. */
export interface ScheduleDay {
  /** YYYY-MM-DD. */
  readonly date: string;
  /** Whole days from this day to service (0 on the day of service). */
  readonly beforeService: number;
  readonly batches: readonly PresentedPlanBatch[];
}

/**
 * The plan day by day, earliest first: each start day with its batches, in the order the plan
 * lists them. A batch whose start day the plan's day list does not name still gets its own day,
 * so nothing is ever left off the schedule.
 */
export function scheduleOf(plan: PresentedPlan): ScheduleDay[] {
  const dates = new Set([...plan.days.map((day) => day.date), ...plan.batches.map((b) => b.start)]);
  return [...dates].sort().map((date) => ({
    date,
    beforeService: daysBetween(date, plan.serviceDate),
    batches: plan.batches.filter((batch) => batch.start === date),
  }));
}

/** How far a day is from service, in words: "On the day of service", "3 days before service". */
export function beforeServiceWords(days: number): string {
  if (days === 0) return 'On the day of service';
  if (days < 0) return `${-days} ${days === -1 ? 'day' : 'days'} after service`;
  return `${days} ${days === 1 ? 'day' : 'days'} before service`;
}
