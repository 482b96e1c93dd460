/**
 * Deliveries received and stock by lot, as /api/receipts and /api/stock answer and
 * `larder receive` and `larder stock --json` print: one definition for the server, the command
 * and the console (as types only).
 */
import type { PersonRef } from './batch-record.ts';
import type { Deviation } from './process-record.ts';
import type { ReceivedUnit } from '../stock/base-measure.ts';

/** What was done with a delivery at the door. */
export type ReceiptDecision = 'accepted' | 'accepted-with-action' | 'refused';

/**
 * The corrective action for a delivery taken in over its limit: the four things of 9 CFR
 * 417.3(a), as for any deviation.
 */
export interface ReceivingAction {
  readonly cause: string;
  readonly restored: string;
  readonly prevention: string;
  readonly disposition: 'rechilled' | 'reworked' | 'diverted' | 'discarded' | 'recooked';
  /** How much product, e.g. "4.2 kg"; needed when diverted or discarded. */
  readonly grams?: string;
}

/** POST /api/receipts: a delivery at the door. */
export interface ReceiptRequest {
  /** The catalogue item's key. */
  readonly item: string;
  readonly supplier: string;
  readonly supplierLot: string;
  /** The USDA mark of inspection's establishment number: needed for meat and poultry. */
  readonly establishment?: string;
  /** Pack or kill day, YYYY-MM-DD. */
  readonly packedOn?: string;
  /** Use-by, YYYY-MM-DD. */
  readonly useBy?: string;
  /** How much, as a decimal string, in `unit`. */
  readonly quantity: string;
  readonly unit: ReceivedUnit;
  /** Price per `unit`, decimal string, in the kitchen's money. */
  readonly unitCost?: string;
  /** The temperature read at the door, "4 °C", "39 °F". */
  readonly temperature?: string;
  /** The product is labelled and shipped frozen. */
  readonly shippedFrozen?: boolean;
  /** For a product shipped frozen: it arrived frozen solid. */
  readonly frozenSolid?: boolean;
  /**
   * What was done: needed when the delivery is over its limit (refuse it, or take it in with a
   * corrective action); "refuse" may also turn away a delivery within it (with a note saying why).
   */
  readonly decision?: 'refuse' | 'accept';
  readonly action?: ReceivingAction;
  readonly note?: string;
}

/** One lot received (or refused) at the door. */
export interface Receipt {
  readonly id: number;
  /** The kitchen's own code for the lot: "R261203-01". */
  readonly lotCode: string;
  readonly item: string;
  readonly itemName: string;
  readonly supplier: string;
  readonly supplierLot: string;
  readonly establishment: string | null;
  readonly packedOn: string | null;
  readonly useBy: string | null;
  /** As received: "40" in "lb". */
  readonly quantity: string;
  readonly unit: string;
  /** The same in the item's base measure (grams, millilitres or a count). */
  readonly amount: string;
  readonly remaining: string;
  /** g, ml or each. */
  readonly measure: 'g' | 'ml' | 'each';
  readonly unitCost: string | null;
  /** °C, exact decimal string, or null. */
  readonly temperatureC: string | null;
  readonly shippedFrozen: boolean;
  /** The receiving limit in words, its source, and what was found against it. */
  readonly limit: { readonly words: string; readonly source: string | null };
  readonly found: string;
  readonly decision: ReceiptDecision;
  readonly receivedAt: string;
  readonly receivedOn: string;
  readonly receivedBy: PersonRef | null;
  readonly note: string | null;
  readonly emptiedOn: string | null;
  /** The deviation a delivery taken in over its limit opened, with its corrective action. */
  readonly deviation: Deviation | null;
}

/** GET /api/receipts: a page of deliveries, newest first. */
export interface ReceiptPage {
  readonly receipts: readonly Receipt[];
  readonly total: number;
  readonly page: number;
  readonly pageSize: number;
}

/** One lot on hand in GET /api/stock. */
export interface StockLotView {
  readonly lotCode: string;
  readonly supplier: string;
  readonly supplierLot: string;
  /** What is left in the unit it came in ("31.5" lb) and in the base measure. */
  readonly remainingInUnit: string;
  readonly unit: string;
  readonly remaining: string;
  readonly useBy: string | null;
  /** Whole days from today to the use-by (0 on the day itself, negative past it). */
  readonly daysLeft: number | null;
  readonly expired: boolean;
  readonly receivedAt: string;
}

/** One item's stock on hand, its lots first to expire first (expired lots last, marked). */
export interface StockItemView {
  readonly item: string;
  readonly name: string;
  readonly measure: 'g' | 'ml' | 'each';
  /** What the usable lots hold together, base measure. */
  readonly onHand: string;
  readonly lots: readonly StockLotView[];
}

/** GET /api/stock. */
export interface StockView {
  /** The day the use-bys are counted from. */
  readonly today: string;
  readonly items: readonly StockItemView[];
}

/** A catalogue item as the receiving door shows it (GET /api/stock/items). */
export interface ReceivingItem {
  readonly key: string;
  /** The name its formula lines give it ("pork belly"), else its label name. */
  readonly name: string;
  readonly kind: string;
  /** The unit it is stocked in, and the units a delivery of it may be given in. */
  readonly unit: string;
  readonly units: readonly string[];
  /** Whether a delivery needs the establishment number (meat and poultry). */
  readonly establishment: boolean;
  /** Whether the door needs a reading (chilled goods and shell eggs). */
  readonly temperature: boolean;
  /** Its receiving limit, and the limit when it is shipped frozen. */
  readonly limit: { readonly words: string; readonly source: string | null };
  readonly frozenLimit: { readonly words: string; readonly source: string | null };
}
