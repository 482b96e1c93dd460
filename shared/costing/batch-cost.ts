/**
 * What a batch cost: each thing that went in, priced from the lot it came from (the price per
 * unit that lot was received at), from the earlier batch it was made from, or, where no lot was
 * recorded, at the item's latest price; then per finished kilogram and per portion through the
 * formula's yields (finished-weight.ts). Money is exact Decimal here; it is rounded only to show
 * it (shared/presentation/money.ts: to the cent, half-up).
 */
import { Decimal, ZERO, sum } from '../decimal.ts';
import type { ReceivedUnit } from '../stock/base-measure.ts';
import type { FinishedWeight } from './finished-weight.ts';
import { type BaseMeasure, costOfAmount } from './stock-measure.ts';

/** Where a line's price came from. */
export type CostSource = 'lot' | 'earlier-batch' | 'latest-price';

/** One thing that went into a batch, with its price if one is known. */
export interface CostInput {
  /** The material as the cook knows it: the item's name, or the formula line's. */
  readonly name: string;
  /** Its catalogue item, when it has one. */
  readonly item?: string;
  /** How much went in, in the item's base measure: grams, millilitres or a count. */
  readonly amount: Decimal;
  /** That base measure; grams when not said. */
  readonly measure?: BaseMeasure;
  readonly source: CostSource;
  /** The received lot or earlier batch it came from (lot and earlier-batch lines). */
  readonly lot?: string;
  /** Price per unit of `unit` (per kg, per lb, each…); absent when none is known. */
  readonly price?: { readonly perUnit: Decimal; readonly unit: ReceivedUnit };
  /** Why there is no price, in words, when there is none. */
  readonly unpriced?: string;
}

/** A line of the cost: its input and what it cost (null when it has no price). */
export interface CostedLine extends CostInput {
  readonly cost: Decimal | null;
}

/** The cost of one batch. */
export interface BatchCost {
  readonly lines: readonly CostedLine[];
  /** The priced lines added up: the whole cost only when {@link complete}. */
  readonly total: Decimal;
  /** Whether every line had a price. */
  readonly complete: boolean;
  /** Lines priced at their item's latest price because no lot was recorded for them. */
  readonly latestPriced: readonly string[];
  /** Lines with no price at all, with the reason. */
  readonly unpriced: readonly { readonly name: string; readonly reason: string }[];
  readonly finishedGrams: Decimal;
  /** How the finished weight was found, in words. */
  readonly finishedBasis: string;
  /**
   * total ÷ finished kilograms; null when the batch finishes at nothing or no line has a price
   * (a cost of 0.00 would say it cost nothing).
   */
  readonly perFinishedKg: Decimal | null;
  /** One portion's cost: total × portion ÷ the weight portions are cut from. */
  readonly portion: {
    readonly grams: Decimal;
    readonly count: number;
    readonly cost: Decimal;
  } | null;
}

const THOUSAND = new Decimal(1000);

/**
 * Prices the lines of a batch and spreads the total over its finished weight and portions. A
 * portion's cost is its share by weight of what it is cut from (the remainder is product too,
 * sold or used otherwise), so a dough's pieces carry its loss allowance only where the dough was
 * scaled up by one (finishedWeight counts only the pieces then).
 * derived: cost per kg = cost ÷ kg; a portion = cost × portion weight ÷ weight it is cut from
 */
export function batchCost(inputs: readonly CostInput[], weight: FinishedWeight): BatchCost {
  const lines: CostedLine[] = inputs.map((input) => ({
    ...input,
    cost: input.price ? costOfAmount(input.amount, input.price.unit, input.price.perUnit) : null,
  }));
  const total = sum(lines.map((line) => line.cost ?? ZERO));
  // With no line priced there is no cost to spread, rather than a cost of nothing.
  const priced = lines.some((line) => line.cost !== null);
  const portion = priced ? weight.portion : undefined;
  return {
    lines,
    total,
    complete: lines.every((line) => line.cost !== null),
    latestPriced: lines
      .filter((line) => line.source === 'latest-price' && line.cost !== null)
      .map((line) => line.name),
    unpriced: lines
      .filter((line) => line.cost === null)
      .map((line) => ({ name: line.name, reason: line.unpriced ?? 'no price known' })),
    finishedGrams: weight.finishedGrams,
    finishedBasis: weight.basis,
    perFinishedKg:
      priced && weight.finishedGrams.greaterThan(ZERO)
        ? total.div(weight.finishedGrams.div(THOUSAND))
        : null,
    portion:
      portion && portion.fromGrams.greaterThan(ZERO)
        ? {
            grams: portion.grams,
            count: portion.count,
            cost: total.times(portion.grams).div(portion.fromGrams),
          }
        : null,
  };
}

/** A plan's cost for a service: its batches' costs added up, and per unit served. */
export interface PlanCost {
  readonly total: Decimal;
  /** Whether every batch was priced in full. */
  readonly complete: boolean;
  /** total ÷ units served. */
  readonly perUnit: Decimal;
}

/**
 * The cost of a plan: the sum of its batches' costs (recorded batches from their lots, batches
 * not recorded yet at their items' latest prices), and that over the units it serves.
 * @throws RangeError for a count below 1
 */
export function planCost(batches: readonly BatchCost[], count: number): PlanCost {
  if (!Number.isInteger(count) || count < 1)
    throw new RangeError(`planCost: a plan serves at least 1 unit, not ${count}`);
  const total = sum(batches.map((batch) => batch.total));
  return {
    total,
    complete: batches.every((batch) => batch.complete),
    perUnit: total.div(count),
  };
}
