/**
 * The shapes of a plan's pull list against the lots on hand as the API and `larder plan --json`
 * send them: types only, so the console can use them without loading the core.
 */

/**
 * Why a material of the plan is not compared with the lots on hand:
 * - no-item: no catalogue item names it (a cure's green meat, a line not yet in the catalogue);
 * - tap-water: the item is water, drawn from the tap, not received in lots;
 * - by-volume / by-count: the item is stocked by volume or by count, but a formula weighs it in
 *   grams, and the catalogue gives no weight per unit (`weighs:`) to turn one into the other.
 */
export type ApartReason = 'no-item' | 'tap-water' | 'by-volume' | 'by-count';

/** A weight as printed (rounded for the scale) and exact, in grams, as a string. */
export interface PresentedWeight {
  readonly amount: string;
  readonly grams: string;
}

/**
 * An amount of stock as printed ("1.5 kg", "1.45 l", "12 each") and exact in its measure (grams,
 * millilitres or pieces), as a string.
 */
export interface PresentedAmount {
  readonly amount: string;
  readonly exact: string;
}

/** One item of a plan's pull list against the lots on hand, ready to print or send. */
export interface PresentedPullLine {
  /** The catalogue item's key. */
  readonly item: string;
  /** The material as the formulas name it. */
  readonly name: string;
  /** What the amounts count: grams, millilitres, or pieces (an item stocked by count). */
  readonly measure: 'g' | 'ml' | 'each';
  /**
   * For an item stocked by count or volume, how the formulas' grams were turned into its
   * measure, in words ("at 50 g for one, whole pieces for each batch"); null for a weight.
   */
  readonly conversion: string | null;
  readonly needed: PresentedAmount;
  /** Every lot of it on hand now, whatever its use-by. */
  readonly onHand: PresentedAmount;
  /** What the plan's batches can take from those lots. */
  readonly usable: PresentedAmount;
  readonly short: PresentedAmount;
  readonly status: 'covered' | 'short';
  /** When short: the day more must arrive by, YYYY-MM-DD; null when covered. */
  readonly arriveBy: string | null;
  /** The same in words: "by the morning of Thu 10 Dec 2026, when Ham starts"; null when covered. */
  readonly arriveByWords: string | null;
  /** The latest delivery of the item: whom to ask; null when it was never received. */
  readonly lastFrom: { readonly supplier: string; readonly receivedOn: string } | null;
  /** Lots on hand that will be past their use-by before the plan can use them, in words. */
  readonly outOfDate: readonly string[];
  /** The formula ids that use it. */
  readonly usedBy: readonly string[];
}

/** A material not compared with stock, and why, in words. */
export interface PresentedApart {
  readonly name: string;
  readonly needed: PresentedWeight;
  readonly reason: ApartReason;
  readonly why: string;
  readonly usedBy: readonly string[];
}

/** A plan's pull list against the lots on hand, or why it could not be compared. */
export type PlanStock =
  | {
      readonly compared: true;
      /** The day the stock was read, YYYY-MM-DD (the plan's today). */
      readonly asOf: string;
      /** Short items first (the earliest day to arrive by first), then the covered ones by name. */
      readonly lines: readonly PresentedPullLine[];
      /** Materials not compared, by name. */
      readonly apart: readonly PresentedApart[];
      /** How the comparison is made, in words. */
      readonly note: string;
    }
  | { readonly compared: false; readonly reason: string };
