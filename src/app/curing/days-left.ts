import type { BatchSummary } from '../batches/batch-types';

/** A batch that is curing or proofing, with how long it has to go. */
export interface HoldingBatch<T extends BatchSummary = BatchSummary> {
  readonly batch: T;
  /** Days until the ready date (negative when overdue); null when it has none. */
  readonly daysLeft: number | null;
  /** Whether the ready date is before today. */
  readonly overdue: boolean;
}

const DAY_MS = 86_400_000;

/** Whole days from one calendar day (YYYY-MM-DD) to another; negative when `to` is earlier. */
export function daysBetween(from: string, to: string): number {
  const utc = (iso: string): number => {
    const [year, month, day] = iso.split('-').map(Number);
    return Date.UTC(year, month - 1, day);
  };
  return Math.round((utc(to) - utc(from)) / DAY_MS);
}

/**
 * Whether a batch is overdue: still curing or proofing after its ready day (as the API's
 * overdueOn filter counts it).
 * @param today the local calendar day, YYYY-MM-DD
 */
export function isOverdue(batch: Pick<BatchSummary, 'status' | 'readyOn'>, today: string): boolean {
  const held = batch.status === 'curing' || batch.status === 'proofing';
  return held && batch.readyOn !== null && batch.readyOn < today;
}

/**
 * The holding batches in the order to look at them: overdue first (longest overdue first), then
 * by ready date, then those with no ready date (such as proofing doughs).
 * @param today the local calendar day, YYYY-MM-DD
 */
export function holdingBatches<T extends BatchSummary>(
  batches: readonly T[],
  today: string,
): HoldingBatch<T>[] {
  return batches
    .map((batch) => {
      const daysLeft = batch.readyOn ? daysBetween(today, batch.readyOn) : null;
      return { batch, daysLeft, overdue: daysLeft !== null && daysLeft < 0 };
    })
    .sort((a, b) => {
      if (a.daysLeft === null || b.daysLeft === null)
        return a.daysLeft === b.daysLeft ? 0 : a.daysLeft === null ? 1 : -1;
      return a.daysLeft - b.daysLeft;
    });
}

/** How long a batch has to go, in words: "Overdue by 2 days", "Ready today", "3 days left". */
export function daysLeftWords(daysLeft: number | null): string {
  if (daysLeft === null) return 'No ready date';
  if (daysLeft === 0) return 'Ready today';
  const days = (n: number): string => (n === 1 ? '1 day' : `${n} days`);
  return daysLeft < 0 ? `Overdue by ${days(-daysLeft)}` : `${days(daysLeft)} left`;
}
