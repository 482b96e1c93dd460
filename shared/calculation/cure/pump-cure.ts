import { Decimal, HUNDRED, ZERO, fraction, sum } from '../../decimal.ts';
import type { CureFormula } from '../../formula/formula-types.ts';
import type { Figure } from '../calc-result.ts';
import { BatchError } from '../batch-error.ts';
import { brineStrength, brineStrengthFigures, checkBrineStrength } from './brine-strength.ts';
import { ownCoverBrine } from './cover-brine.ts';
import { pumpPercentFromWeights } from './ingoing.ts';
import { pumpIngoing, type PumpIngoing } from './pump-ingoing.ts';
import {
  makeUpGroup,
  substanceGrams,
  type CureSubstance,
  type MethodOutcome,
  type WeighedIngredient,
} from './cure-lines.ts';

/** The pump-method sizes a batch may override. */
export interface PumpOptions {
  /** Brine injected, % of green weight, instead of the formula's pump_pct. */
  readonly pump?: Decimal;
  /** Weight measured after injecting, grams: gives the pump % actually reached. */
  readonly pumpedWeight?: Decimal;
}

/**
 * Injection (pump) cure. Each ingredient's percentage is the level wanted in the meat, on green
 * weight; injecting brine at pump % p puts pct/p × 100 % of it into the brine. The brine made
 * covers what is injected, the cover brine when it is of the same make-up, and the formula's
 * extra for losses; a cover brine of its own make-up (cover_brine) is weighed on its own lines.
 * Ingoing ppm = substance in pickle × pump fraction × 1 000 000 / pickle weight (FSIS 7620.3 ch. 3),
 * on the pump % actually reached when the pumped weight is known; with a cover brine, the larger
 * of that and the figure counting the cover (pumpIngoing) is checked.
 */
export function pumpCure(
  formula: CureFormula,
  greenGrams: Decimal,
  options: PumpOptions,
): MethodOutcome {
  const designPump =
    options.pump ??
    (formula.brine?.pump_pct === undefined ? undefined : new Decimal(formula.brine.pump_pct));
  if (!designPump) {
    throw new BatchError(
      'this pump formula gives no pump_pct; say how much brine to inject with --pump',
      'pump',
    );
  }
  if (!designPump.isPositive() || designPump.isZero())
    throw new BatchError('--pump must be more than 0 %', 'pump');

  // Share of the brine taken by each ingredient, % by weight.
  const shares = formula.ingredients.map((ingredient) =>
    new Decimal(ingredient.pct).div(designPump).times(HUNDRED),
  );
  const solids = sum(shares);
  if (solids.greaterThanOrEqualTo(HUNDRED)) {
    throw new BatchError(
      `at ${designPump} % pump the brine would be ${solids.toFixed(1)} % ingredients and no water; inject more brine (raise --pump)`,
      'pump',
    );
  }
  const saltShare = sum(
    formula.ingredients.map((ingredient, i) =>
      shares[i].times(fraction(new Decimal(ingredient.salt ?? 0))),
    ),
  );
  const waterShare = HUNDRED.minus(solids);
  const strength = brineStrength(saltShare, waterShare);
  // A cover brine of the same make-up passes with this check; one of its own has its own.
  const strengthWarnings = checkBrineStrength(strength, {
    made: `at ${designPump} % pump`,
    fix: 'inject more brine (raise --pump)',
    option: 'pump',
  });

  const injected = greenGrams.times(fraction(designPump));
  const cover = greenGrams.times(fraction(new Decimal(formula.brine?.cover_pct ?? 0)));
  const ownCover =
    formula.cover_brine && !cover.isZero() ? ownCoverBrine(formula.cover_brine, cover) : undefined;
  const extra = fraction(new Decimal(formula.brine?.extra_pct ?? 0));
  const made = (ownCover ? injected : injected.plus(cover)).times(extra.plus(1));
  const weighed: WeighedIngredient[] = formula.ingredients.map((ingredient, i) => ({
    ingredient,
    grams: made.times(fraction(shares[i])),
  }));

  const actualPump = options.pumpedWeight
    ? pumpPercentFromWeights(options.pumpedWeight, greenGrams)
    : undefined;
  if (actualPump && !actualPump.isPositive()) {
    throw new BatchError('the pumped weight must be more than the green weight', 'pumped-weight');
  }
  const pumpForChecks = actualPump ?? designPump;
  const pickup = formula.brine?.cover_pickup_pct;
  const ingoing = (substance: CureSubstance): PumpIngoing => {
    const inPump = substanceGrams(weighed, substance);
    return pumpIngoing({
      greenGrams,
      pumpPercent: pumpForChecks,
      pumpSubstanceGrams: inPump,
      pumpPickleGrams: made,
      coverGrams: cover,
      coverSubstanceGrams: ownCover ? ownCover.substance(substance) : inPump.times(cover).div(made),
      ...(pickup === undefined ? {} : { pickupPercent: new Decimal(pickup) }),
    });
  };
  const nitrite = ingoing('nitrite');
  const warnings: string[] = [...strengthWarnings, ...(ownCover?.warnings ?? [])];
  if (actualPump && !actualPump.equals(designPump)) {
    warnings.push(
      `The meat took ${actualPump.toFixed(1)} % pump, not the ${designPump} % the brine is made for: ingoing levels are checked on ${actualPump.toFixed(1)} %.`,
    );
  }

  const inputs: Figure[] = [
    {
      label: 'Pump (brine made for)',
      kind: 'percent',
      value: designPump,
      note: options.pump ? 'as given' : 'from the formula',
    },
  ];
  if (options.pumpedWeight && actualPump) {
    inputs.push({ label: 'Weight after injecting', kind: 'mass', value: options.pumpedWeight });
    inputs.push({
      label: 'Pump reached',
      kind: 'percent',
      value: actualPump,
      note: '(pumped − green) ÷ green',
    });
  }

  return {
    groups: [
      makeUpGroup(
        { title: 'Brine make-up', percentOf: 'brine', totalLabel: 'Brine made' },
        made,
        waterShare,
        weighed,
        shares,
      ),
      ...(ownCover ? [ownCover.group] : []),
    ],
    inputs,
    figures: [
      ...(nitrite.withCover
        ? [
            {
              label: 'Ingoing sodium nitrite, injected brine only',
              kind: 'ppm' as const,
              value: nitrite.injected,
              note: 'FSIS pumped-product formula',
            },
            {
              label: 'Ingoing sodium nitrite, counting the cover brine',
              kind: 'ppm' as const,
              value: nitrite.withCover.value,
              note: nitrite.withCover.basis,
            },
          ]
        : []),
      { label: 'Brine to inject', kind: 'mass', value: injected },
      { label: 'Target weight after injecting', kind: 'mass', value: greenGrams.plus(injected) },
      ...(cover.greaterThan(ZERO)
        ? [
            {
              label: 'Cover brine',
              kind: 'mass' as const,
              value: cover,
              note: ownCover ? 'its own make-up' : 'the same brine as injected',
            },
          ]
        : []),
      ...brineStrengthFigures(strength),
      ...(ownCover?.figures ?? []),
    ],
    warnings,
    ppm: (substance) => ingoing(substance).checked,
    ...(cover.isZero() ? {} : { basis: (substance) => ingoing(substance).basis }),
  };
}
