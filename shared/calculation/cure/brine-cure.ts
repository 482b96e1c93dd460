import { Decimal, ONE, fraction, sum } from '../../decimal.ts';
import type { CureFormula } from '../../formula/formula-types.ts';
import { BatchError } from '../batch-error.ts';
import { brineStrength, brineStrengthFigures, checkBrineStrength } from './brine-strength.ts';
import { ppmAtEquilibrium } from './ingoing.ts';
import {
  ingredientLine,
  substanceGrams,
  type MethodOutcome,
  type WeighedIngredient,
} from './cure-lines.ts';

/**
 * Equilibrium brine: the meat is held in water with each ingredient a percentage of meat plus
 * water, until salt and cure are even throughout. Ingoing ppm = substance × 1 000 000 / (green
 * weight + pickle weight), FSIS 7620.3 ch. 3 immersion "Method Two".
 * @param waterGrams water weight given for this batch; otherwise the formula's water_pct is used
 */
export function brineCure(
  formula: CureFormula,
  greenGrams: Decimal,
  waterGrams?: Decimal,
): MethodOutcome {
  const waterPct = formula.brine?.water_pct;
  if (!waterGrams && waterPct === undefined) {
    throw new BatchError(
      'this brine formula gives no water_pct; say how much water with --water',
      'water',
    );
  }
  const water = waterGrams ?? greenGrams.times(fraction(new Decimal(waterPct ?? 0)));
  const weighed = weighOnMeatAndWater(formula, greenGrams, water);
  const pickle = water.plus(sum(weighed.map((w) => w.grams)));
  const salt = substanceGrams(weighed, 'salt');
  const strength = brineStrength(salt, water);
  const warnings = checkBrineStrength(
    strength,
    waterGrams
      ? { made: `with ${water.toString()} g of water`, fix: 'use more water', option: 'water' }
      : {
          made: `with water at ${waterPct} % of the meat (the formula's water_pct)`,
          fix: 'raise water_pct, or give more water with --water',
        },
  );
  return {
    groups: [
      {
        title: 'Brine',
        percentOf: 'meat + water',
        lines: [
          { name: 'water', grams: water, role: 'water' },
          ...weighed.map((w) => ingredientLine(w, new Decimal(w.ingredient.pct))),
        ],
        totalLabel: 'Brine',
      },
    ],
    inputs: [
      {
        label: 'Water',
        kind: 'mass',
        value: water,
        note: waterGrams ? 'as given' : `${waterPct} % of green weight, from the formula`,
      },
    ],
    figures: [
      ...brineStrengthFigures(strength),
      {
        label: 'Salt in the meat at equilibrium',
        kind: 'percent',
        value: salt.div(greenGrams.plus(pickle)).times(100),
        note: 'of meat + brine',
      },
    ],
    warnings,
    heldInBrineStrength: strength,
    ppm: (substance) => ppmAtEquilibrium(substanceGrams(weighed, substance), greenGrams, pickle),
  };
}

/** Each ingredient weighed as its percentage of meat plus water. */
function weighOnMeatAndWater(
  formula: CureFormula,
  greenGrams: Decimal,
  waterGrams: Decimal,
): WeighedIngredient[] {
  const system = greenGrams.plus(waterGrams);
  return formula.ingredients.map((ingredient) => ({
    ingredient,
    grams: system.times(fraction(new Decimal(ingredient.pct))),
  }));
}

/**
 * Strength of the brine a brine-method formula makes with its own water_pct, salt ÷ (salt +
 * water) × 100; undefined when the formula gives no water_pct.
 */
export function formulaBrineStrength(formula: CureFormula): Decimal | undefined {
  const waterPct = formula.brine?.water_pct;
  if (waterPct === undefined) return undefined;
  const water = fraction(new Decimal(waterPct));
  return brineStrength(substanceGrams(weighOnMeatAndWater(formula, ONE, water), 'salt'), water);
}
