import { dayWords } from '../../../../shared/presentation/date-words.ts';
import type { BatchListItem } from '../batch-types';

/** One recorded cure batch on the nitrite chart. */
export interface NitritePoint {
  readonly lot: string;
  /** Day it was recorded on the kitchen's calendar (the browser's zone), YYYY-MM-DD. */
  readonly day: string;
  /** Ingoing sodium nitrite, ppm of green weight, for drawing. */
  readonly ppm: number;
  /** The same, to 0.1 ppm as the batch sheet prints it. */
  readonly ppmText: string;
  /** The ceiling the batch was checked against, ppm; null when the batch has no such check. */
  readonly limit: number | null;
  /** Whether the batch was over its ceiling (a limit raised or lowered since it was recorded). */
  readonly over: boolean;
}

/** The calendar day a moment falls on in the browser's zone (the kitchen's), YYYY-MM-DD. */
function kitchenDay(iso: string): string {
  const at = new Date(iso);
  const two = (n: number): string => String(n).padStart(2, '0');
  return `${at.getFullYear()}-${two(at.getMonth() + 1)}-${two(at.getDate())}`;
}

/**
 * The points of the chart: each batch with an ingoing nitrite figure, oldest first as listed,
 * with the ceiling of its own 'nitrite-max' check (limits are data and may differ by revision).
 */
export function nitritePoints(batches: readonly BatchListItem[]): NitritePoint[] {
  const points: NitritePoint[] = [];
  for (const batch of batches) {
    if (batch.nitritePpm === null) continue;
    const ppm = Number(batch.nitritePpm);
    if (!Number.isFinite(ppm)) continue;
    const check = batch.nitriteMax;
    const limit = check ? Number.parseFloat(check.limit) : Number.NaN;
    const hasLimit = Number.isFinite(limit);
    points.push({
      lot: batch.lotCode,
      day: kitchenDay(batch.recordedAt),
      ppm,
      ppmText: `${ppm.toFixed(1)} ppm`,
      limit: hasLimit ? limit : null,
      // The batch's own check compared the exact value; its verdict is the authority.
      over: check?.status === 'fail',
    });
  }
  return points;
}

/**
 * The chart in one sentence, for people who cannot see it: how many batches, the range, the
 * limit, and whether any went over it.
 */
export function nitriteSummary(points: readonly NitritePoint[], title: string): string {
  if (points.length === 0) return `No recorded batches of ${title} yet.`;
  const values = points.map((p) => p.ppm);
  const low = Math.min(...values).toFixed(1);
  const high = Math.max(...values).toFixed(1);
  const limits = [...new Set(points.map((p) => p.limit).filter((l): l is number => l !== null))];
  const over = points.filter((p) => p.over).length;
  const count = points.length === 1 ? '1 batch' : `${points.length} batches`;
  const span =
    points.length === 1
      ? `on ${dayWords(points[0].day)}: ${points[0].ppmText}`
      : `from ${dayWords(points[0].day)} to ${dayWords(points[points.length - 1].day)}: ${low} to ${high} ppm`;
  const limitWords =
    limits.length === 0
      ? 'no limit recorded'
      : limits.length === 1
        ? `limit ${limits[0]} ppm`
        : `limits ${limits.join(', ')} ppm`;
  const overWords = over === 0 ? 'none over the limit' : `${over} over the limit`;
  return `Ingoing nitrite of ${title}, ${count} ${span}; ${limitWords}; ${overWords}.`;
}
