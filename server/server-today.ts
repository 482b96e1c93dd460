import type { AppContext } from './app-context.ts';

/**
 * Today on the server, YYYY-MM-DD in UTC (as start days and lot codes are counted), from the
 * context's clock, so that a test's clock moves the batch routes as it moves reminders.
 */
export function serverToday({ now }: Pick<AppContext, 'now'>): string {
  return now().toISOString().slice(0, 10);
}
