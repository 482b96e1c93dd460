import type { Decimal } from '../../decimal.ts';
import { ONE } from '../../decimal.ts';
import type { BlendFormula } from '../../formula/formula-types.ts';
import { BatchError } from '../batch-error.ts';
import type { BatchInput } from '../batch-input.ts';
import type { Figure } from '../calc-result.ts';
import { referenceFromFinished } from '../yields.ts';
import { componentIndex } from './blend-fat.ts';
import { keptAfterLoss } from './blend-loss.ts';
import { solveBlend } from './blend-solve.ts';

/** How much of each component the batch takes, and the size inputs it was worked out from. */
export interface BlendMeat {
  /** Grams of each component, in the formula's order. */
  readonly amounts: readonly Decimal[];
  /** The batch-size inputs, echoed for the result. */
  readonly inputs: readonly Figure[];
}

function requirePositive(grams: Decimal, option: string): void {
  if (!grams.greaterThan(0)) {
    throw new BatchError(`--${option} must be more than 0 g, not ${grams} g`, option);
  }
}

/** The meat weight a batch gives by --total, or by --want worked back; undefined for neither. */
function meatWeight(
  formula: BlendFormula,
  batch: BatchInput,
  seasoning: Decimal,
): { grams: Decimal; input: Figure } | undefined {
  if (batch.total !== undefined && batch.want !== undefined) {
    throw new BatchError('Give only one of --total or --want, not both.', 'want');
  }
  if (batch.total !== undefined) {
    requirePositive(batch.total, 'total');
    return {
      grams: batch.total,
      input: { label: 'Meat weight', kind: 'mass', value: batch.total },
    };
  }
  if (batch.want === undefined) return undefined;
  requirePositive(batch.want, 'want');
  // Yields apply to everything that is cooked, seasoning included, after the grinding and
  // forming loss; the meat is the raw batch less its seasoning.
  const grams = referenceFromFinished(batch.want, formula.yields)
    .div(keptAfterLoss(formula))
    .div(ONE.plus(seasoning));
  const note = formula.yields ? 'worked back through the yields' : 'no yields: raw weight';
  return {
    grams,
    input: { label: 'Finished weight wanted', kind: 'mass', value: batch.want, note },
  };
}

/**
 * Works out the meat of a blend from the sizes the batch gives (blend-solve.ts says which
 * combinations are determinate):
 * - `total`: the raw meat weight; `want`: the finished weight, worked back through the yields
 *   after the reference (cure, smoke, cook, slice) and the grinding and forming loss to the raw
 *   batch weight, seasoning included, then to the meat in it;
 * - `onHand`: components fixed by what is on hand, alone (one component is then added to reach
 *   the target) or with a meat weight (two components then balance the rest).
 * @param fats each component's fat % for this batch (a fat test replaces the formula's figure)
 * @param seasoning the seasoning as a fraction of the meat weight (Σ pct ÷ 100)
 * @throws BatchError when no size is given, both total and want, a size is not more than 0, an
 *   on-hand key is unknown or given twice, or the blend cannot be solved (blend-solve.ts)
 */
export function blendMeat(
  formula: BlendFormula,
  batch: BatchInput,
  fats: readonly Decimal[],
  target: Decimal,
  seasoning: Decimal,
): BlendMeat {
  const meat = meatWeight(formula, batch, seasoning);
  const onHand = batch.onHand ?? [];
  if (!meat && onHand.length === 0) {
    throw new BatchError(
      'Give the batch size with one of --total (raw meat weight), --on-hand KEY=WEIGHT ' +
        '(trimmings fixed by what you have) or --want (finished weight).',
    );
  }
  const fixed = new Map<number, Decimal>();
  const inputs: Figure[] = meat ? [meat.input] : [];
  for (const entry of onHand) {
    const index = componentIndex(formula, entry.key, 'on-hand');
    const component = formula.components[index];
    if (fixed.has(index)) {
      throw new BatchError(`--on-hand names ${component.key} twice`, 'on-hand');
    }
    requirePositive(entry.grams, 'on-hand');
    fixed.set(index, entry.grams);
    inputs.push({ label: `on hand: ${component.name}`, kind: 'mass', value: entry.grams });
  }
  const amounts = solveBlend({
    components: formula.components.map((c, i) => ({ name: c.name, fat: fats[i] })),
    target,
    fixed,
    ...(meat ? { total: meat.grams } : {}),
    ...(batch.targetFat === undefined ? {} : { targetOption: 'target-fat' }),
  });
  return { amounts, inputs };
}
