/**
 * The lots suggested for a batch: first to expire first out for each item it needs, and for an
 * assembly's parts the earliest suitable batches of each part's formula. Pure.
 */
import type { BatchStatus } from '../api/batch-record.ts';
import { Decimal, ZERO } from '../decimal.ts';
import type { AssemblyFormula } from '../formula/formula-types.ts';
import type { BatchNeeds, ItemNeed } from './batch-needs.ts';
import { suggestLots, type LotTake, type StockLot } from './fifo.ts';
import type { PresentedResult } from '../presentation/presented-result.ts';

/** The lots suggested for one item. */
export interface ItemSuggestion {
  readonly need: ItemNeed;
  /** Lots to take from, in the order to use them, and how much of each (base measure). */
  readonly takes: readonly LotTake[];
  /** What the lots on hand cannot cover; null when the need is not known in the lots' measure. */
  readonly shortfall: Decimal | null;
  /** Lots of the item past their use-by on the day of use: not suggested, to be discarded. */
  readonly expired: readonly StockLot[];
}

/**
 * The lots suggested for each item a batch needs on its day of use (suggestLots: earliest use-by
 * first, lots past their use-by set apart). An item whose need is not known in its lots' measure
 * gets no takes, only its expired lots, so the cook picks and says how much.
 * @throws RangeError as suggestLots does (a day that is no date)
 */
export function suggestForNeeds(
  needs: BatchNeeds,
  lots: readonly StockLot[],
  useOn: string,
): ItemSuggestion[] {
  return needs.items.map((need) => {
    const fifo = suggestLots(lots, need.item, need.amount ?? ZERO, useOn);
    if (need.amount === null) return { need, takes: [], shortfall: null, expired: fifo.expired };
    return { need, takes: fifo.takes, shortfall: fifo.shortfall, expired: fifo.expired };
  });
}

/** The formulas an assembly's parts are made from, each once, in the order the assembly names them. */
export function assemblyParts(formula: AssemblyFormula): string[] {
  return [...new Set(formula.components.map((component) => component.formula))];
}

/**
 * What an assembly batch needs of each part, finished grams by the part's formula id, from the
 * parts its result lists (calculate-assembly.ts); none for a batch recorded without them.
 */
export function partNeeds(result: PresentedResult): Map<string, Decimal> {
  const needs = new Map<string, Decimal>();
  for (const line of result.groups.flatMap((group) => group.lines)) {
    if (line.part === undefined) continue;
    needs.set(line.part, (needs.get(line.part) ?? ZERO).plus(new Decimal(line.grams)));
  }
  return needs;
}

/** A batch that might be drawn on as a part of another. */
export interface SourceCandidate {
  readonly lotCode: string;
  readonly formulaId: string;
  readonly status: BatchStatus;
  /** Whether its process record has been verified and released. */
  readonly released: boolean;
  /** The day it was started (ISO date). */
  readonly startedOn: string;
}

/** Whether a batch is finished: done, or released after verification. */
function finished(batch: SourceCandidate): boolean {
  return batch.status === 'done' || batch.released;
}

/**
 * The batches of a part's formula a batch may draw on, best first: never a discarded one, nor
 * the batch itself, nor one started after the day of use; finished batches (done or released)
 * before those still under way, then the earliest started first (first in, first out, common
 * practice, no source), then by lot code.
 * @param self the lot code of the batch that draws on them
 * @param useOn the day of use (ISO date)
 */
export function sourceBatchOrder<T extends SourceCandidate>(
  candidates: readonly T[],
  formulaId: string,
  self: string,
  useOn: string,
): T[] {
  return candidates
    .filter(
      (batch) =>
        batch.formulaId === formulaId &&
        batch.status !== 'discarded' &&
        batch.lotCode !== self &&
        batch.startedOn <= useOn,
    )
    .sort(
      (a, b) =>
        Number(finished(b)) - Number(finished(a)) ||
        (a.startedOn < b.startedOn ? -1 : a.startedOn > b.startedOn ? 1 : 0) ||
        (a.lotCode < b.lotCode ? -1 : a.lotCode > b.lotCode ? 1 : 0),
    );
}
