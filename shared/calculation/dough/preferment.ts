import { Decimal, HUNDRED, dec, sum } from '../../decimal.ts';
import type { DoughIngredient, Preferment } from '../../formula/formula-types.ts';
import { findIngredient, gramsAtPercent } from './bakers-percent.ts';
import { lineAtPercent, type DoughLine } from './dough-line.ts';

/** A dough split into a preferment made ahead and the final dough that uses it. */
export interface PrefermentSplit {
  /** Flour in the preferment, grams: total flour × flour_pct / 100. */
  readonly prefermentFlour: Decimal;
  /** The preferment's lines, each in % of the preferment's own flour. */
  readonly preferment: DoughLine[];
  /**
   * The final dough's own lines (overall − preferment, per ingredient), in % of the total flour;
   * ingredients used up by the preferment are left out. The preferment line is added later, with
   * {@link prefermentLine}, once the preferment's lines are final.
   */
  readonly final: DoughLine[];
}

/**
 * Share of the total flour that one preferment ingredient takes: flour_pct × pct / 100, in % of
 * total flour (a 30 % poolish at 100 % hydration takes 30 % of the water's baker's percentage).
 * source: Bread Bakers Guild of America, Formatting Guild Formulas (2009)
 */
export function prefermentShare(preferment: Preferment, pct: number): Decimal {
  return dec(preferment.flour_pct).times(dec(pct)).div(HUNDRED);
}

function requireIngredient(ingredients: readonly DoughIngredient[], name: string): DoughIngredient {
  const found = findIngredient(ingredients, name);
  // checkDoughFormula() reports this with its path; reaching it here is a programming error.
  if (!found) throw new Error(`preferment ingredient "${name}" is not in the overall formula`);
  return found;
}

/**
 * Splits the overall formula into the preferment and the final dough. Percentages are
 * subtracted before grams are worked out, so that an ingredient the preferment uses up comes to
 * exactly zero and is left out of the final dough.
 * @param ingredients the overall formula
 * @param preferment the preferment, already checked by checkDoughFormula()
 * @param flourGrams total flour in the batch
 */
export function splitPreferment(
  ingredients: readonly DoughIngredient[],
  preferment: Preferment,
  flourGrams: Decimal,
): PrefermentSplit {
  const prefermentFlour = gramsAtPercent(flourGrams, dec(preferment.flour_pct));
  const taken = new Map<DoughIngredient, Decimal>();
  const lines = preferment.ingredients.map((entry) => {
    const ingredient = requireIngredient(ingredients, entry.name);
    taken.set(
      ingredient,
      (taken.get(ingredient) ?? new Decimal(0)).plus(prefermentShare(preferment, entry.pct)),
    );
    return lineAtPercent(ingredient, dec(entry.pct), prefermentFlour);
  });
  const final: DoughLine[] = [];
  for (const ingredient of ingredients) {
    const left = dec(ingredient.pct).minus(taken.get(ingredient) ?? 0);
    if (left.isNegative()) {
      // checkDoughFormula() reports this; reaching it here is a programming error.
      throw new Error(
        `the preferment needs more ${ingredient.name} than the overall formula holds`,
      );
    }
    if (!left.isZero()) final.push(lineAtPercent(ingredient, left, flourGrams));
  }
  return { prefermentFlour, preferment: lines, final };
}

/**
 * The line for the whole preferment in the final dough: everything weighed for the preferment,
 * in % of the total flour.
 * @param lines the preferment's lines as weighed (after any yeast conversion)
 */
export function prefermentLine(preferment: Preferment, lines: readonly DoughLine[]): DoughLine {
  const ownPercent = sum(lines.map((line) => line.percent));
  return {
    name: preferment.name,
    grams: sum(lines.map((line) => line.grams)),
    percent: ownPercent.times(dec(preferment.flour_pct)).div(HUNDRED),
    role: 'preferment',
    note: `made ahead from ${dec(preferment.flour_pct).toString()} % of the total flour`,
  };
}
