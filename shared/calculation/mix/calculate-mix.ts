import { Decimal, HUNDRED, sum } from '../../decimal.ts';
import type { Allergen, MixFormula, MixIngredient } from '../../formula/formula-types.ts';
import { CAUTIONS, allergenCaution } from '../../reference/cautions.ts';
import { collectAllergens } from '../allergens.ts';
import { BatchError } from '../batch-error.ts';
import type { BatchInput } from '../batch-input.ts';
import type { AmountLine, CalcResult, Caution, Figure } from '../calc-result.ts';

/**
 * The formula's base ingredient: the one marked base, at 100 %.
 * @throws Error when the formula has no base, several, or a base not at 100 % (checkMixFormula
 *   reports these; a formula that passed it never throws here)
 */
export function baseIngredient(formula: MixFormula): MixIngredient {
  const bases = formula.ingredients.filter((ingredient) => ingredient.base === true);
  if (bases.length !== 1) {
    throw new Error(
      `mix formula "${formula.id}" has ${bases.length} base ingredients, not one; check the formula first`,
    );
  }
  if (!new Decimal(bases[0].pct).equals(HUNDRED)) {
    throw new Error(`mix formula "${formula.id}": the base "${bases[0].name}" must be at 100 %`);
  }
  return bases[0];
}

/** The base weight from --base, or from --total ÷ (Σ pct ÷ 100), with the input echoed. */
function baseGrams(
  formula: MixFormula,
  base: MixIngredient,
  batch: BatchInput,
): { grams: Decimal; input: Figure } {
  if (batch.base !== undefined && batch.total !== undefined) {
    throw new BatchError('Give only one of --base or --total, not both.', 'total');
  }
  if (batch.base !== undefined) {
    if (!batch.base.greaterThan(0)) {
      throw new BatchError(`--base must be more than 0 g, not ${batch.base} g`, 'base');
    }
    return {
      grams: batch.base,
      input: { label: `base: ${base.name}`, kind: 'mass', value: batch.base },
    };
  }
  if (batch.total !== undefined) {
    if (!batch.total.greaterThan(0)) {
      throw new BatchError(`--total must be more than 0 g, not ${batch.total} g`, 'total');
    }
    const allPercent = sum(formula.ingredients.map((ingredient) => new Decimal(ingredient.pct)));
    // Multiply before dividing: one rounding, and none when the percentages divide the total.
    const grams = batch.total.times(HUNDRED).div(allPercent);
    return { grams, input: { label: 'Total weight', kind: 'mass', value: batch.total } };
  }
  throw new BatchError(
    `Give the batch size with --base (weight of ${base.name}) or --total (weight of the whole mix).`,
  );
}

/** Allergens of the mix; a raw-egg ingredient counts as egg even when it does not say so. */
function mixAllergens(formula: MixFormula): Allergen[] {
  return collectAllergens(
    formula.ingredients.map((ingredient) =>
      ingredient.raw_egg ? [...(ingredient.allergens ?? []), 'egg'] : ingredient.allergens,
    ),
  );
}

/**
 * Works out a batch of a mix (a sauce, a spice blend…) whose ingredients are percentages of one
 * base ingredient. The batch is sized by exactly one of `base` (the base ingredient's weight;
 * each ingredient = base × pct ÷ 100) or `total` (base = total ÷ (Σ pct ÷ 100)).
 * @param formula a mix formula that passed checkMixFormula
 * @param batch the batch inputs, already parsed
 * @throws BatchError when neither or both sizes are given, or the size is not more than 0
 */
export function calculateMix(formula: MixFormula, batch: BatchInput): CalcResult {
  const base = baseIngredient(formula);
  const size = baseGrams(formula, base, batch);

  const lines: AmountLine[] = formula.ingredients.map((ingredient) => {
    const percent = new Decimal(ingredient.pct);
    return {
      name: ingredient.name,
      grams: size.grams.times(percent).div(HUNDRED),
      percent,
      role: 'ingredient',
      ...(ingredient.raw_egg ? { note: 'raw egg: use pasteurized' } : {}),
    };
  });
  const total = sum(lines.map((line) => line.grams));

  const allergens = mixAllergens(formula);
  const cautions: Caution[] = [];
  if (formula.ingredients.some((ingredient) => ingredient.raw_egg)) {
    cautions.push(CAUTIONS.rawEgg, CAUTIONS.keepCold);
  }
  const allergen = allergenCaution(allergens);
  if (allergen) cautions.push(allergen);
  // The formula's own cautions are added by calculate(), before the local-codes reminder.
  cautions.push(CAUTIONS.localCodes);

  return {
    formula: { id: formula.id, title: formula.title, kind: formula.kind },
    inputs: [size.input],
    groups: [{ title: 'Mix', percentOf: 'base', lines, totalLabel: 'Total' }],
    steps: formula.steps ?? [],
    figures: [{ label: 'Total weight', kind: 'mass', value: total }],
    checks: [],
    warnings: [],
    cautions,
    allergens,
    ...(formula.notes === undefined ? {} : { notes: formula.notes }),
  };
}
