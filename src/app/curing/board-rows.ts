import { flipDays } from '../../../shared/calculation/turn-days.ts';
import type { BatchListItem } from '../batches/batch-types';
import { holdingBatches, type HoldingBatch } from './days-left';

/** What a held batch asks of the kitchen today, most pressing first. */
export type DueToday = 'overdue' | 'ready' | 'turn' | null;

/** One card on the daily board: a held batch, how long it has left and what is due today. */
export interface BoardRow extends HoldingBatch<BatchListItem> {
  /** What is due today; null when nothing is. */
  readonly due: DueToday;
}

/** The board's two lists: cures (curing) and doughs (proofing), kept apart. */
export interface Board {
  /** Curing batches: those with something due today first (overdue, ready, to turn), then by ready day. */
  readonly curing: readonly BoardRow[];
  /** Proofing doughs, overdue first, then by ready day. */
  readonly proofing: readonly BoardRow[];
}

const RANK: Readonly<Record<Exclude<DueToday, null>, number>> = { overdue: 0, ready: 1, turn: 2 };

/**
 * Whether a curing batch is turned today: today is one of its turning days (its formula's rule
 * counted from its start, before its ready day), the same days the reminders are sent for.
 */
export function turnsToday(batch: BatchListItem, today: string): boolean {
  if (!batch.readyOn || !batch.flipEveryDays) return false;
  return flipDays({
    start: batch.startedOn,
    ready: batch.readyOn,
    flipEveryDays: batch.flipEveryDays,
  }).includes(today);
}

/**
 * The daily board from the held batches: each with what is due today, cures and doughs apart,
 * what is due first (overdue, ready today, to turn today), then the rest by ready day.
 * @param today the kitchen's calendar day, YYYY-MM-DD
 */
export function boardOf(batches: readonly BatchListItem[], today: string): Board {
  const rows = holdingBatches(batches, today).map((held): BoardRow => {
    const { batch } = held;
    const due: DueToday = held.overdue
      ? 'overdue'
      : held.daysLeft === 0
        ? 'ready'
        : batch.status === 'curing' && turnsToday(batch, today)
          ? 'turn'
          : null;
    return { ...held, due };
  });
  // holdingBatches' order (overdue, then by ready day) is kept within each rank: the sort is stable.
  const ranked = (list: BoardRow[]): BoardRow[] =>
    list.sort((a, b) => (a.due ? RANK[a.due] : 3) - (b.due ? RANK[b.due] : 3));
  return {
    curing: ranked(rows.filter((r) => r.batch.status === 'curing')),
    proofing: ranked(rows.filter((r) => r.batch.status === 'proofing')),
  };
}
