import type { Decimal } from '../../decimal.ts';
import { ONE } from '../../decimal.ts';
import type { BlendFormula } from '../../formula/formula-types.ts';
import { BatchError } from '../batch-error.ts';
import type { BatchInput } from '../batch-input.ts';
import type { Figure } from '../calc-result.ts';
import { referenceFromFinished } from '../yields.ts';
import { formatPercent, unreachableMessage } from './blend-fat.ts';
import { keptAfterLoss } from './blend-loss.ts';
import { isReachable, partnerForFixed, pearsonSquare, type TwoAmounts } from './pearson-square.ts';

/** The fats a blend is worked out from, all in %. */
export interface BlendFats {
  readonly first: Decimal;
  readonly second: Decimal;
  readonly target: Decimal;
}

/** How much of each component the batch takes, and the size inputs it was worked out from. */
export interface BlendMeat {
  /** Grams of each component, in the formula's order. */
  readonly amounts: TwoAmounts;
  /** The batch-size inputs, echoed for the result. */
  readonly inputs: readonly Figure[];
}

/** The ways to size a blend, as command-line options. */
const SIZE_OPTIONS = ['total', 'on-hand', 'want'] as const;
type SizeOption = (typeof SIZE_OPTIONS)[number];

function givenOptions(batch: BatchInput): SizeOption[] {
  const value: Record<SizeOption, unknown> = {
    total: batch.total,
    'on-hand': batch.onHand,
    want: batch.want,
  };
  return SIZE_OPTIONS.filter((option) => value[option] !== undefined);
}

function requirePositive(grams: Decimal, option: SizeOption): void {
  if (!grams.greaterThan(0)) {
    throw new BatchError(`--${option} must be more than 0 g, not ${grams} g`, option);
  }
}

/**
 * Works out the meat of a blend from whichever size the batch gives:
 * - `total`: the raw meat weight, split by the Pearson square;
 * - `onHand`: one component fixed by what is on hand, the other added to reach the target;
 * - `want`: the finished weight, worked back through the yields after the reference (cure,
 *   smoke, cook, slice) and the grinding and forming loss to the raw batch weight, seasoning
 *   included, then to the meat in it.
 * @param seasoning the seasoning as a fraction of the meat weight (Σ pct ÷ 100)
 * @throws BatchError when no size or several are given, a size is not more than 0, the on-hand
 *   key is unknown, or the target cannot be made from the two components
 */
export function blendMeat(
  formula: BlendFormula,
  batch: BatchInput,
  fats: BlendFats,
  seasoning: Decimal,
): BlendMeat {
  const given = givenOptions(batch);
  if (given.length === 0) {
    throw new BatchError(
      'Give the batch size with one of --total (raw meat weight), --on-hand KEY=WEIGHT (one ' +
        'trimming fixed by what you have) or --want (finished weight).',
    );
  }
  if (given.length > 1) {
    throw new BatchError(
      `Give only one of --total, --on-hand or --want, not ${given.map((o) => `--${o}`).join(' and ')}.`,
      given[1],
    );
  }
  if (!isReachable(fats.first, fats.second, fats.target)) {
    const option = batch.targetFat === undefined ? undefined : 'target-fat';
    throw new BatchError(unreachableMessage(fats.first, fats.second, fats.target), option);
  }
  if (batch.onHand) return onHandMeat(formula, batch.onHand, fats);

  let meat: Decimal;
  let input: Figure;
  if (batch.total !== undefined) {
    requirePositive(batch.total, 'total');
    meat = batch.total;
    input = { label: 'Meat weight', kind: 'mass', value: meat };
  } else {
    const want = batch.want as Decimal;
    requirePositive(want, 'want');
    // Yields apply to everything that is cooked, seasoning included; the meat is the raw batch
    // less its seasoning.
    meat = referenceFromFinished(want, formula.yields)
      .div(keptAfterLoss(formula))
      .div(ONE.plus(seasoning));
    const note = formula.yields ? 'worked back through the yields' : 'no yields: raw weight';
    input = { label: 'Finished weight wanted', kind: 'mass', value: want, note };
  }
  return {
    amounts: pearsonSquare(fats.first, fats.second, fats.target, meat),
    inputs: [input],
  };
}

function onHandMeat(
  formula: BlendFormula,
  onHand: { key: string; grams: Decimal },
  fats: BlendFats,
): BlendMeat {
  const keys = formula.components.map((c) => c.key);
  const index = keys.indexOf(onHand.key.trim().toLowerCase());
  if (index < 0) {
    throw new BatchError(
      `--on-hand names "${onHand.key}", but this formula's trimmings are ${keys.join(' and ')}`,
      'on-hand',
    );
  }
  requirePositive(onHand.grams, 'on-hand');
  const fixed = formula.components[index];
  const other = formula.components[1 - index];
  const fixedFat = index === 0 ? fats.first : fats.second;
  const otherFat = index === 0 ? fats.second : fats.first;
  if (otherFat.equals(fats.target) && !fixedFat.equals(fats.target)) {
    throw new BatchError(
      `${formatPercent(fats.target)} fat is the fat of ${other.name} itself: with ${fixed.name} ` +
        'fixed it would take an unlimited amount of it. Use --total instead.',
      'on-hand',
    );
  }
  const added = partnerForFixed(fixedFat, otherFat, fats.target, onHand.grams);
  const amounts =
    index === 0 ? { first: onHand.grams, second: added } : { first: added, second: onHand.grams };
  return {
    amounts,
    inputs: [{ label: `on hand: ${fixed.name}`, kind: 'mass', value: onHand.grams }],
  };
}
