import { Decimal, fraction } from '../../decimal.ts';
import type { CureFormula } from '../../formula/formula-types.ts';
import { ppmOfGreenWeight } from './ingoing.ts';
import {
  ingredientLine,
  substanceGrams,
  type MethodOutcome,
  type WeighedIngredient,
} from './cure-lines.ts';

/**
 * Dry (equilibrium) cure: each ingredient is a percentage of green weight and all of the mix goes
 * on the meat, so ingoing ppm = substance × 1 000 000 / green weight (FSIS 7620.3 ch. 3, the
 * comminuted and dry-cure formulas, which agree when the whole mix is applied).
 */
export function dryCure(formula: CureFormula, greenGrams: Decimal): MethodOutcome {
  const weighed: WeighedIngredient[] = formula.ingredients.map((ingredient) => ({
    ingredient,
    grams: greenGrams.times(fraction(new Decimal(ingredient.pct))),
  }));
  const salt = substanceGrams(weighed, 'salt');
  return {
    groups: [
      {
        title: formula.product === 'comminuted' ? 'Cure mix (mix into the meat)' : 'Cure mix',
        percentOf: 'green weight',
        lines: weighed.map((w) => ingredientLine(w, new Decimal(w.ingredient.pct))),
        totalLabel: 'Cure mix',
      },
    ],
    inputs: [],
    figures: [
      {
        label: 'Salt (sodium chloride) on the meat',
        kind: 'percent',
        value: salt.div(greenGrams).times(100),
        note: 'of green weight, from all salt-bearing ingredients',
      },
    ],
    warnings: [],
    ppm: (substance) => ppmOfGreenWeight(substanceGrams(weighed, substance), greenGrams),
  };
}
