import type { Decimal } from '../../decimal.ts';
import { HUNDRED, dec, sum } from '../../decimal.ts';
import type { DoughIngredient } from '../../formula/formula-types.ts';

/**
 * The key two ingredient names are matched by: trimmed and lower-cased, so that "Bread flour"
 * in a preferment finds "bread flour" in the overall formula.
 */
export function nameKey(name: string): string {
  return name.trim().toLowerCase();
}

/** The overall-formula ingredient with this name, matched by {@link nameKey}. */
export function findIngredient(
  ingredients: readonly DoughIngredient[],
  name: string,
): DoughIngredient | undefined {
  const key = nameKey(name);
  return ingredients.find((ingredient) => nameKey(ingredient.name) === key);
}

/**
 * The total formula percentage: the sum of all baker's percentages, e.g. 170 for flour 100,
 * water 67, salt 2, yeast 1. source: Bread Bakers Guild of America, Formatting Guild Formulas (2009)
 */
export function totalFormulaPercent(ingredients: readonly { pct: number }[]): Decimal {
  return sum(ingredients.map((ingredient) => dec(ingredient.pct)));
}

/** The sum of the flour percentages; 100 in a sound formula. */
export function flourPercent(ingredients: readonly DoughIngredient[]): Decimal {
  return totalFormulaPercent(ingredients.filter((ingredient) => ingredient.flour === true));
}

/**
 * Flour for a wanted dough weight: flour = dough ÷ (total formula % / 100).
 * source: Professional Cooking, procedure for converting a formula to a new yield
 * @param doughGrams the mixed dough wanted
 * @param totalPercent the total formula percentage, more than 0
 */
export function flourForDough(doughGrams: Decimal, totalPercent: Decimal): Decimal {
  if (!totalPercent.greaterThan(0))
    throw new RangeError('flourForDough: the formula adds up to 0 %');
  // Multiply before dividing so that round figures stay exact (28 470 × 100 ÷ 170).
  return doughGrams.times(HUNDRED).div(totalPercent);
}

/** The dough a flour weight makes: flour × total formula % / 100. */
export function doughForFlour(flourGrams: Decimal, totalPercent: Decimal): Decimal {
  return flourGrams.times(totalPercent).div(HUNDRED);
}

/** One ingredient's weight from its baker's percentage: flour × pct / 100. */
export function gramsAtPercent(flourGrams: Decimal, percent: Decimal): Decimal {
  return flourGrams.times(percent).div(HUNDRED);
}
