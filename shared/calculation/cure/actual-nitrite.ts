/**
 * The curing checks worked out again from what was actually weighed: the same FSIS formulas, the
 * same rule and the same checks as the calculation (checkIngoingLevels), on the real weights.
 */
import { Decimal, fraction, sum } from '../../decimal.ts';
import type { CureFormula } from '../../formula/formula-types.ts';
import { nitriteRuleFor } from '../../reference/nitrite-limits.ts';
import { BatchError } from '../batch-error.ts';
import type { LimitCheck } from '../calc-result.ts';
import { ownCoverBrine } from './cover-brine.ts';
import { substanceGrams, type CureSubstance, type WeighedIngredient } from './cure-lines.ts';
import { ppmAtEquilibrium, ppmOfGreenWeight, pumpPercentFromWeights } from './ingoing.ts';
import { checkIngoingLevels, type IngoingLevels } from './nitrite-checks.ts';
import { pumpIngoing } from './pump-ingoing.ts';

/** What was weighed for a cure: the green weight, each line by name, the pumped weight if any. */
export interface ActualCureWeights {
  readonly greenGrams: Decimal;
  /** Grams of each ingredient line, by its name on the sheet; a line not weighed is absent. */
  readonly lines: ReadonlyMap<string, Decimal>;
  /** Pump cures: the weight after pumping, from which the actual pick-up follows. */
  readonly pumpedGrams?: Decimal;
}

/** The sheet's name of the water line in a brine (cure-lines.ts makeUpGroup, brine-cure.ts). */
const WATER = 'water';

function weighedAmount(
  name: string,
  calculated: ReadonlyMap<string, Decimal>,
  actual: ActualCureWeights,
): Decimal {
  const grams = actual.lines.get(name) ?? calculated.get(name);
  if (!grams) throw new RangeError(`no weight for the line "${name}"`);
  return grams;
}

/** Each ingredient as actually weighed, or at its calculated amount when it was not. */
function weighedIngredients(
  formula: CureFormula,
  calculated: ReadonlyMap<string, Decimal>,
  actual: ActualCureWeights,
): WeighedIngredient[] {
  return formula.ingredients.map((ingredient) => ({
    ingredient,
    grams: weighedAmount(ingredient.name, calculated, actual),
  }));
}

/** Ingoing ppm by the method's FSIS formula on the actual weights. */
function actualPpm(
  formula: CureFormula,
  calculated: ReadonlyMap<string, Decimal>,
  actual: ActualCureWeights,
): { ppm: (substance: CureSubstance) => Decimal; basis?: (substance: CureSubstance) => string } {
  const green = actual.greenGrams;
  const weighed = weighedIngredients(formula, calculated, actual);
  if (formula.method === 'dry') {
    return { ppm: (substance) => ppmOfGreenWeight(substanceGrams(weighed, substance), green) };
  }
  // The brine as actually made up: its water and every ingredient line.
  const pickle = weighedAmount(WATER, calculated, actual).plus(sum(weighed.map((w) => w.grams)));
  if (formula.method === 'brine') {
    return {
      ppm: (substance) => ppmAtEquilibrium(substanceGrams(weighed, substance), green, pickle),
    };
  }
  const pump = actual.pumpedGrams
    ? pumpPercentFromWeights(actual.pumpedGrams, green)
    : new Decimal(formula.brine?.pump_pct ?? 0);
  if (!pump.isPositive() || pump.isZero()) {
    throw new BatchError('the pumped weight must be more than the green weight', 'pumped-weight');
  }
  const cover = green.times(fraction(new Decimal(formula.brine?.cover_pct ?? 0)));
  const ownCover =
    formula.cover_brine && !cover.isZero() ? ownCoverBrine(formula.cover_brine, cover) : undefined;
  const pickup = formula.brine?.cover_pickup_pct;
  const ingoing = (substance: CureSubstance) => {
    const inPickle = substanceGrams(weighed, substance);
    return pumpIngoing({
      greenGrams: green,
      pumpPercent: pump,
      pumpSubstanceGrams: inPickle,
      pumpPickleGrams: pickle,
      coverGrams: cover,
      // A cover of the injected brine carries that brine's strength as it was made up.
      coverSubstanceGrams: ownCover
        ? ownCover.substance(substance)
        : inPickle.times(cover).div(pickle),
      ...(pickup === undefined ? {} : { pickupPercent: new Decimal(pickup) }),
    });
  };
  return {
    ppm: (substance) => ingoing(substance).checked,
    ...(cover.isZero() ? {} : { basis: (substance: CureSubstance) => ingoing(substance).basis }),
  };
}

/**
 * The cure's limit checks (nitrite, nitrate, accelerator…) on the actual weights, with the same
 * ids and limits as the calculation's; a line not weighed counts at its calculated amount. Dry
 * cures: the curing-salt lines over the actual green weight; brine and pump cures: the brine as
 * actually made up, and for a pump the pick-up reached ((pumped − green) ÷ green) when the
 * pumped weight is given, else the formula's pump %. Empty when no rule covers the product and
 * method (the calculation refuses such a batch).
 * @param calculated the calculation's own grams per line, by name
 */
export function actualCureChecks(
  formula: CureFormula,
  calculated: ReadonlyMap<string, Decimal>,
  actual: ActualCureWeights,
): LimitCheck[] {
  const rule = nitriteRuleFor(formula.product, formula.method);
  if (!rule) return [];
  const { ppm, basis } = actualPpm(formula, calculated, actual);
  const levels: IngoingLevels = {
    nitrite: ppm('nitrite'),
    nitrate: ppm('nitrate'),
    accelerator: ppm('accelerator'),
    ...(basis
      ? {
          basis: {
            nitrite: basis('nitrite'),
            nitrate: basis('nitrate'),
            accelerator: basis('accelerator'),
          },
        }
      : {}),
  };
  return checkIngoingLevels(rule, levels);
}
