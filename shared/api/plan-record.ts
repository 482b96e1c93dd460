/**
 * The plans the API lists (GET /api/plans) and the answer when a plan's batches are already
 * recorded (409 'plan-already-recorded'): one definition for the server and the console.
 */
import type { PresentedPlan } from '../presentation/presented-plan.ts';
import type { PlanStock } from '../stock/plan-stock-types.ts';
import type { BatchSummary, PersonRef } from './batch-record.ts';

/** One plan made: what, how many, for which day of service, who made it and whether it is recorded. */
export interface PlanListItem {
  readonly assembly: { readonly id: string; readonly title: string };
  /** Units to serve. */
  readonly count: number;
  /** The day of service, YYYY-MM-DD. */
  readonly serviceDate: string;
  /** Who first worked the plan out, and when (ISO 8601). */
  readonly madeBy: PersonRef | null;
  readonly madeAt: string;
  /** The last time its batches were recorded as planned, or null if they never were. */
  readonly recorded: {
    readonly by: PersonRef | null;
    readonly at: string;
    /** How many batches were recorded from this plan, every time together. */
    readonly batches: number;
  } | null;
}

/** GET /api/plans: the latest plans made, newest first. */
export interface PlanList {
  readonly plans: readonly PlanListItem[];
}

/**
 * The one detail of a 409 'plan-already-recorded': the batches already recorded for the same
 * menu item and day of service (any count), which recording again would add to.
 */
export interface PlanAlreadyRecorded {
  readonly assembly: string;
  readonly serviceDate: string;
  readonly batches: readonly BatchSummary[];
}

/**
 * POST /api/plans and GET /api/plans/pull-list: the plan, and its pull list against the lots on
 * hand (or why it could not be compared).
 */
export interface PlanWithStock extends PresentedPlan {
  readonly stock: PlanStock;
}
