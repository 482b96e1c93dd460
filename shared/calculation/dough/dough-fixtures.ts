import { type Decimal, sum } from '../../decimal.ts';
import type { DoughFormula, DoughIngredient, Preferment } from '../../formula/formula-types.ts';
import type { CalcResult, Figure, LineGroup } from '../calc-result.ts';

// Formulas shared by the dough specs; kept out of the *.spec.ts files so each spec stays short.

/** A formula from its ingredients, with the required keys filled in. */
export function doughFormula(
  ingredients: DoughIngredient[],
  extra: Partial<Omit<DoughFormula, 'ingredients' | 'kind'>> = {},
): DoughFormula {
  return {
    formula: 1,
    id: 'test-dough',
    title: 'Test dough',
    kind: 'dough',
    ingredients,
    ...extra,
  };
}

/**
 * Lean bread, flour 100, water 67, salt 2, yeast 1 = 170 %.
 * source: course worksheet, pieces × piece weight (issuing school not identified)
 */
export function leanDough(
  extra: Partial<Omit<DoughFormula, 'ingredients' | 'kind'>> = {},
): DoughFormula {
  return doughFormula(
    [
      { name: 'Bread flour', pct: 100, flour: true, allergens: ['wheat'] },
      { name: 'Water', pct: 67, food: 'water' },
      { name: 'Salt', pct: 2 },
      { name: 'Yeast', pct: 1, yeast: 'fresh', food: 'yeast-fresh' },
    ],
    extra,
  );
}

/**
 * Enriched buns, 182.8 %: bread flour 100, whole milk 50, whole egg 10, butter 10, honey 5,
 * water 5, instant yeast 1, salt 1.8. own example, derived (baker's percent as in the Bread
 * Bakers Guild of America formula layout standards, 2009)
 */
export function bunDough(
  extra: Partial<Omit<DoughFormula, 'ingredients' | 'kind'>> = {},
): DoughFormula {
  return doughFormula(
    [
      { name: 'Bread flour', pct: 100, flour: true, allergens: ['wheat'] },
      { name: 'Whole milk', pct: 50, food: 'milk-whole', allergens: ['milk'] },
      { name: 'Whole egg', pct: 10, food: 'egg-whole', raw_egg: true, allergens: ['egg'] },
      { name: 'Butter', pct: 10, food: 'butter-salted', allergens: ['milk'] },
      { name: 'Honey', pct: 5, food: 'honey' },
      { name: 'Water', pct: 5, food: 'water' },
      { name: 'Instant yeast', pct: 1, yeast: 'instant' },
      { name: 'Salt', pct: 1.8 },
    ],
    extra,
  );
}

/** A 30 % poolish: flour 100, water 100, fresh yeast 0.3 of its own flour. own example */
export const POOLISH: Preferment = {
  name: 'Poolish',
  flour_pct: 30,
  ingredients: [
    { name: 'bread flour', pct: 100 },
    { name: 'Water', pct: 100 },
    { name: 'Fresh yeast', pct: 0.3 },
  ],
};

/**
 * Baguette with a poolish: bread flour 100, water 70, salt 2, fresh yeast 1.5 = 173.5 %.
 * own example, derived
 */
export function poolishDough(preferment: Preferment = POOLISH): DoughFormula {
  return doughFormula(
    [
      { name: 'Bread flour', pct: 100, flour: true, allergens: ['wheat'] },
      { name: 'Water', pct: 70, food: 'water' },
      { name: 'Salt', pct: 2 },
      { name: 'Fresh yeast', pct: 1.5, yeast: 'fresh', food: 'yeast-fresh' },
    ],
    { preferment },
  );
}

/** A group's lines as name → grams to a number of decimals. */
export function gramsByName(group: LineGroup, places: number): Record<string, string> {
  return Object.fromEntries(group.lines.map((line) => [line.name, line.grams.toFixed(places)]));
}

/** The exact sum of a group's lines, grams. */
export function groupTotal(group: LineGroup): Decimal {
  return sum(group.lines.map((line) => line.grams));
}

/** A result's figure by label. */
export function figure(result: CalcResult, label: string): Figure | undefined {
  return result.figures.find((f) => f.label === label);
}

/** A result's numeric figure by label; throws when there is none. */
export function figureValue(result: CalcResult, label: string): Decimal {
  const value = figure(result, label)?.value;
  if (value === undefined || typeof value === 'string')
    throw new Error(`no numeric figure "${label}"`);
  return value;
}
