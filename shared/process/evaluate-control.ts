/**
 * Judging a control's readings against its critical limit at a moment: each reading on its own
 * (holding, receiving, chamber), a hold at temperature (cooking), or a staged cool.
 */
import { Decimal } from '../decimal.ts';
import type {
  ControlLimit,
  ControlMiss,
  ControlState,
  ReadingPoint,
  ResolvedControl,
} from './control-types.ts';
import { clockWords, valueWords } from './control-words.ts';
import { judgeCooling } from './judge-cooling.ts';
import { judgeHold } from './judge-hold.ts';
import { judgedPoints, type JudgedPoint } from './judged-point.ts';
import { addSeconds, normalIso } from './judge-time.ts';

/** How times are put in words ("by 14:32"): the kitchen's time zone. */
export interface Clock {
  /** ISO time of the judgement: deadlines before it without a reading are missed. */
  readonly now: string;
  /** IANA zone the kitchen's clocks show, e.g. "America/Chicago". */
  readonly timeZone: string;
}

/** What the batch says about the control's step. */
export interface EvaluateOptions {
  /**
   * The batch has moved past this control's step (a later control has readings, or the batch is
   * done): a cook not yet held long enough is then missed, not in progress.
   */
  readonly stepOver?: boolean;
}

type EachReadingLimit = Extract<ControlLimit, { type: 'at-most' | 'at-least' | 'between' }>;

/** Whether a value is outside the limit; the limit's decimals are built once, not per reading. */
function outsideOf(limit: EachReadingLimit): (value: Decimal) => boolean {
  if (limit.type === 'at-most') {
    const max = new Decimal(limit.max);
    return (value) => value.greaterThan(max);
  }
  if (limit.type === 'at-least') {
    const min = new Decimal(limit.min);
    return (value) => value.lessThan(min);
  }
  const min = new Decimal(limit.min);
  const max = new Decimal(limit.max);
  return (value) => value.lessThan(min) || value.greaterThan(max);
}

function limitWords(limit: EachReadingLimit, unit: string): string {
  if (limit.type === 'at-most') return `at most ${valueWords(limit.max, unit)}`;
  if (limit.type === 'at-least') return `at least ${valueWords(limit.min, unit)}`;
  return `between ${valueWords(limit.min, unit)} and ${valueWords(limit.max, unit)}`;
}

/** Holding, receiving, a chamber: every reading judged on its own. */
function judgeEachReading(
  control: ResolvedControl,
  limit: EachReadingLimit,
  readings: readonly JudgedPoint[],
  clock: Clock,
  stepOver: boolean,
): ControlState {
  const outside = outsideOf(limit);
  const must = limitWords(limit, control.unit);
  const when = (iso: string): string => clockWords(iso, clock.timeZone, clock.now);
  const misses: ControlMiss[] = readings
    .filter((reading) => outside(reading.decimal))
    .map((reading) => ({
      kind: 'reading',
      at: reading.at,
      key: normalIso(reading.at),
      what: `${valueWords(reading.value, control.unit)} at ${when(reading.at)}; must be ${must}`,
    }));
  const last = readings.at(-1);
  if (!last) {
    return {
      status: 'waiting',
      summary: `No reading yet; must be ${must}`,
      stage: null,
      nextDue: null,
      misses,
    };
  }
  const nextDue = control.everyS !== null && !stepOver ? addSeconds(last.at, control.everyS) : null;
  const due = nextDue === null ? '' : `; next reading by ${when(nextDue)}`;
  if (misses.length > 0) {
    const latest = misses[misses.length - 1];
    const count = misses.length === 1 ? '' : ` (${misses.length} readings out of limit)`;
    return {
      status: 'missed',
      summary: `Out of limit: ${latest.what}${count}${due}`,
      stage: null,
      nextDue,
      misses,
    };
  }
  const status = control.everyS === null || stepOver ? 'met' : 'in-progress';
  const summary = `${valueWords(last.value, control.unit)} at ${when(last.at)}, within its limit (${must})${due}`;
  return { status, summary, stage: null, nextDue, misses };
}

/**
 * Where a control stands given its standing readings (oldest first, corrections applied), at
 * `clock.now`. Pure: the same readings, clock and options always give the same state.
 */
export function evaluateControl(
  control: ResolvedControl,
  readings: readonly ReadingPoint[],
  clock: Clock,
  options: EvaluateOptions = {},
): ControlState {
  const stepOver = options.stepOver ?? false;
  const limit = control.limit;
  const points = judgedPoints(readings);
  if (limit.type === 'cooling') return judgeCooling(control, limit, points, clock);
  if (limit.type === 'hold') return judgeHold(control, limit, points, clock, stepOver);
  return judgeEachReading(control, limit, points, clock, stepOver);
}
