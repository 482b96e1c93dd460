import type { ChartOptions } from 'chart.js';
import { dayMonthWords, dayWords } from '../../../../shared/presentation/date-words.ts';
import { CHART_GRID } from './chart-inks';

/** One day in milliseconds, a step of a chart's time axis. */
export const DAY_MS = 86_400_000;

/** A calendar day (YYYY-MM-DD) as milliseconds at its UTC midnight: days an equal step apart. */
export function dayMs(iso: string): number {
  const [year, month, day] = iso.split('-').map(Number);
  return Date.UTC(year, month - 1, day);
}

/**
 * A label of a chart's time axis, whose days are milliseconds at UTC midnight: "3 Dec", or
 * "3 Dec 2026" when the axis from `min` to `max` spans more than one year.
 */
export function axisDayWords(ms: number, min: number, max: number): string {
  const day = new Date(ms).toISOString().slice(0, 10);
  const oneYear = new Date(min).getUTCFullYear() === new Date(max).getUTCFullYear();
  return oneYear ? dayMonthWords(day) : dayWords(day);
}

/** A chart's axis, as chart.js takes it. */
type Axis = NonNullable<ChartOptions<'line'>['scales']>[string];

/**
 * The time axis of a chart of batches by day, to scale (a fortnight without batches is a gap, not
 * one step): from `min` to `max` (ms), titled, its ticks days in words, level.
 * @param ticks how the ticks are spaced: a step, or at most so many
 */
export function dayAxis(
  min: number,
  max: number,
  title: string,
  ticks: { readonly stepSize: number } | { readonly maxTicksLimit: number },
): Axis {
  return {
    type: 'linear',
    min,
    max,
    title: { display: true, text: title },
    grid: { color: CHART_GRID },
    ticks: {
      ...ticks,
      maxRotation: 0,
      callback: (value) => axisDayWords(Number(value), min, max),
    },
  };
}

/** A tooltip's title for a batch's point: "261203-QB-01 · 3 Dec 2026". */
export function lotDayTitle(point: { readonly lot: string; readonly day: string } | undefined) {
  return point ? `${point.lot} · ${dayWords(point.day)}` : '';
}
