// The shapes of trace back, trace forward and the recall report, as the API sends them and the
// command and the console read them. Amounts are exact Decimal text in the item's base measure.

/** The measure a lot's amounts are kept in: grams, millilitres or a count. */
export type LotMeasure = 'g' | 'ml' | 'each';

/** A lot received at the door, as a trace shows it. */
export interface TracedReceipt {
  readonly kind: 'receipt';
  /** The kitchen's own code for the lot, "R261203-01". */
  readonly lotCode: string;
  /** The catalogue item and its name. */
  readonly item: string;
  readonly itemName: string;
  readonly supplier: string;
  readonly supplierLot: string;
  /** The establishment number on inspected meat and poultry. */
  readonly establishment: string | null;
  readonly packedOn: string | null;
  readonly useBy: string | null;
  readonly receivedOn: string;
  /** How much came in, in its measure, and what is left of it. */
  readonly amount: string;
  readonly remaining: string;
  readonly measure: LotMeasure;
  /** The day it was used up or discarded; null while some is on hand. */
  readonly emptiedOn: string | null;
  readonly decision: 'accepted' | 'accepted-with-action' | 'refused';
  /** The key of the site it was received at; only on an install with several sites. */
  readonly site?: string;
}

/** A batch, as a trace shows it. */
export interface TracedBatch {
  readonly kind: 'batch';
  readonly lotCode: string;
  readonly formula: { readonly id: string; readonly title: string };
  readonly status: string;
  readonly startedOn: string;
  readonly readyOn: string | null;
  /** The day of service it was recorded for, when it was recorded from a plan. */
  readonly serviceDay: string | null;
  /** The key of the site it was made at; only on an install with several sites. */
  readonly site?: string;
}

/** A lot of either kind. */
export type TracedLot = TracedReceipt | TracedBatch;

/** How much of a lot a batch drew on, and when. */
export interface LotUse {
  readonly item: string;
  readonly amount: string;
  readonly measure: LotMeasure;
  readonly usedOn: string;
}

/** Why a branch of a trace stops where it does. */
export type TraceCut =
  /** The lot was shown in full higher up the tree: not repeated. */
  | 'shown-above'
  /** The lot is among its own ingredients (a record in error): the loop is not followed. */
  | 'cycle'
  /** The branch goes deeper than a trace follows. */
  | 'depth';

/** One lot of a trace tree, with the use that links it to its parent and its own branches. */
export interface TraceNode {
  readonly lot: TracedLot;
  /** The use joining this node to its parent (the parent's use of it going back, its use of the
   *  parent going forward); absent at a root. */
  readonly use?: LotUse;
  /** How many levels below the root. */
  readonly level: number;
  readonly children: readonly TraceNode[];
  readonly cut?: TraceCut;
  /**
   * How much, per measure, the links of this lot to lots at sites of the group the asker has no
   * role at come to: those lots are neither named nor followed. Absent when there are none.
   */
  readonly elsewhere?: readonly LotAmount[];
}

/** An amount in a measure. */
export interface LotAmount {
  readonly amount: string;
  readonly measure: LotMeasure;
}

/** What a trace or recall searched for. */
export type TraceSearch =
  { readonly lot: string } | { readonly supplierLot: string; readonly supplier?: string };

/** A trace one way: its roots (a batch, the lot asked for, or every receipt of a supplier lot). */
export interface TraceAnswer {
  readonly direction: 'back' | 'forward';
  readonly searched: TraceSearch;
  readonly roots: readonly TraceNode[];
  /** The distinct batches the tree reaches below its roots. */
  readonly batches: number;
  /** Some branch was cut at the deepest level a trace follows, or at a loop. */
  readonly incomplete: boolean;
}

/** An affected batch of a recall, once, with every use that links it to the recalled lot. */
export interface RecallBatch extends TracedBatch {
  /** The fewest levels below the recalled lot. */
  readonly level: number;
  readonly uses: readonly (LotUse & { readonly from: string })[];
}

/** What of the recall is still in the kitchen. */
export interface RecallOnHand {
  /** Recalled received lots not used up: how much is left. */
  readonly lots: readonly {
    readonly lotCode: string;
    readonly remaining: string;
    readonly measure: LotMeasure;
  }[];
  /** Affected batches still being made, or ready for a service still to come. */
  readonly batches: readonly string[];
}

/** The recall report of a supplier lot or a batch. */
export interface RecallReport {
  readonly kitchen: string;
  readonly searched: TraceSearch;
  readonly producedBy: string;
  readonly producedAt: string;
  /** The lots recalled: every receipt of the supplier lot, or the lot asked for. */
  readonly recalled: readonly TracedLot[];
  /** Every batch reached from them, nearest first, then by start day. */
  readonly batches: readonly RecallBatch[];
  readonly totals: {
    readonly batches: number;
    /** Affected batches by status. */
    readonly byStatus: Readonly<Record<string, number>>;
    /** Received, used directly by batches, and left, per measure of the recalled receipts. */
    readonly received: readonly { readonly amount: string; readonly measure: LotMeasure }[];
    readonly used: readonly { readonly amount: string; readonly measure: LotMeasure }[];
    /**
     * Used straight from the recalled lots by batches at sites the asker has no role at, per
     * measure; absent when none was.
     */
    readonly usedElsewhere?: readonly LotAmount[];
  };
  /**
   * Present when some of the recall went to a site of the group the asker has no role at, at any
   * level: what to do about it. Those lots are not named.
   */
  readonly elsewhere?: string;
  readonly onHand: RecallOnHand;
  /** The tree forward from the recalled lots. */
  readonly tree: TraceAnswer;
  /** That a recall follows the kitchen's recall plan and the regulator's instructions. */
  readonly caution: string;
}
