import type { Decimal } from '../../decimal.ts';
import { dec, sum } from '../../decimal.ts';
import type { DoughFormula } from '../../formula/formula-types.ts';
import { allergenCaution, CAUTIONS } from '../../reference/cautions.ts';
import { DEFAULT_YEAST_FACTORS, type YeastFactors } from '../../reference/yeast-factors.ts';
import { collectAllergens } from '../allergens.ts';
import type { BatchInput } from '../batch-input.ts';
import type { CalcResult, Caution, Figure, LineGroup } from '../calc-result.ts';
import { checkDoughFormula } from './check-dough-formula.ts';
import { lineAtPercent, toAmountLine, type DoughLine } from './dough-line.ts';
import { effectiveHydration, plainWaterHydration } from './hydration.ts';
import { prefermentLine, splitPreferment } from './preferment.ts';
import { portionsOf, scaleDough } from './scale-dough.ts';
import { planLiquids, type LiquidPlan } from './liquid-plan.ts';
import { planWaterTemperature, splitWaterWithIce } from './temperature-plan.ts';
import { convertYeastLine, yeastLabel } from './yeast.ts';

/** Options of a dough calculation that are not batch inputs. */
export interface DoughOptions {
  /** Yeast conversion factors; the published set (`PUBLISHED_YEAST_FACTORS`) unless given. */
  readonly yeastFactors?: YeastFactors;
}

const OF_TOTAL_FLOUR = "total flour (baker's %)";

/**
 * Title of the group that lists the whole formula once when a preferment splits it: what to
 * buy, where the preferment and final-dough groups would count the preferment's share twice.
 */
export const OVERALL_FORMULA_TITLE = 'Overall formula (reference)';

function group(
  title: string,
  percentOf: string,
  lines: readonly DoughLine[],
  totalLabel: string,
): LineGroup {
  return { title, percentOf, lines: lines.map(toAmountLine), totalLabel };
}

/**
 * Tempers the liquids of the lines weighed at the mixer: adds the liquid figures and warnings
 * and ices the plain water when the plan calls for it.
 */
function tempered(
  lines: DoughLine[],
  liquid: { celsius?: Decimal; rule?: string },
  tap: Decimal | undefined,
  out: { figures: Figure[]; warnings: string[] },
): DoughLine[] {
  if (liquid.celsius === undefined || liquid.rule === undefined) return lines;
  const plan: LiquidPlan = planLiquids(lines, liquid.celsius, liquid.rule, tap);
  out.figures.push(...plan.figures);
  out.warnings.push(...plan.warnings);
  if (!plan.iceFraction || tap === undefined) return lines;
  return splitWaterWithIce(lines, plan.iceFraction, tap);
}

function cautionsFor(formula: DoughFormula): Caution[] {
  const allergens = collectAllergens(formula.ingredients.map((ingredient) => ingredient.allergens));
  const allergen = allergenCaution(allergens);
  return [
    CAUTIONS.rawDough,
    ...(formula.ingredients.some((ingredient) => ingredient.raw_egg === true)
      ? [CAUTIONS.rawEgg]
      : []),
    ...(allergen ? [allergen] : []),
    // The formula's own cautions are not added here: calculate() puts them before local codes.
    CAUTIONS.localCodes,
  ];
}

// Flour moisture is left out on purpose: baker's hydration is the liquid added to the flour,
// which is how formulas are written and compared.
// source for the range in the note: USDA SR26, NDB 20080, 20081, 20083, field Water_(g)
function hydrationFigures(overall: readonly DoughLine[]): Figure[] {
  return [
    {
      label: 'Effective hydration',
      kind: 'percent',
      value: effectiveHydration(overall),
      note:
        'water in every ingredient with water_pct or a food (USDA SR Legacy, Release 26), % of total ' +
        "flour; the flour's own moisture (10.7–13.4 g per 100 g in USDA SR26) is not counted",
    },
    {
      label: 'Hydration (plain water only)',
      kind: 'percent',
      value: plainWaterHydration(overall),
      note: 'ingredients with food: water, % of total flour',
    },
  ];
}

/**
 * Works out a dough batch: the lines to weigh (with a preferment: the preferment, the final dough
 * and the overall formula for reference), hydration, the water temperature for the desired dough
 * temperature with ice when the tap is too warm, yeast converted to another kind on request,
 * and the pieces when scaled by pieces.
 * @param formula a dough formula that passed the schema; checkDoughFormula() is run again here
 * @param batch exactly one of pieces (with a piece weight), total or flour, plus optional
 *   temperatures and yeast kind
 * @throws BatchError when the batch size is missing, given twice or impossible
 * @throws Error when the formula has errors checkDoughFormula() reports
 */
export function calculateDough(
  formula: DoughFormula,
  batch: BatchInput,
  options: DoughOptions = {},
): CalcResult {
  const errors = checkDoughFormula(formula).filter((problem) => problem.severity === 'error');
  if (errors.length > 0) {
    throw new Error(
      `Formula "${formula.id}" cannot be used: ${errors.map((e) => e.message).join(' ')}`,
    );
  }
  const factors = options.yeastFactors ?? DEFAULT_YEAST_FACTORS;
  const scale = scaleDough(formula, batch);
  const flour = scale.flourGrams;
  const warnings = [...scale.warnings];
  const inputs: Figure[] = [...scale.inputs];

  const toKind = batch.yeast;
  const convert = (lines: DoughLine[]): DoughLine[] =>
    toKind ? lines.map((line) => convertYeastLine(line, toKind, factors)) : lines;
  if (toKind) {
    inputs.push({ label: 'Yeast', kind: 'text', value: yeastLabel(toKind), note: factors.name });
    if (!formula.ingredients.some((ingredient) => ingredient.yeast !== undefined)) {
      warnings.push(
        '--yeast was ignored: no ingredient of this formula is marked with its kind of yeast (yeast:).',
      );
    }
  }

  const asWritten = formula.ingredients.map((ingredient) =>
    lineAtPercent(ingredient, dec(ingredient.pct), flour),
  );
  const overall = convert(asWritten);
  // Only what the yeast conversion changed, so that the mixed dough stays exactly the scaled
  // weight otherwise (a sum of 40-digit quotients can be off in the 35th decimal).
  const yeastChange = sum(overall.map((line, index) => line.grams.minus(asWritten[index].grams)));
  const plan = planWaterTemperature(formula, batch, formula.preferment !== undefined);
  inputs.push(...plan.inputs);
  warnings.push(...plan.warnings);
  const liquid = { celsius: plan.liquidC, rule: plan.rule };
  const temperatureOut = { figures: [] as Figure[], warnings };

  const groups: LineGroup[] = [];
  const figures: Figure[] = [{ label: 'Total flour', kind: 'mass', value: flour }];
  const preferment = formula.preferment;
  if (!preferment) {
    groups.push(
      group('Dough', OF_TOTAL_FLOUR, tempered(overall, liquid, batch.tap, temperatureOut), 'Dough'),
    );
  } else {
    const split = splitPreferment(formula.ingredients, preferment, flour);
    const prefermentLines = convert(split.preferment);
    const final = [...convert(split.final), prefermentLine(preferment, prefermentLines)];
    groups.push(
      group(`Preferment: ${preferment.name}`, 'preferment flour', prefermentLines, preferment.name),
      group(
        'Final dough',
        OF_TOTAL_FLOUR,
        tempered(final, liquid, batch.tap, temperatureOut),
        'Final dough',
      ),
      group(OVERALL_FORMULA_TITLE, OF_TOTAL_FLOUR, overall, 'Overall'),
    );
    figures.push({
      label: 'Preferment flour',
      kind: 'mass',
      value: split.prefermentFlour,
      note: `${dec(preferment.flour_pct).toString()} % of the total flour`,
    });
  }

  const mixed = scale.doughGrams.plus(yeastChange);
  if (!yeastChange.isZero()) {
    warnings.push(
      `Converting the yeast changes the mixed dough by ${yeastChange.toFixed(1)} g; ` +
        'the flour and the other ingredients stay as the formula gives them.',
    );
  }
  figures.push(
    { label: 'Mixed dough', kind: 'mass', value: mixed },
    {
      label: 'Total formula',
      kind: 'percent',
      value: sum(overall.map((line) => line.percent)),
      note: "sum of the baker's percentages",
    },
    ...hydrationFigures(overall),
    ...temperatureOut.figures,
  );

  const portions = portionsOf(scale, mixed);
  return {
    formula: { id: formula.id, title: formula.title, kind: 'dough' },
    inputs,
    groups,
    steps: formula.steps ?? [],
    figures,
    checks: [],
    warnings,
    cautions: cautionsFor(formula),
    allergens: collectAllergens(formula.ingredients.map((ingredient) => ingredient.allergens)),
    ...(portions ? { portions } : {}),
    ...(formula.notes !== undefined ? { notes: formula.notes } : {}),
  };
}
