import { type Decimal, ZERO } from '../decimal.ts';
import { suggestLots, type StockLot } from './fifo.ts';

/** What one batch of a plan needs of an item, on the day it starts. */
export interface ItemUse {
  /** The batch's start day, YYYY-MM-DD: the day the item is used. */
  readonly start: string;
  /** How much, in the item's base measure (grams for a weight). */
  readonly amount: Decimal;
  /** The formula id of the batch. */
  readonly formula: string;
}

/** What a plan needs of one catalogue item, batch by batch. */
export interface ItemNeed {
  /** The catalogue item's key. */
  readonly item: string;
  /** The material as the formulas name it. */
  readonly name: string;
  readonly uses: readonly ItemUse[];
}

/** The latest delivery of an item taken in: whom to ask for more. */
export interface LastDelivery {
  readonly supplier: string;
  /** The day it was received, YYYY-MM-DD. */
  readonly receivedOn: string;
}

/** A lot on hand now that will be past its use-by on a day the plan would use it. */
export interface LotOutOfDate {
  readonly lot: string;
  readonly useBy: string;
  /** The start day of the first batch that could not use it. */
  readonly neededOn: string;
}

/** One item of a plan's pull list against the lots on hand. */
export interface PullLine {
  readonly item: string;
  readonly name: string;
  /** Everything the plan's batches need of it. */
  readonly needed: Decimal;
  /** Every lot of it on hand now, whatever its use-by. */
  readonly onHand: Decimal;
  /** What the batches can take from those lots, first to expire first, each on its start day. */
  readonly usable: Decimal;
  /** What the lots on hand cannot cover: needed − usable. */
  readonly short: Decimal;
  /**
   * When short: the start day of the first batch the lots cannot cover, by which more must
   * arrive, and that batch's formula id.
   */
  readonly arriveBy?: { readonly date: string; readonly formula: string };
  /** Lots on hand that will be past their use-by before the plan can use them. */
  readonly outOfDate: readonly LotOutOfDate[];
  /** The latest delivery of the item, if there ever was one. */
  readonly lastFrom?: LastDelivery;
}

/**
 * Compares a plan's needs with the lots on hand, item by item. Each item's batches are taken in
 * start-day order (the order given breaks a tie); each draws on what the earlier ones left,
 * first to expire first out on its own start day ({@link suggestLots}), so a lot past its use-by
 * on the day a batch starts does not count for that batch or any later one. The first batch the
 * lots cannot cover gives the day more must arrive by: its start day, delivered that morning
 * before the batch is made (no margin is added; a kitchen that wants a day in hand orders
 * earlier).
 * @param needs what the plan needs, in the items' base measures
 * @param lots every lot on hand (emptied and refused lots left out by the caller)
 * @param lastFrom the latest delivery of each item, by item key
 * @throws RangeError as suggestLots does, for a start day or use-by that is no date
 */
export function pullAgainstStock(
  needs: readonly ItemNeed[],
  lots: readonly StockLot[],
  lastFrom: ReadonlyMap<string, LastDelivery>,
): PullLine[] {
  return needs.map((need) => {
    // What is left of each lot of this item as the batches draw on them.
    let left: StockLot[] = lots.filter((lot) => lot.item === need.item);
    const onHand = left.reduce((sum, lot) => sum.plus(lot.remaining), ZERO);
    const uses = [...need.uses].sort((a, b) => a.start.localeCompare(b.start));
    let needed = ZERO;
    let short = ZERO;
    let arriveBy: PullLine['arriveBy'];
    const outOfDate = new Map<string, LotOutOfDate>();
    for (const use of uses) {
      const suggestion = suggestLots(left, need.item, use.amount, use.start);
      const taken = new Map(suggestion.takes.map(({ lot, take }) => [lot.lot, take]));
      left = left.map((lot) => {
        const take = taken.get(lot.lot);
        return take ? { ...lot, remaining: lot.remaining.minus(take) } : lot;
      });
      for (const lot of suggestion.expired) {
        if (!outOfDate.has(lot.lot) && lot.useBy !== undefined) {
          outOfDate.set(lot.lot, { lot: lot.lot, useBy: lot.useBy, neededOn: use.start });
        }
      }
      needed = needed.plus(use.amount);
      short = short.plus(suggestion.shortfall);
      if (arriveBy === undefined && suggestion.shortfall.greaterThan(ZERO)) {
        arriveBy = { date: use.start, formula: use.formula };
      }
    }
    const last = lastFrom.get(need.item);
    return {
      item: need.item,
      name: need.name,
      needed,
      onHand,
      usable: needed.minus(short),
      short,
      ...(arriveBy ? { arriveBy } : {}),
      outOfDate: [...outOfDate.values()],
      ...(last ? { lastFrom: last } : {}),
    };
  });
}
