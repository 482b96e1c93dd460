/**
 * The stage weights a batch may record, and what they say against the formula: each stage over
 * the one before it as a percent beside the formula's yield, and a pump's pick-up against its
 * target. Pure: the records pass in the standing weights.
 */
import { Decimal, HUNDRED } from '../decimal.ts';
import type { ActualYield, StageName } from '../api/process-record.ts';
import type { Formula, Yields } from '../formula/formula-types.ts';
import { pumpPercentFromWeights } from '../calculation/cure/ingoing.ts';
import { yieldPercent, type YieldStep } from '../calculation/yields.ts';

/** Every stage, in the order of the work. */
export const STAGE_NAMES: readonly StageName[] = [
  'green',
  'pumped',
  'cured',
  'smoked',
  'cooked',
  'sliced',
];

/** The stages after green that follow a yield step of the formula, and which step. */
const STAGE_STEP: Readonly<Partial<Record<StageName, YieldStep>>> = {
  cured: 'cure',
  smoked: 'smoke',
  cooked: 'cook',
  sliced: 'slice',
};

/**
 * The stages a batch of this formula may record. A cure: green (the trimmed, uncured weight that
 * every cure is figured on), pumped for the pump method only, cured (every cure is cured), and
 * smoked, cooked or sliced when its yields give that step. A blend: the steps its yields give
 * (its raw blend is the batch's own total). Doughs and mixes have no stage weights.
 */
export function stagesFor(formula: Formula): StageName[] {
  if (formula.kind === 'cure') {
    const given = yieldStages(formula.yields).filter((stage) => stage !== 'cured');
    return [
      'green',
      ...(formula.method === 'pump' ? (['pumped'] as const) : []),
      'cured',
      ...given,
    ];
  }
  if (formula.kind === 'blend') return yieldStages(formula.yields);
  return [];
}

function yieldStages(yields: Yields | undefined): StageName[] {
  return STAGE_NAMES.filter((stage) => {
    const step = STAGE_STEP[stage];
    return step !== undefined && yields?.[step] !== undefined;
  });
}

/**
 * The formula's yield from one stage to a later one: the product of the yields of the steps in
 * between (a step it gives no yield for counts as 100 %, as the calculation counts it), or null
 * when it gives none of them.
 */
function plannedBetween(
  yields: Yields | undefined,
  from: StageName | null,
  to: StageName,
): Decimal | null {
  const chain = STAGE_NAMES.filter((stage) => STAGE_STEP[stage] !== undefined);
  const start = from === null || from === 'green' ? 0 : chain.indexOf(from) + 1;
  const steps = chain.slice(start, chain.indexOf(to) + 1).map((stage) => STAGE_STEP[stage]!);
  const given = steps.filter((step) => yields?.[step] !== undefined);
  if (given.length === 0) return null;
  return given.reduce(
    (product, step) => product.times(new Decimal(yields![step]!)).div(HUNDRED),
    HUNDRED,
  );
}

/** The standing stage weights of a batch and the weights they are measured against. */
export interface StageWeights {
  /** Standing weight of each stage weighed, grams. */
  readonly stages: ReadonlyMap<StageName, Decimal>;
  /** The batch's own weight as calculated (a cure's green weight, a blend's total), grams. */
  readonly calculatedGrams: Decimal;
  /** Pump cures: the pump target, % of green weight. */
  readonly pumpTargetPct?: Decimal;
}

/**
 * Each stage weighed over the stage weighed before it (pumped over green; cured, smoked, cooked
 * and sliced along the yield chain, which passes pumped by as the formula's yields do), beside
 * the formula's yield over the same steps. The first stage is measured against the batch's own
 * weight as calculated when green was not weighed.
 * source: yield = weight after ÷ weight before × 100, USDA ARS, USDA Table of Cooking Yields for
 * Meat and Poultry (2012/2014)
 */
export function actualYields(formula: Formula, weights: StageWeights): ActualYield[] {
  const yields = 'yields' in formula ? formula.yields : undefined;
  const answer: ActualYield[] = [];
  let before: { stage: StageName | null; grams: Decimal } = {
    stage: weights.stages.has('green') ? 'green' : null,
    grams: weights.stages.get('green') ?? weights.calculatedGrams,
  };
  for (const stage of STAGE_NAMES) {
    const grams = weights.stages.get(stage);
    if (grams === undefined || stage === 'green') continue;
    if (stage === 'pumped') {
      answer.push({
        stage,
        from: before.stage,
        grams: grams.toString(),
        percent: yieldPercent(grams, before.grams).toString(),
        planned: weights.pumpTargetPct ? HUNDRED.plus(weights.pumpTargetPct).toString() : null,
      });
      continue;
    }
    const planned = plannedBetween(yields, before.stage, stage);
    answer.push({
      stage,
      from: before.stage,
      grams: grams.toString(),
      percent: yieldPercent(grams, before.grams).toString(),
      planned: planned === null ? null : planned.toString(),
    });
    before = { stage, grams };
  }
  return answer;
}

/** A pumped weight against its target: the pick-up reached and whether it is over the target. */
export interface PumpReached {
  /** (pumped − green) ÷ green × 100, exact. */
  readonly percent: Decimal;
  readonly targetPct: Decimal;
  /** The most the pumped weight may be: green × (1 + target ÷ 100), grams. */
  readonly targetGrams: Decimal;
  readonly over: boolean;
}

/**
 * The pump reached by a pumped weight: over the target when the pumped weight is more than
 * green × (1 + target %), compared unrounded.
 * The pick-up as pumpPercentFromWeights works it out: (pumped − green) ÷ green × 100, from memory
 * (the standard trade definition; the wording of FSIS Directive 7620.3 ch. 3 not confirmed).
 */
export function pumpReached(
  greenGrams: Decimal,
  pumpedGrams: Decimal,
  targetPct: Decimal,
): PumpReached {
  const targetGrams = greenGrams.times(HUNDRED.plus(targetPct)).div(HUNDRED);
  return {
    percent: pumpPercentFromWeights(pumpedGrams, greenGrams),
    targetPct,
    targetGrams,
    over: pumpedGrams.greaterThan(targetGrams),
  };
}
