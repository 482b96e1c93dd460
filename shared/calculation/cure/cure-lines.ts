import { Decimal, fraction, sum } from '../../decimal.ts';
import type { CureIngredient } from '../../formula/formula-types.ts';
import type { AmountLine, Figure, LineGroup } from '../calc-result.ts';

/** How a brine's make-up is headed on the sheet. */
export interface MakeUpTitles {
  readonly title: string;
  readonly percentOf: string;
  readonly totalLabel: string;
}

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
  /** Strength of the brine the meat is held in to equilibrium, % salt: decides the default hold. */
  readonly heldInBrineStrength?: Decimal;
  /** Ingoing ppm of a substance, by the method's FSIS formula, on green weight. */
  readonly ppm: (substance: CureSubstance) => Decimal;
  /** Which FSIS formula gave that figure, in words, where the method has more than one. */
  readonly basis?: (substance: CureSubstance) => string | undefined;
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

/**
 * A brine's make-up to weigh: the water, then each ingredient, every line a percentage of the
 * brine made.
 * @param shares each ingredient's % of the brine, in the order of `weighed`
 */
export function makeUpGroup(
  titles: MakeUpTitles,
  brineGrams: Decimal,
  waterShare: Decimal,
  weighed: readonly WeighedIngredient[],
  shares: readonly Decimal[],
): LineGroup {
  return {
    ...titles,
    lines: [
      {
        name: 'water',
        grams: brineGrams.times(fraction(waterShare)),
        percent: waterShare,
        role: 'water',
      },
      ...weighed.map((w, i) => ingredientLine(w, shares[i])),
    ],
  };
}
