import type { Decimal} from '../decimal.ts';
import { sum } from '../decimal.ts';
import { allergenName } from '../calculation/allergens.ts';
import {
  failsCriticalLimit,
  type AmountLine,
  type CalcResult,
  type Figure,
  type LimitCheck,
  type LineGroup,
} from '../calculation/calc-result.ts';
import {
  formatGramsFine,
  formatScaleAmount,
  isMinorAmount,
  KILOGRAM_DISPLAY_FROM,
  roundForScale,
  type ScaleAmount,
  type UnitSystem,
} from '../units/scale-amount.ts';
import { limitFigure, shownValue, valueBesideLimit } from './check-figures.ts';
import { formatFigure, formatMass, formatPercent } from './format-figure.ts';
import type {
  PresentedCheck,
  PresentedFigure,
  PresentedGroup,
  PresentedLine,
  PresentedResult,
} from './presented-result.ts';

/** How amounts are rounded, printed on every sheet. */
export function roundingNote(system: UnitSystem): string {
  const scale =
    system === 'us'
      ? 'Amounts are rounded half-up to 0.1 oz, with the gram figure beside every curing-salt line.'
      : 'Amounts are rounded half-up to what a scale weighs: curing salt and lines under 100 g to 0.1 g, the rest to 1 g (shown in kg from 10 kg).';
  return `${scale} Totals add up the printed lines. Limits are checked on the unrounded values.`;
}

function weighsFine(line: AmountLine): boolean {
  return line.role === 'curing-salt' || isMinorAmount(line.grams);
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
  };
}

function presentGroup(group: LineGroup, system: UnitSystem): PresentedGroup {
  const rounded = group.lines.map((line) => roundForScale(line.grams, system, weighsFine(line)));
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
      amount: formatScaleAmount(total, inKilograms),
      grams: exactTotal.toString(),
      ...(percentTotal ? { percent: percentTotal } : {}),
    },
  };
}

function presentFigure(figure: Figure, system: UnitSystem): PresentedFigure {
  return {
    label: figure.label,
    value: formatFigure(figure.kind, figure.value, system),
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
  return {
    formula: result.formula,
    units: system,
    inputs: result.inputs.map((f) => presentFigure(f, system)),
    groups: result.groups.map((g) => presentGroup(g, system)),
    steps: result.steps,
    figures: result.figures.map((f) => presentFigure(f, system)),
    checks: result.checks.map(presentCheck),
    critical: failsCriticalLimit(result),
    warnings: result.warnings,
    cautions: result.cautions,
    allergens: result.allergens.map(allergenName),
    ...(result.schedule ? { schedule: result.schedule } : {}),
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
    ...(result.portions
      ? {
          portions: {
            piece: formatMass(result.portions.pieceGrams, system),
            count: result.portions.count,
            remainder: formatMass(result.portions.remainderGrams, system),
            remainderGrams: result.portions.remainderGrams.toString(),
          },
        }
      : {}),
    rounding: roundingNote(system),
    ...(result.notes ? { notes: result.notes } : {}),
  };
}
