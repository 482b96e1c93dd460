/**
 * Judging a control's readings against its critical limit at a moment. CONTRACT STUB: the core
 * engineer replaces the body.
 */
import type { ControlState, ReadingPoint, ResolvedControl } from './control-types.ts';

/** How times are put in words ("by 14:32"): the kitchen's time zone. */
export interface Clock {
  /** ISO time of the judgement: deadlines before it without a reading are missed. */
  readonly now: string;
  /** IANA zone the kitchen's clocks show, e.g. "America/Chicago". */
  readonly timeZone: string;
}

/**
 * Where a control stands given its standing readings (oldest first, corrections applied), at
 * `clock.now`. Pure: the same readings and clock always give the same state.
 */
export function evaluateControl(
  control: ResolvedControl,
  readings: readonly ReadingPoint[],
  clock: Clock,
): ControlState {
  void control;
  void readings;
  void clock;
  throw new Error('evaluateControl is not built yet');
}
