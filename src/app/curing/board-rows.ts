import { turnOwedSince } from '../../../shared/calculation/turn-days.ts';
import type { BatchListItem } from '../batches/batch-types';
import { holdingBatches, type HoldingBatch } from './days-left';

/** What a held batch asks of the kitchen today, most pressing first. */
export type DueToday = 'overdue' | 'ready' | 'turn' | null;

/** One card on the daily board: a held batch, how long it has left and what is due today. */
export interface BoardRow extends HoldingBatch<BatchListItem> {
  /** What is due today; null when nothing is. */
  readonly due: DueToday;
  /** Its turning: a turn owed, or today's turn done. */
  readonly turn: BoardTurn;
}

/** The board's two lists: cures (curing) and doughs (proofing), kept apart. */
export interface Board {
  /** Curing batches: those with something due today first (overdue, ready, a turn owed), then by ready day. */
  readonly curing: readonly BoardRow[];
  /** Proofing doughs, overdue first, then by ready day. */
  readonly proofing: readonly BoardRow[];
}

const RANK: Readonly<Record<Exclude<DueToday, null>, number>> = { overdue: 0, ready: 1, turn: 2 };

/** A curing batch's turning as the board shows it. */
export interface BoardTurn {
  /** The turning day a turn is owed since (today, or a day missed before it); null when none is. */
  readonly owedSince: string | null;
  /** Today's turn, when one is recorded today; else null. */
  readonly turnedToday: BatchListItem['lastTurn'];
}

/**
 * A curing batch's turning on `today`: a turn is owed since the latest turning day on or before
 * today (its formula's rule counted from its start, before its ready day — the days the reminders
 * are sent for) when no turn is recorded on or after it; and today's turn, when there is one.
 */
export function turnOf(batch: BatchListItem, today: string): BoardTurn {
  const last = batch.status === 'curing' ? batch.lastTurn : null;
  const owedSince =
    batch.status === 'curing' && batch.readyOn && batch.flipEveryDays
      ? turnOwedSince(
          { start: batch.startedOn, ready: batch.readyOn, flipEveryDays: batch.flipEveryDays },
          last?.on ?? null,
          today,
        )
      : null;
  return { owedSince, turnedToday: last?.on === today ? last : null };
}

/**
 * The daily board from the held batches: each with what is due today, cures and doughs apart,
 * what is due first (overdue, ready today, a turn owed), then the rest by ready day.
 * @param today the kitchen's calendar day, YYYY-MM-DD
 */
export function boardOf(batches: readonly BatchListItem[], today: string): Board {
  const rows = holdingBatches(batches, today).map((held): BoardRow => {
    const turn = turnOf(held.batch, today);
    const due: DueToday = held.overdue
      ? 'overdue'
      : held.daysLeft === 0
        ? 'ready'
        : turn.owedSince
          ? 'turn'
          : null;
    return { ...held, due, turn };
  });
  // holdingBatches' order (overdue, then by ready day) is kept within each rank: the sort is stable.
  const ranked = (list: BoardRow[]): BoardRow[] =>
    list.sort((a, b) => (a.due ? RANK[a.due] : 3) - (b.due ? RANK[b.due] : 3));
  return {
    curing: ranked(rows.filter((r) => r.batch.status === 'curing')),
    proofing: ranked(rows.filter((r) => r.batch.status === 'proofing')),
  };
}
