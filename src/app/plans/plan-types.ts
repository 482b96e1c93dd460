/**
 * The shapes the plans API answers with, from the core's own declarations (types only, so the
 * console loads none of the core's code).
 */
import type { Batch } from '../../../shared/api/batch-record.ts';
import type { PresentedPlan } from '../../../shared/presentation/presented-plan.ts';

export type { RawBatchOptions } from '../../../shared/calculation/batch-input.ts';
export type { PresentedResult } from '../../../shared/presentation/presented-result.ts';
export type { PlanRefusal } from '../../../shared/calculation/plan/plan-error.ts';
export type {
  PlanAlreadyRecorded,
  PlanList,
  PlanListItem,
  PlanWithStock,
} from '../../../shared/api/plan-record.ts';
export type {
  PlanStock,
  PresentedAmount,
  PresentedPullLine,
  PresentedWeight,
} from '../../../shared/stock/plan-stock-types.ts';
export type {
  PresentedPlan,
  PresentedPlanBatch,
  PresentedPullItem,
} from '../../../shared/presentation/presented-plan.ts';

/** Metric or US units on the plan's sheets. */
export type PlanUnits = 'metric' | 'us';

/** The body of POST /api/plans, /api/plans/record and /api/plans/sheet.pdf. */
export interface PlanRequest {
  /** The assembly's formula id. */
  readonly assembly: string;
  /** Units to serve. */
  readonly count: number;
  /** The day of service, YYYY-MM-DD. */
  readonly for: string;
  readonly units?: PlanUnits;
}

/** POST /api/plans/record: the plan as recorded, and every batch recorded as planned. */
export interface RecordedPlan {
  readonly plan: PresentedPlan;
  readonly batches: readonly Batch[];
}

/** An assembly that can be planned, for the select. */
export interface AssemblyOption {
  readonly id: string;
  readonly title: string;
  /** Whether the file reads cleanly and every part names a formula that fits. */
  readonly valid: boolean;
}
