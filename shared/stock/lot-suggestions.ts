/**
 * The lots suggested for a batch: first to expire first out for each item it needs, and for an
 * assembly's parts the earliest suitable batches of each part's formula. Pure.
 */
import type { BatchStatus } from '../api/batch-record.ts';
import { addDays } from '../calculation/dates.ts';
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
  /** The last day it may be used (ISO date), when it has one (see sourceUseBy). */
  readonly useBy?: string;
}

/** Whether a batch is finished: done, or released after verification. */
function finished(batch: SourceCandidate): boolean {
  return batch.status === 'done' || batch.released;
}

/** Whether a batch is past its use-by on a day of use: from the day after its use-by. */
function expiredOn(batch: SourceCandidate, useOn: string): boolean {
  // ISO dates compare as text in calendar order.
  return batch.useBy !== undefined && batch.useBy < useOn;
}

/** The batches of a part's formula that could have gone in: not discarded, not itself, not later. */
function partBatches<T extends SourceCandidate>(
  candidates: readonly T[],
  formulaId: string,
  self: string,
  useOn: string,
): T[] {
  return candidates.filter(
    (batch) =>
      batch.formulaId === formulaId &&
      batch.status !== 'discarded' &&
      batch.lotCode !== self &&
      batch.startedOn <= useOn,
  );
}

const byText = (a: string, b: string): number => (a < b ? -1 : a > b ? 1 : 0);

/**
 * The batches of a part's formula a batch may draw on, best first: never a discarded one, nor
 * the batch itself, nor one started after the day of use, nor one past its use-by on the day of
 * use (sourceBatchesExpired lists those); finished batches (done or released) before those still
 * under way; then first to expire first, as received lots are (fifo.ts), batches without a
 * use-by after those with one; then the earliest started first (first in, first out, common
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
  return partBatches(candidates, formulaId, self, useOn)
    .filter((batch) => !expiredOn(batch, useOn))
    .sort(
      (a, b) =>
        Number(finished(b)) - Number(finished(a)) ||
        Number(a.useBy === undefined) - Number(b.useBy === undefined) ||
        byText(a.useBy ?? '', b.useBy ?? '') ||
        byText(a.startedOn, b.startedOn) ||
        byText(a.lotCode, b.lotCode),
    );
}

/**
 * Days back from the day of use that a batch past its use-by is still named, to be discarded:
 * a week. No weight is kept for a batch, so one long past its use-by has most likely been used
 * up or thrown away; older ones are left unsaid (and never offered all the same). Our rule, no
 * source.
 */
export const EXPIRED_SOURCES_NAMED_DAYS = 7;

/**
 * The batches of a part's formula past their use-by on the day of use, earliest use-by first,
 * those whose use-by fell in the week before it (EXPIRED_SOURCES_NAMED_DAYS): set apart, as an
 * expired received lot is, to be discarded, never drawn on.
 * source: FDA Food Code 2022, 3-501.17(A): the date marked is the day "by which the food shall
 * be consumed on the premises, sold, or discarded" (quoted in shared/labels/date-mark.ts)
 */
export function sourceBatchesExpired<T extends SourceCandidate>(
  candidates: readonly T[],
  formulaId: string,
  self: string,
  useOn: string,
): T[] {
  const since = addDays(useOn, -EXPIRED_SOURCES_NAMED_DAYS);
  return partBatches(candidates, formulaId, self, useOn)
    .filter((batch) => expiredOn(batch, useOn) && batch.useBy! >= since)
    .sort((a, b) => byText(a.useBy!, b.useBy!) || byText(a.lotCode, b.lotCode));
}
