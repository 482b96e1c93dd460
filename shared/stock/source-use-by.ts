/**
 * The use-by of a batch drawn on to make another (a grind into burgers, a smoked belly into
 * sliced bacon), worked out as its label's would be. Pure.
 */
import type { Formula } from '../formula/formula-types.ts';
import { useByOf } from '../labels/label-keeping.ts';

/** A source batch's use-by day, or why it has none. */
export interface SourceUseBy {
  /** The last day it may be used (ISO date). */
  readonly useBy?: string;
  /** Why it has none, in a cook's words; undefined when it has one. */
  readonly none?: string;
}

/**
 * The use-by of a batch used to make another, from its formula's `label:` as the product label
 * works it out (useByOf): the kitchen's validated shelf life; else, for ready-to-eat food held
 * refrigerated, the Food Code's 7 days with the day it was made as day 1; else none (frozen,
 * shelf-stable, or not ready to eat with no validated shelf life), with the reason. The day it
 * was made is the day it was marked done: a batch still under way has none yet, and one made
 * from a formula that says nothing of how it is kept has none either — we print no date we
 * cannot work out; the cook sees why, and the oldest batches are offered first all the same.
 * source: FDA Food Code 2022, 3-501.17(A), the day of preparation counted as day 1 (quoted in
 * shared/labels/date-mark.ts)
 * @param formula the formula at the revision the batch was made from; undefined when no longer kept
 * @param finishedOn the day the batch was marked done (ISO date), or null while it is under way
 */
export function sourceUseBy(formula: Formula | undefined, finishedOn: string | null): SourceUseBy {
  if (finishedOn === null) return { none: 'not finished yet: dated once it is marked done' };
  if (!formula) return { none: 'its formula is no longer kept at the revision it was made from' };
  const keeping = formula.kind === 'assembly' ? undefined : formula.label;
  const { mark, none } = useByOf(keeping, finishedOn);
  return mark ? { useBy: mark.useBy } : { none };
}
