import { dayWords } from '../../../../shared/presentation/date-words.ts';
import type { FormulaCostPoint } from '../cost-api';

/** One batch on the cost chart. */
export interface CostPoint {
  readonly lot: string;
  /** The day the batch started, YYYY-MM-DD. */
  readonly day: string;
  /** Cost per finished kilogram, for drawing. */
  readonly perKg: number;
  /** The same to the cent, as the API rounded it. */
  readonly perKgText: string;
  /** Whether every line of the batch had a price. */
  readonly complete: boolean;
}

/** The points to draw: every batch with a cost per finished kilogram, oldest first. */
export function costPoints(points: readonly FormulaCostPoint[]): CostPoint[] {
  return points.flatMap((point) =>
    point.perFinishedKg === null || point.perFinishedKgText === null
      ? []
      : [
          {
            lot: point.lot,
            day: point.day,
            perKg: Number(point.perFinishedKg),
            perKgText: point.perFinishedKgText,
            complete: point.complete,
          },
        ],
  );
}

/** The chart in one sentence, for people who cannot see it. */
export function costSummary(points: readonly CostPoint[]): string {
  if (points.length === 0) return 'No batches of this formula have a cost yet.';
  const first = points[0];
  const last = points[points.length - 1];
  const texts = [...points].sort((a, b) => a.perKg - b.perKg).map((p) => p.perKgText);
  const part = points.filter((p) => !p.complete).length;
  const partWords =
    part === 0 ? '' : ` ${part === 1 ? '1 batch is' : `${part} batches are`} priced in part only.`;
  if (points.length === 1)
    return `One batch, on ${dayWords(first.day)}: ${first.perKgText} a finished kg.${partWords}`;
  return (
    `${points.length} batches from ${dayWords(first.day)} to ${dayWords(last.day)}: ` +
    `${texts[0]} to ${texts[texts.length - 1]} a finished kg, the latest ${last.perKgText}.${partWords}`
  );
}
