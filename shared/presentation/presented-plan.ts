import type { RawBatchOptions } from '../calculation/batch-input.ts';
import type { AppliedPart } from '../calculation/plan/plan-types.ts';
import type { BatchKind } from '../formula/formula-types.ts';
import type { UnitSystem } from '../units/scale-amount.ts';
import type { PresentedResult } from './presented-result.ts';

/**
 * A plan ready to print or send as JSON (POST /api/plans, `larder plan --json`): every batch with
 * its presented result, the pull list with display amounts and exact grams as strings.
 */
export interface PresentedPlan {
  readonly assembly: { readonly id: string; readonly title: string };
  readonly count: number;
  /** The day of service, YYYY-MM-DD. */
  readonly serviceDate: string;
  /** The day the plan was made, YYYY-MM-DD. */
  readonly today: string;
  readonly units: UnitSystem;
  /** Every batch, earliest start first. */
  readonly batches: readonly PresentedPlanBatch[];
  /** Start days, earliest first, each with the formula ids of the batches that start on it. */
  readonly days: readonly { readonly date: string; readonly formulas: readonly string[] }[];
  /** Raw materials added up over every batch, in name order. */
  readonly pullList: readonly PresentedPullItem[];
  /** Every allergen of the plan as the law words it: "egg", "fish (anchovy)", "soybeans". */
  readonly allergens: readonly string[];
  readonly cautions: readonly {
    readonly id: string;
    readonly text: string;
    readonly source?: string;
  }[];
  readonly warnings: readonly string[];
  /** How amounts were rounded, in words. */
  readonly rounding: string;
}

/** One batch of a plan. */
export interface PresentedPlanBatch {
  readonly formula: { readonly id: string; readonly title: string; readonly kind: BatchKind };
  /** What it is for, one line per component that needs it. */
  readonly purposes: readonly string[];
  /** The batch options, as `larder calc` and POST /api/batches take them. */
  readonly batch: RawBatchOptions;
  readonly start: string;
  readonly ready: string;
  readonly holdDays: number;
  readonly leadDays: number;
  /** How the start day was worked out, in words. */
  readonly rule: string;
  /** A part applied to others (a rub): the parts it goes on, each with the day it goes on. */
  readonly goesOn?: readonly AppliedPart[];
  /** The parts applied to this one (the rub on a brisket), each with the day it goes on. */
  readonly gets?: readonly AppliedPart[];
  readonly result: PresentedResult;
}

/** One raw material of the pull list. */
export interface PresentedPullItem {
  readonly name: string;
  /** Rounded for the scale, as on a batch sheet. */
  readonly amount: string;
  /** Exact grams. */
  readonly grams: string;
  /** What to pull or buy before trimming, where a trim yield applies. */
  readonly beforeTrim?: { readonly amount: string; readonly grams: string };
  /** The formula ids that use it. */
  readonly usedBy: readonly string[];
}
