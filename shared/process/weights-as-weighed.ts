/**
 * What a batch's weights as weighed say against its calculation: the cure's limit checks on the
 * actual weights, a pump against its target, and the actual yields. Pure: the records pass in the
 * recorded calculation, the formula it came from and the standing weights.
 */
import { Decimal, HUNDRED } from '../decimal.ts';
import type { ActualYield, StageName } from '../api/process-record.ts';
import { actualCureChecks } from '../calculation/cure/actual-nitrite.ts';
import { criticalFailures, type LimitCheck } from '../calculation/calc-result.ts';
import type { Formula } from '../formula/formula-types.ts';
import type { PresentedResult } from '../presentation/presented-result.ts';
import { actualYields, pumpReached, type PumpReached } from './weighing-stages.ts';

/** The labels under which a calculation shows the batch's own weight: a cure's, a blend's. */
const OWN_WEIGHT_LABELS = ['Green weight', 'Total batch weight'];

/** The pump a pump cure's brine was made for, as the calculation shows it. */
const PUMP_LABEL = 'Pump (brine made for)';

/** A pump cure's weight after injecting, when the batch was recorded with it. */
const PUMPED_LABEL = 'Weight after injecting';

function figureOf(result: PresentedResult, labels: readonly string[]): Decimal | undefined {
  const figure = [...result.inputs, ...result.figures].find(
    (f) => labels.includes(f.label) && f.exact !== undefined,
  );
  return figure?.exact === undefined ? undefined : new Decimal(figure.exact);
}

/**
 * The calculated grams of each line on the sheet, by its name; a name on more than one line (a
 * brine and its cover brine) adds up.
 */
export function sheetLines(result: PresentedResult): Map<string, Decimal> {
  const lines = new Map<string, Decimal>();
  for (const line of result.groups.flatMap((group) => group.lines))
    lines.set(line.name, (lines.get(line.name) ?? new Decimal(0)).plus(line.grams));
  return lines;
}

/** The standing weights of a batch, by line name and by stage, grams. */
export interface StandingWeights {
  readonly lines: ReadonlyMap<string, Decimal>;
  readonly stages: ReadonlyMap<StageName, Decimal>;
}

/** What the weights say. */
export interface WeightsVerdict {
  /** The ingoing nitrite on the actual weights; null before a line or the pumped weight is weighed. */
  readonly actualNitritePpm: Decimal | null;
  /** The critical checks the actual weights fail, in the calculation's order. */
  readonly failed: readonly LimitCheck[];
  /** Every check on the actual weights (empty until a line is weighed). */
  readonly checks: readonly LimitCheck[];
  /** A pump cure with a pumped weight: the pump reached against its target. */
  readonly pump: PumpReached | null;
  readonly yields: readonly ActualYield[];
}

/**
 * Judges the standing weights of a batch against the calculation it was recorded with. The actual
 * green weight is the 'green' stage weight when weighed, else the batch's own; the cure's checks
 * are worked out again (actualCureChecks) once any line or the pumped weight is weighed, a line not
 * weighed counting at its calculated grams.
 */
export function judgeWeights(
  formula: Formula,
  result: PresentedResult,
  weights: StandingWeights,
): WeightsVerdict {
  const calculatedGrams = figureOf(result, OWN_WEIGHT_LABELS) ?? new Decimal(0);
  const pumpTargetPct = formula.kind === 'cure' ? figureOf(result, [PUMP_LABEL]) : undefined;
  const green = weights.stages.get('green') ?? calculatedGrams;
  const weighedPumped = weights.stages.get('pumped');
  const yields = calculatedGrams.isZero()
    ? []
    : actualYields(formula, {
        stages: weights.stages,
        calculatedGrams,
        ...(pumpTargetPct ? { pumpTargetPct } : {}),
      });
  const pump =
    weighedPumped !== undefined && pumpTargetPct !== undefined
      ? pumpReached(green, weighedPumped, pumpTargetPct)
      : null;
  // Not weighed: the batch's own pumped weight, else its design pump on the actual green weight
  // (the batch may have been made for another pump than the formula's).
  const pumped =
    weighedPumped ??
    figureOf(result, [PUMPED_LABEL]) ??
    (pumpTargetPct ? green.times(HUNDRED.plus(pumpTargetPct)).div(HUNDRED) : undefined);
  // A pumped weight is weighed cure too: the pick-up carries the brine's nitrite into the meat.
  if (formula.kind !== 'cure' || (weights.lines.size === 0 && weighedPumped === undefined))
    return { actualNitritePpm: null, failed: [], checks: [], pump, yields };
  const checks = actualCureChecks(formula, sheetLines(result), {
    greenGrams: green,
    lines: weights.lines,
    ...(pumped === undefined ? {} : { pumpedGrams: pumped }),
  });
  const nitrite = checks.find((check) => check.id === 'nitrite-max');
  return {
    actualNitritePpm: nitrite?.value ?? null,
    failed: criticalFailures(checks),
    checks,
    pump,
    yields,
  };
}
