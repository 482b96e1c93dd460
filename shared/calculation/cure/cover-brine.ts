import { Decimal, HUNDRED, fraction, sum } from '../../decimal.ts';
import type { CureIngredient } from '../../formula/formula-types.ts';
import type { Figure, LineGroup } from '../calc-result.ts';
import { BatchError } from '../batch-error.ts';
import { brineStrength, brineStrengthFigures, checkBrineStrength } from './brine-strength.ts';
import {
  makeUpGroup,
  substanceGrams,
  type CureSubstance,
  type WeighedIngredient,
} from './cure-lines.ts';

/** A cover brine of its own make-up: what to weigh, its strength, and what it carries. */
export interface OwnCoverBrine {
  readonly group: LineGroup;
  readonly figures: Figure[];
  readonly warnings: string[];
  /** Grams of a substance in the whole cover brine. */
  readonly substance: (substance: CureSubstance) => Decimal;
}

/**
 * The cover brine a pump cure holds the meat in, when it is not the injected brine: each
 * ingredient is a percentage of the cover brine by weight and water makes up the rest. Its
 * strength is held to the same saturation rule as every brine (checkBrineStrength).
 * @throws BatchError when the ingredients leave no water, or the brine is saltier than saturated
 */
export function ownCoverBrine(
  ingredients: readonly CureIngredient[],
  coverGrams: Decimal,
): OwnCoverBrine {
  const shares = ingredients.map((ingredient) => new Decimal(ingredient.pct));
  const waterShare = HUNDRED.minus(sum(shares));
  if (!waterShare.isPositive() || waterShare.isZero()) {
    throw new BatchError(
      `the cover brine's ingredients come to ${sum(shares).toString()} % of it, leaving no water; make it weaker`,
    );
  }
  const weighed: WeighedIngredient[] = ingredients.map((ingredient, i) => ({
    ingredient,
    grams: coverGrams.times(fraction(shares[i])),
  }));
  const saltShare = sum(
    ingredients.map((ingredient, i) =>
      shares[i].times(fraction(new Decimal(ingredient.salt ?? 0))),
    ),
  );
  const strength = brineStrength(saltShare, waterShare);
  const warnings = checkBrineStrength(strength, {
    made: 'in the cover brine',
    fix: 'use less salt in the cover brine',
  });
  return {
    group: makeUpGroup(
      { title: 'Cover brine make-up', percentOf: 'cover brine', totalLabel: 'Cover brine made' },
      coverGrams,
      waterShare,
      weighed,
      shares,
    ),
    figures: brineStrengthFigures(strength, {
      strength: 'Cover brine strength',
      salinometer: 'Cover brine salinometer',
    }),
    warnings,
    substance: (substance) => substanceGrams(weighed, substance),
  };
}
