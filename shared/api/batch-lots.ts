/**
 * What a batch was made from, as GET and POST /api/batches/:lot/lots answer: the lots it used, or
 * the lots suggested first to expire first out. Types only, for the server and the console.
 */
import type { StockUnit } from '../catalogue/catalogue-types.ts';
import type { BaseMeasure } from '../stock/base-measure.ts';

/** One lot a batch drew on, recorded or suggested. */
export interface LotUseView {
  /** A received lot, or an earlier batch (an assembly's part). */
  readonly source: 'receipt' | 'batch';
  /** The catalogue item's key, or the part's formula id for a batch. */
  readonly item: string;
  /** The item's name as the catalogue gives it, or the part formula's title. */
  readonly itemName: string;
  /** The kitchen's lot code: the receipt's (R261203-01) or the batch's (261203-CG-01). */
  readonly lotCode: string;
  readonly supplier: string | null;
  readonly supplierLot: string | null;
  /** The amount in the base measure, exact. */
  readonly amount: string;
  readonly measure: BaseMeasure;
  /** The same in the unit the lot came in, exact ("2.5" kg), and that unit. */
  readonly lotAmount: string;
  readonly lotUnit: StockUnit | null;
  /** The lot's use-by (ISO date), when it has one: a batch's is worked out from its formula. */
  readonly useBy: string | null;
  /** The day of use (ISO date). */
  readonly usedOn: string;
}

/** A lot on hand that a line could be changed to. */
export interface LotOnHand {
  readonly lotCode: string;
  readonly supplier: string | null;
  readonly supplierLot: string | null;
  /** What is left, base measure, exact; null for a batch (its weight is not kept as stock). */
  readonly remaining: string | null;
  /** The last day it may be used (ISO date): the supplier's, or a batch's worked out from its formula. */
  readonly useBy: string | null;
  /** A batch: the day it was marked done (ISO date), or null while it is under way. */
  readonly madeOn?: string | null;
  /** A batch with no use-by: why, in a cook's words ("not ready to eat: …"). */
  readonly noUseBy?: string;
}

/** What the batch needs of one item, and the lots suggested for it. */
export interface SuggestedItem {
  /** The catalogue item's key, or the part's formula id. */
  readonly item: string;
  readonly name: string;
  /** 'receipt' for a catalogue item, 'batch' for an assembly's part. */
  readonly source: 'receipt' | 'batch';
  readonly unit: StockUnit | null;
  readonly measure: BaseMeasure;
  /**
   * The need in the base measure; null when the cook must say how much (bought by the each or by
   * volume, with no weight per unit in the catalogue).
   */
  readonly need: string | null;
  /** What the batch's lines weigh of it, in grams; null for an assembly's part. */
  readonly grams: string | null;
  /**
   * The catalogue's weight per unit the grams were turned by ("50 g" for one, "244 g per cup"),
   * for an item bought by the each or by volume; null otherwise.
   */
  readonly weighs: string | null;
  /** Whether the need is what was weighed, not the calculation. */
  readonly weighed: boolean;
  /** The lots suggested, in the order to use them; none once lots are recorded. */
  readonly takes: readonly LotUseView[];
  /** What the lots on hand cannot cover, base measure; null when the need is not known. */
  readonly shortfall: string | null;
  /**
   * Lots of the item past their use-by on the day of use, to be discarded; for an assembly's
   * part, its batches whose use-by fell in the week before.
   */
  readonly expired: readonly LotOnHand[];
  /** Every usable lot of the item on hand on the day of use, first to expire first. */
  readonly onHand: readonly LotOnHand[];
}

/** GET /api/batches/:lot/lots. */
export interface BatchLots {
  readonly lotCode: string;
  /** The day of use: the day the batch was started (ISO date). */
  readonly usedOn: string;
  /** The lots recorded as used; empty until recorded. */
  readonly uses: readonly LotUseView[];
  /** What the batch needs, per item, with the lots on hand; the suggested takes only until lots are recorded. */
  readonly suggested: readonly SuggestedItem[];
  /** Lines of the batch with no catalogue item: they cannot draw on stock. */
  readonly notInCatalogue: readonly { readonly name: string; readonly grams: string }[];
  /** Whether the batch may record lots now (a planned batch has used nothing yet). */
  readonly canRecord: boolean;
}

/** One lot picked: a received lot of an item, or a batch for an assembly's part. */
export type LotPick =
  | { readonly item: string; readonly lot: string; readonly amount: string }
  | { readonly part: string; readonly batch: string; readonly amount: string };

/** POST /api/batches/:lot/lots: accept the suggestion, or give the lots; replace to record again. */
export interface LotUsesRequest {
  readonly accept?: boolean;
  readonly picks?: readonly LotPick[];
  readonly replace?: boolean;
}
