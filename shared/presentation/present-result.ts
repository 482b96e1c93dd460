import type { Decimal } from '../decimal.ts';
import { sum } from '../decimal.ts';
import { allergenName } from '../calculation/allergens.ts';
import {
  failsCriticalLimit,
  type AmountLine,
  type CalcResult,
  type Figure,
  type LimitCheck,
  type LineGroup,
  type Portions,
} from '../calculation/calc-result.ts';
import {
  formatGramsFine,
  formatScaleAmount,
  KILOGRAM_DISPLAY_FROM,
  roundForScale,
  type ScaleAmount,
  type UnitSystem,
} from '../units/scale-amount.ts';
import { limitFigure, shownValue, valueBesideLimit } from './check-figures.ts';
import { formatFigure, formatMass, formatPercent } from './format-figure.ts';
import {
  formatWeight,
  roundLine,
  tableWeights,
  weightOf,
  type PrintedWeight,
} from './printed-weights.ts';
import type {
  PresentedCheck,
  PresentedFigure,
  PresentedGroup,
  PresentedLine,
  PresentedPortions,
  PresentedResult,
} from './presented-result.ts';

/** How amounts are rounded, printed on every sheet. */
export function roundingNote(system: UnitSystem): string {
  const scale =
    system === 'us'
      ? 'Amounts are rounded half-up to 0.1 oz, with the gram figure beside every curing-salt line.'
      : 'Amounts are rounded half-up to what a scale weighs: curing salt and lines under 100 g to 0.1 g, the rest to 1 g (shown in kg from 10 kg).';
  return (
    `${scale} Totals add up the printed lines; where the exact weight rounds to another figure, it is ` +
    'given beside the total, and printed the same wherever else it appears. Limits are checked on ' +
    'the unrounded values.'
  );
}

function presentLine(
  line: AmountLine,
  system: UnitSystem,
  rounded: ScaleAmount,
  inKilograms: boolean,
): PresentedLine {
  return {
    name: line.name,
    amount: formatScaleAmount(rounded, inKilograms),
    ...(system === 'us' && line.role === 'curing-salt'
      ? { gramsShown: formatGramsFine(line.grams) }
      : {}),
    grams: line.grams.toString(),
    ...(line.percent ? { percent: formatPercent(line.percent) } : {}),
    role: line.role,
    ...(line.note ? { note: line.note } : {}),
    ...(line.part ? { part: line.part } : {}),
  };
}

function presentGroup(
  group: LineGroup,
  system: UnitSystem,
  weights: readonly PrintedWeight[],
): PresentedGroup {
  const rounded = group.lines.map((line) => roundLine(line, system, weights));
  const exactTotal = sum(group.lines.map((line) => line.grams));
  const inKilograms = exactTotal.greaterThanOrEqualTo(KILOGRAM_DISPLAY_FROM);
  const lines = group.lines.map((line, i) => presentLine(line, system, rounded[i], inKilograms));
  if (!group.totalLabel || rounded.length === 0)
    return { title: group.title, percentOf: group.percentOf, lines };
  // The total is the sum of what is printed, so a cook adding up the sheet gets the same figure.
  const places = Math.max(...rounded.map((r) => r.places));
  const total: ScaleAmount = {
    value: sum(rounded.map((r) => r.value)),
    unit: rounded[0].unit,
    places,
  };
  const amount = formatScaleAmount(total, inKilograms);
  const weight = formatWeight(
    weightOf(weights, exactTotal) ?? { exact: exactTotal, places },
    system,
  );
  const percents = group.lines.map((line) => line.percent);
  const percentTotal = percents.every((p): p is Decimal => p !== undefined)
    ? formatPercent(sum(percents))
    : undefined;
  return {
    title: group.title,
    percentOf: group.percentOf,
    lines,
    total: {
      label: group.totalLabel,
      amount,
      grams: exactTotal.toString(),
      weight,
      ...(weight === amount
        ? {}
        : { note: `adds up the lines as printed; the exact weight is ${weight}` }),
      ...(percentTotal ? { percent: percentTotal } : {}),
    },
  };
}

function presentPortions(
  portions: Portions,
  system: UnitSystem,
  weights: readonly PrintedWeight[],
): PresentedPortions {
  const piece = formatMass(portions.pieceGrams, system);
  // What is over is printed as finely as the batch it is cut from, so that the two subtract.
  const batch = weightOf(
    weights,
    portions.remainderGrams.plus(portions.pieceGrams.times(portions.count)),
  );
  const remainder = batch
    ? formatScaleAmount(roundForScale(portions.remainderGrams, system, batch.places > 0))
    : formatMass(portions.remainderGrams, system);
  const cut = `${portions.count} × ${piece}`;
  let sentence = `${cut}, ${remainder} left over`;
  if (portions.lossPct?.isZero()) {
    sentence = `${cut}; no loss allowance, so nothing is over for dough lost in mixing and dividing`;
  } else if (portions.lossPct) {
    sentence =
      `${cut}; the other ${remainder} is the loss allowance (${portions.lossPct.toString()} %), ` +
      'for dough lost in mixing, dividing and on the bench: not spare dough';
  }
  return {
    piece,
    count: portions.count,
    remainder,
    remainderGrams: portions.remainderGrams.toString(),
    sentence,
  };
}

function presentFigure(
  figure: Figure,
  system: UnitSystem,
  weights: readonly PrintedWeight[],
): PresentedFigure {
  const weight =
    figure.kind === 'mass' && typeof figure.value !== 'string'
      ? weightOf(weights, figure.value)
      : undefined;
  return {
    label: figure.label,
    value: weight ? formatWeight(weight, system) : formatFigure(figure.kind, figure.value, system),
    ...(typeof figure.value === 'string' ? {} : { exact: figure.value.toString() }),
    ...(figure.note ? { note: figure.note } : {}),
  };
}

function presentCheck(check: LimitCheck): PresentedCheck {
  const shown = shownValue(check);
  const limit = limitFigure(check);
  // The rule's own ratio, where it states one: "(¼ oz per 100 lb chopped meat)".
  const basis = check.limitBasis ? ` (${check.limitBasis})` : '';
  const value = valueBesideLimit(check);
  const verdict = check.status === 'pass' ? 'PASS' : check.status === 'fail' ? 'FAIL' : 'WARN';
  let sentence: string;
  if (check.comparison === 'at-most') {
    if (check.status === 'pass')
      sentence = `${value} is within the ${limit} limit${basis} for ${check.rule}`;
    else if (check.status === 'warn')
      sentence = `${value} is over ${limit}${basis} for ${check.rule}`;
    else
      sentence = `${check.critical ? 'critical limit exceeded: ' : ''}${value} is over the ${limit} limit${basis} for ${check.rule}`;
  } else if (check.status === 'pass') {
    sentence = `${value} meets the ${limit} minimum${basis} for ${check.rule}`;
  } else if (check.status === 'warn') {
    sentence = `${value} is below the usual minimum of ${limit}${basis} for ${check.rule}`;
  } else {
    sentence = `${check.critical ? 'critical limit not met: ' : ''}${value} is below the ${limit}${basis} required for ${check.rule}`;
  }
  return {
    id: check.id,
    label: check.label,
    value: shown,
    exact: check.value.toString(),
    limit,
    comparison: check.comparison,
    status: check.status,
    verdict,
    critical: check.critical,
    sentence: `${sentence} (compared unrounded)`,
    rule: check.rule,
    source: check.source,
  };
}

/**
 * Rounds and formats a calculation for printing or JSON, in metric or US units. A result that
 * fails a critical limit is presented without anything to weigh, so that no sheet, screen or
 * script can make the refused batch from it.
 */
export function presentResult(result: CalcResult, system: UnitSystem): PresentedResult {
  if (failsCriticalLimit(result)) {
    const { yields: _yields, portions: _portions, ...rest } = result;
    return presentAll({ ...rest, groups: [] }, system);
  }
  return presentAll(result, system);
}

function presentAll(result: CalcResult, system: UnitSystem): PresentedResult {
  const weights = tableWeights(result.groups, system);
  return {
    formula: result.formula,
    units: system,
    inputs: result.inputs.map((f) => presentFigure(f, system, weights)),
    groups: result.groups.map((g) => presentGroup(g, system, weights)),
    steps: result.steps,
    figures: result.figures.map((f) => presentFigure(f, system, weights)),
    checks: result.checks.map(presentCheck),
    critical: failsCriticalLimit(result),
    warnings: result.warnings,
    cautions: result.cautions,
    allergens: result.allergens.map(allergenName),
    ...(result.schedule ? { schedule: result.schedule } : {}),
    ...(result.holdNeeds ? { holdNeeds: result.holdNeeds } : {}),
    ...(result.yields
      ? {
          yields: result.yields.map((stage) => ({
            step: stage.step,
            percent: formatPercent(stage.percent),
            amount: formatMass(stage.grams, system),
            grams: stage.grams.toString(),
          })),
        }
      : {}),
    ...(result.portions ? { portions: presentPortions(result.portions, system, weights) } : {}),
    rounding: roundingNote(system),
    ...(result.notes ? { notes: result.notes } : {}),
  };
}
