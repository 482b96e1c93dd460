import { Decimal, fraction, sum } from '../../decimal.ts';
import type { CureIngredient } from '../../formula/formula-types.ts';
import type { AmountLine, Figure, LineGroup } from '../calc-result.ts';

/** A substance a cure ingredient may carry, as declared in the formula (% by weight). */
export type CureSubstance = 'nitrite' | 'nitrate' | 'salt' | 'accelerator';

/** A cure ingredient with the exact amount of it in the batch. */
export interface WeighedIngredient {
  readonly ingredient: CureIngredient;
  readonly grams: Decimal;
}

/** What one cure method works out: the lines to weigh and the ingoing ppm by its own formula. */
export interface MethodOutcome {
  readonly groups: LineGroup[];
  readonly inputs: Figure[];
  readonly figures: Figure[];
  readonly warnings: string[];
  /** Ingoing ppm of a substance, by the method's FSIS formula, on green weight. */
  readonly ppm: (substance: CureSubstance) => Decimal;
}

/** Grams of a substance carried by the weighed ingredients. */
export function substanceGrams(
  weighed: readonly WeighedIngredient[],
  substance: CureSubstance,
): Decimal {
  return sum(
    weighed.map(({ ingredient, grams }) =>
      grams.times(fraction(new Decimal(ingredient[substance] ?? 0))),
    ),
  );
}

/** Whether an ingredient carries nitrite or nitrate, and so is weighed and printed as curing salt. */
export function isCuringSalt(ingredient: CureIngredient): boolean {
  return (ingredient.nitrite ?? 0) > 0 || (ingredient.nitrate ?? 0) > 0;
}

/** The line to weigh for one ingredient. */
export function ingredientLine(weighed: WeighedIngredient, percent: Decimal): AmountLine {
  const { ingredient, grams } = weighed;
  return {
    name: ingredient.name,
    grams,
    percent,
    role: isCuringSalt(ingredient) ? 'curing-salt' : 'ingredient',
  };
}
