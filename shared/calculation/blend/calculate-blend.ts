import { Decimal, HUNDRED, fraction, sum } from '../../decimal.ts';
import type { Allergen, BlendFormula, Yields } from '../../formula/formula-types.ts';
import { CAUTIONS, allergenCaution } from '../../reference/cautions.ts';
import { parseMass } from '../../units/mass.ts';
import { collectAllergens } from '../allergens.ts';
import { cookingCaution } from '../cooking-caution.ts';
import { BatchError } from '../batch-error.ts';
import type { BatchInput } from '../batch-input.ts';
import type {
  AmountLine,
  CalcResult,
  Caution,
  Figure,
  LineGroup,
  Portions,
  YieldStage,
} from '../calc-result.ts';
import { yieldStages } from '../yields.ts';
import { batchFats, componentLabel, formulaTargetFat } from './blend-fat.ts';
import { keptAfterLoss, lossInput } from './blend-loss.ts';
import { blendMeat } from './blend-size.ts';
import { standardOutcome } from './blend-standard.ts';
import { blendFatPercent } from './pearson-square.ts';
import { portionsOf } from './portion.ts';

/** The target fat: the batch's --target-fat, else the formula's target. */
function targetFat(formula: BlendFormula, batch: BatchInput): { value: Decimal; note: string } {
  if (batch.targetFat === undefined)
    return { value: formulaTargetFat(formula), note: 'from the formula' };
  if (batch.targetFat.isNegative() || batch.targetFat.greaterThan(HUNDRED)) {
    throw new BatchError(
      `--target-fat must be between 0 and 100 %, not ${batch.targetFat} %`,
      'target-fat',
    );
  }
  return { value: batch.targetFat, note: 'from --target-fat' };
}

/** The portion weight: the batch's --portion, else the formula's; none when neither gives one. */
function portionGrams(formula: BlendFormula, batch: BatchInput): Figure | undefined {
  if (batch.portion !== undefined) {
    if (!batch.portion.greaterThan(0)) {
      throw new BatchError(`--portion must be more than 0 g, not ${batch.portion} g`, 'portion');
    }
    return { label: 'Portion', kind: 'mass', value: batch.portion, note: 'from --portion' };
  }
  if (formula.portion === undefined) return undefined;
  const note = `from the formula (${formula.portion})`;
  return { label: 'Portion', kind: 'mass', value: parseMass(formula.portion), note };
}

/**
 * Yield stages of a blend. Trimming happens to the meat alone, so the weight to buy comes from
 * the meat; every later step (cook…) happens to the seasoned batch after its grinding and
 * forming loss, so those stages start from that. Without seasoning or loss both are the raw
 * blend weight.
 */
function blendYields(meat: Decimal, formed: Decimal, yields: Yields): YieldStage[] {
  const { trim, ...afterTrim } = yields;
  return [
    ...yieldStages(meat, trim === undefined ? undefined : { trim }),
    ...yieldStages(formed, afterTrim),
  ];
}

function blendCautions(formula: BlendFormula, allergens: readonly Allergen[]): Caution[] {
  const cautions: Caution[] = [cookingCaution(formula.species, 'ground'), CAUTIONS.keepCold];
  const allergen = allergenCaution(allergens);
  if (allergen) cautions.push(allergen);
  // The formula's own cautions are added by calculate(), before the local-codes reminder.
  cautions.push(CAUTIONS.localCodes);
  return cautions;
}

/**
 * Works out a batch of a meat blend of two to five components at a target fat (two balances,
 * derived; the Pearson square for two; reachable only between the fats), with its seasoning,
 * loss, portions, yields, fat-standard checks and cautions.
 *
 * The batch is sized by `total` (raw meat weight) or `want` (finished weight, worked back through
 * the yields and loss), by `onHand` (components fixed by what is on hand), or by both
 * (blend-solve.ts). A fat test for a component replaces its formula fat for this batch. Figures
 * are computed back from the amounts, not copied from the target.
 * @param formula a blend formula that passed checkBlendFormula
 * @param batch the batch inputs, already parsed
 * @throws BatchError when the batch cannot be made: no size, a size not more than 0, an unknown
 *   key, a target fat outside 0–100 % or out of reach of the components, amounts on hand that
 *   leave it out of reach, or too few amounts on hand to make the blend determinate
 */
export function calculateBlend(formula: BlendFormula, batch: BatchInput): CalcResult {
  const target = targetFat(formula, batch);
  const seasoning = formula.ingredients ?? [];
  const seasoningFraction = fraction(sum(seasoning.map((i) => new Decimal(i.pct))));
  const fats = batchFats(formula, batch);
  const size = blendMeat(formula, batch, fats.fats, target.value, seasoningFraction);
  const parts = formula.components.map((component, i) => ({
    component,
    grams: size.amounts[i],
    fat: fats.fats[i],
  }));

  const meat = sum(size.amounts);
  const meatLines: AmountLine[] = parts.map(({ component, grams }, i) => ({
    name: componentLabel(component, fats.measured.get(i)),
    grams,
    percent: grams.div(meat).times(HUNDRED),
    role: 'component',
  }));
  const seasoningLines: AmountLine[] = seasoning.map((ingredient) => {
    const percent = new Decimal(ingredient.pct);
    return {
      name: ingredient.name,
      grams: meat.times(percent).div(HUNDRED),
      percent,
      role: 'ingredient',
    };
  });
  const groups: LineGroup[] = [
    { title: 'Meat', percentOf: 'blend weight', lines: meatLines, totalLabel: 'Total meat' },
  ];
  if (seasoningLines.length > 0) {
    groups.push({
      title: 'Seasoning',
      percentOf: 'meat weight',
      lines: seasoningLines,
      totalLabel: 'Total seasoning',
    });
  }
  const batchGrams = sum([...meatLines, ...seasoningLines].map((line) => line.grams));

  // Dividing at 40 digits leaves noise in the last digit (30 % can come back as 30.000…001 %),
  // which would fail a ceiling the blend meets exactly; 20 places is still far finer than any
  // lab measures fat.
  const fat = blendFatPercent(parts).toDecimalPlaces(20);
  const figures: Figure[] = [
    { label: 'Blend fat', kind: 'percent', value: fat },
    { label: 'Chemical lean', kind: 'percent', value: HUNDRED.minus(fat) },
    { label: 'Total batch weight', kind: 'mass', value: batchGrams },
  ];
  const standard = standardOutcome(formula, parts, fat);
  figures.push(...standard.figures);

  // Grinding and forming lose part of the batch before it is portioned and cooked.
  const formed = batchGrams.times(keptAfterLoss(formula));
  const loss = lossInput(formula);
  if (loss) {
    figures.push({
      label: 'After grinding and forming loss',
      kind: 'mass',
      value: formed,
      note: `${(loss.value as Decimal).toString()} % loss allowance`,
    });
  }

  const portion = portionGrams(formula, batch);
  let portions: Portions | undefined;
  if (portion) {
    portions = portionsOf(formed, portion.value as Decimal);
    const cook = formula.yields?.cook;
    if (cook !== undefined) {
      figures.push({
        label: 'Cooked portion',
        kind: 'mass',
        value: portions.pieceGrams.times(new Decimal(cook)).div(HUNDRED),
        note: `at ${cook} % cook yield`,
      });
    }
  }

  const allergens = collectAllergens(seasoning.map((i) => i.allergens));
  const inputs: Figure[] = [
    { label: 'Target fat', kind: 'percent', value: target.value, note: target.note },
    ...fats.inputs,
    ...size.inputs,
  ];
  if (loss) inputs.push(loss);
  if (portion) inputs.push(portion);

  return {
    formula: { id: formula.id, title: formula.title, kind: formula.kind },
    inputs,
    groups,
    steps: formula.steps ?? [],
    figures,
    checks: standard.checks,
    warnings: standard.warnings,
    cautions: blendCautions(formula, allergens),
    allergens,
    ...(formula.yields ? { yields: blendYields(meat, formed, formula.yields) } : {}),
    ...(portions ? { portions } : {}),
    ...(formula.notes === undefined ? {} : { notes: formula.notes }),
  };
}
