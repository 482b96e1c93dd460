import { isIsoDate } from '../calculation/dates.ts';
import { type Decimal, ZERO } from '../decimal.ts';

/** A lot of one catalogue item on hand. */
export interface StockLot {
  /** The catalogue item it is a lot of. */
  readonly item: string;
  /** The lot's code. */
  readonly lot: string;
  /** How much is left, in the item's own unit (grams inside for a weight). */
  readonly remaining: Decimal;
  /** The last day the lot may be used (ISO date); absent for goods that carry none. */
  readonly useBy?: string;
  /** When it was received: an ISO date-time with its offset, "2026-12-01T07:30:00Z". */
  readonly receivedAt: string;
}

/** How much to take from one lot. */
export interface LotTake {
  readonly lot: StockLot;
  readonly take: Decimal;
}

/** The lots suggested for a need, first to expire first out. */
export interface FifoSuggestion {
  /** Lots to take from, in the order to use them, and how much of each. */
  readonly takes: readonly LotTake[];
  /** What the usable lots cannot cover; zero when they cover it all. */
  readonly shortfall: Decimal;
  /** Lots of the item past their use-by on the day of use: not suggested, to be discarded. */
  readonly expired: readonly StockLot[];
}

/** The instant a lot was received, for ordering. */
function receivedInstant(lot: StockLot): number {
  const instant = Date.parse(lot.receivedAt);
  if (Number.isNaN(instant)) {
    throw new RangeError(`suggestLots: lot ${lot.lot} was received at ${lot.receivedAt}, no time`);
  }
  return instant;
}

/**
 * First to expire, first out: the earliest use-by first; lots without a use-by after all that
 * have one; the same use-by (or none) in the order received. Each lot's original place breaks
 * what is left of a tie.
 */
function firstToExpire(a: StockLot, b: StockLot): number {
  if (a.useBy !== b.useBy) {
    if (a.useBy === undefined) return 1;
    if (b.useBy === undefined) return -1;
    return a.useBy < b.useBy ? -1 : 1;
  }
  return receivedInstant(a) - receivedInstant(b);
}

/**
 * Suggests the lots of an item to take a needed quantity from on a day of use, first to expire
 * first out, and says what the lots on hand cannot cover.
 *
 * A lot is usable through its use-by day and expired from the day after: the date marked is the
 * day "by which the food shall be consumed on the premises, sold, or discarded" (FDA Food Code
 * 2022, 3-501.17(A), as adopted in Virginia, 12VAC5-421-830 A), and food past it is discarded
 * (Food Code 3-501.18, from memory). For a supplier's use-by on raw materials the same reading is
 * common practice, no source. Expired lots are listed apart so the cook can discard them; lots
 * with nothing left are passed over.
 * @param lots every lot on hand (of any item; only the item's own are used)
 * @param item the catalogue item needed
 * @param needed how much, in the lots' unit
 * @param useOn the day of use (ISO date)
 * @throws RangeError for a negative need, a day of use or use-by that is no date, or a lot
 *   without a readable time of receipt
 */
export function suggestLots(
  lots: readonly StockLot[],
  item: string,
  needed: Decimal,
  useOn: string,
): FifoSuggestion {
  if (needed.lessThan(ZERO)) throw new RangeError(`suggestLots: a need of ${needed} is negative`);
  if (!isIsoDate(useOn)) throw new RangeError(`suggestLots: ${useOn} is not a calendar date`);
  const own = lots.filter((lot) => lot.item === item && lot.remaining.greaterThan(ZERO));
  for (const lot of own) {
    if (lot.useBy !== undefined && !isIsoDate(lot.useBy)) {
      throw new RangeError(`suggestLots: lot ${lot.lot} has a use-by of ${lot.useBy}, no date`);
    }
    receivedInstant(lot);
  }
  // ISO dates compare as text in calendar order.
  const expired = own.filter((lot) => lot.useBy !== undefined && lot.useBy < useOn);
  const usable = own.filter((lot) => !expired.includes(lot)).sort(firstToExpire);
  const takes: LotTake[] = [];
  let left = needed;
  for (const lot of usable) {
    if (left.isZero()) break;
    const take = lot.remaining.lessThan(left) ? lot.remaining : left;
    takes.push({ lot, take });
    left = left.minus(take);
  }
  return { takes, shortfall: left, expired: [...expired].sort(firstToExpire) };
}
