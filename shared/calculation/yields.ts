import { Decimal, HUNDRED, ONE, fraction, percentOf } from '../decimal.ts';
import type { Yields } from '../formula/formula-types.ts';
import type { YieldStage } from './calc-result.ts';

/**
 * The process steps that can carry a yield, in process order. Each yield is the weight after the
 * step as a percent of the weight before it.
 * source: cooking yield = cooked ÷ raw × 100, USDA ARS Nutrient Data Laboratory, USDA Table of
 * Cooking Yields for Meat and Poultry, 2012/2014; the trim yield is the same ratio (derived)
 */
export const YIELD_STEPS = ['trim', 'cure', 'smoke', 'cook', 'slice'] as const;

/** One of {@link YIELD_STEPS}. */
export type YieldStep = (typeof YIELD_STEPS)[number];

/**
 * The steps after the reference weight. The reference is the weight after trimming (green weight
 * for a cure, raw blend weight for a blend), so every step but trim lies after it.
 */
export const STEPS_AFTER_REFERENCE: readonly YieldStep[] = YIELD_STEPS.filter((s) => s !== 'trim');

/** Label of the stage that says how much to buy before trimming. */
export const BEFORE_TRIM = 'before trim';

/**
 * A yield in percent (weight after ÷ weight before × 100), as trim and cooking yields are
 * defined.
 * source: USDA ARS, USDA Table of Cooking Yields for Meat and Poultry (the trim yield: derived)
 * @param afterGrams weight after the step (usable, cooked, sliced…)
 * @param beforeGrams weight before the step; must not be zero
 */
export function yieldPercent(afterGrams: Decimal, beforeGrams: Decimal): Decimal {
  return percentOf(afterGrams, beforeGrams);
}

/** The yield of one step as an exact decimal, or undefined when the formula does not give it. */
function stepPercent(yields: Yields, step: YieldStep): Decimal | undefined {
  const value = yields[step];
  if (value === undefined) return undefined;
  const percent = new Decimal(value);
  // The schema forbids 0 and negatives; a zero would divide by zero, so refuse it loudly.
  if (!percent.isFinite() || percent.lessThanOrEqualTo(0)) {
    throw new RangeError(`the ${step} yield must be more than 0 %, not ${value}`);
  }
  return percent;
}

/**
 * The weight through each process step, starting from the reference weight (after trimming).
 *
 * When a trim yield is given the first stage is {@link BEFORE_TRIM}: the weight to buy,
 * reference ÷ (trim / 100), with the trim yield as its percent. Then one stage per later step the
 * formula gives, in process order, each the weight before it × its yield / 100.
 * @param referenceGrams the weight after trimming, grams
 * @param yields the formula's yields; none gives an empty list
 */
export function yieldStages(referenceGrams: Decimal, yields: Yields | undefined): YieldStage[] {
  if (!yields) return [];
  const stages: YieldStage[] = [];
  const trim = stepPercent(yields, 'trim');
  if (trim) {
    stages.push({ step: BEFORE_TRIM, percent: trim, grams: referenceGrams.div(fraction(trim)) });
  }
  let grams = referenceGrams;
  for (const step of STEPS_AFTER_REFERENCE) {
    const percent = stepPercent(yields, step);
    if (!percent) continue;
    grams = grams.times(percent).div(HUNDRED);
    stages.push({ step, percent, grams });
  }
  return stages;
}

/**
 * The product of the yields after the reference weight (cure, smoke, cook, slice) as a fraction:
 * finished weight ÷ reference weight. 1 when there are none.
 */
export function finishedFraction(yields: Yields | undefined): Decimal {
  let product = ONE;
  if (!yields) return product;
  for (const step of STEPS_AFTER_REFERENCE) {
    const percent = stepPercent(yields, step);
    if (percent) product = product.times(fraction(percent));
  }
  return product;
}

/**
 * The reference weight (after trimming) needed for a finished weight: the finished weight divided
 * by the product of the yields after the reference. "How much green belly for 6 kg of sliced
 * bacon." Trim is not part of it: it lies before the reference (see {@link yieldStages}).
 * @param finishedGrams the finished weight wanted, grams
 * @param yields the formula's yields; none gives the finished weight back
 */
export function referenceFromFinished(finishedGrams: Decimal, yields: Yields | undefined): Decimal {
  // One division by the whole product keeps this to a single rounding.
  return finishedGrams.div(finishedFraction(yields));
}
