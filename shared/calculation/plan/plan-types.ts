import type { Decimal } from '../../decimal.ts';
import type { Allergen, BatchKind } from '../../formula/formula-types.ts';
import type { RawBatchOptions } from '../batch-input.ts';
import type { CalcResult, Caution } from '../calc-result.ts';

/** What to plan: how many units, for which service day, planned on which day. */
export interface PlanOptions {
  /** Units of the assembly to serve (plates, sandwiches): a whole number of at least 1. */
  readonly count: number;
  /** The day of service, YYYY-MM-DD. */
  readonly serviceDate: string;
  /** Today, YYYY-MM-DD: no sub-batch may start before it. */
  readonly today: string;
}

/** A part a batch is applied to (a rub on a brisket), and the day it goes on. */
export interface AppliedPart {
  readonly formula: { readonly id: string; readonly title: string };
  /** The day it goes on, YYYY-MM-DD: when that part comes out of its hold. */
  readonly date: string;
}

/** One batch the plan needs: one per formula, however many components name it. */
export interface PlanBatch {
  readonly formula: { readonly id: string; readonly title: string; readonly kind: BatchKind };
  /** What the batch is for, in words: one line per component that needs it. */
  readonly purposes: readonly string[];
  /** The batch as `larder calc` and POST /api/batches take it: options as text with units. */
  readonly batch: RawBatchOptions;
  /** The full result of the kind's own calculator for that batch. */
  readonly result: CalcResult;
  /** The day the batch starts, YYYY-MM-DD. */
  readonly start: string;
  /** The day it is ready: the end of a cure's hold, else its start day. */
  readonly ready: string;
  /** Days of hold (cures), 0 for the others. */
  readonly holdDays: number;
  /** Days from ready to service, or for a part applied to another, to the day it goes on. */
  readonly leadDays: number;
  /** How the start day was worked out, in words. */
  readonly rule: string;
  /** For a part applied to others (a rub): what it goes on, and when; absent otherwise. */
  readonly goesOn?: readonly AppliedPart[];
  /** The raw materials of this batch alone, before the plan adds them up (see pullList). */
  readonly materials: readonly BatchMaterial[];
}

/** One raw material of one batch, as the batch's formula names it. */
export interface BatchMaterial {
  readonly name: string;
  /** Exact grams the batch weighs in. */
  readonly grams: Decimal;
  /** Exact grams to buy or pull before trimming, where a trim yield applies. */
  readonly beforeTrimGrams?: Decimal;
  /** The formula id of the batch. */
  readonly formula: string;
}

/** One day's production: the batches that start on it. */
export interface PlanDay {
  readonly date: string;
  readonly batches: readonly PlanBatch[];
}

/** One raw material to pull from stores, added up over every batch of the plan. */
export interface PullItem {
  /** The ingredient as the formulas name it (first spelling met). */
  readonly name: string;
  /** Exact grams the batches weigh in. */
  readonly grams: Decimal;
  /** Exact grams to buy or pull before trimming, where a trim yield applies. */
  readonly beforeTrimGrams?: Decimal;
  /** The formula ids that use it. */
  readonly usedBy: readonly string[];
}

/** A whole plan: the batches by day, one pull list, the allergens and cautions of everything. */
export interface PlanResult {
  readonly assembly: { readonly id: string; readonly title: string };
  readonly count: number;
  readonly serviceDate: string;
  readonly today: string;
  /** Every batch, earliest start first. */
  readonly batches: readonly PlanBatch[];
  /** The batches grouped by start day, earliest first: one production sheet per day. */
  readonly days: readonly PlanDay[];
  /** Raw materials summed by name, in name order. */
  readonly pullList: readonly PullItem[];
  /** Every allergen in any batch, in label order. */
  readonly allergens: readonly Allergen[];
  /** Every batch's cautions, once each; the local-codes reminder last. */
  readonly cautions: readonly Caution[];
  /** What someone should look at: each batch's warnings, named by formula, and the plan's own. */
  readonly warnings: readonly string[];
}
