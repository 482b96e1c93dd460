import { Decimal, ONE, fraction, sum } from '../../decimal.ts';
import { parseMass } from '../../units/mass.ts';
import type { RawBatchOptions } from '../batch-input.ts';
import { keptAfterLoss } from '../blend/blend-loss.ts';
import { doughForPieces } from '../dough/scale-dough.ts';
import { referenceFromFinished } from '../yields.ts';
import type { Need } from './plan-needs.ts';

/** The batch options for one formula's need, and what the kitchen should know about them. */
export interface PlannedSize {
  /** The options as `larder calc` takes them (without the start day). */
  readonly batch: RawBatchOptions;
  readonly warnings: readonly string[];
  /** A cure's green weight, grams: what the pull list asks for. */
  readonly green?: Decimal;
}

/** Decimal places kept when a blend's meat is worked back from its seasoned weight (10⁻²⁰ g). */
const MEAT_PLACES = 20;

const grams = (value: Decimal): string => `${value.toString()} g`;

/**
 * A blend's meat for a seasoned batch: seasoned ÷ (1 + Σ seasoning pct / 100). Rounded up at
 * 10⁻²⁰ g, so that the batch the calculator adds back up is never a hair short of its last
 * portion (a 40-digit quotient can be off in its last digit).
 */
export function blendMeatFor(seasonedGrams: Decimal, seasoningPcts: readonly number[]): Decimal {
  const seasoning = fraction(sum(seasoningPcts.map((pct) => new Decimal(pct))));
  return seasonedGrams.div(ONE.plus(seasoning)).toDecimalPlaces(MEAT_PLACES, Decimal.ROUND_UP);
}

/**
 * Sizes the batch of one formula from what the plan needs of it, carrying yields and losses
 * back to what is weighed:
 * - blend: seasoned weight = (portions × portion weight + amounts) ÷ (1 − loss_pct / 100); meat
 *   = that ÷ (1 + Σ seasoning pct / 100), calculated as `total`;
 * - dough: `pieces` of the formula's piece weight (its loss_pct applies), or, when amounts are
 *   needed too, `total` = pieces × piece ÷ (1 − loss / 100) + amounts;
 * - cure: `want` = slices × slice + amounts, worked back through the yields to the green weight;
 *   a cure without yields is planned at its green weight, with a warning;
 * - mix: `total` = the amounts.
 */
export function plannedSize(need: Need): PlannedSize {
  const { formula } = need;
  switch (formula.kind) {
    case 'blend': {
      const portion = formula.portion === undefined ? new Decimal(0) : parseMass(formula.portion);
      // What is portioned is what is left after the grinding and forming loss.
      const seasoned = need.portions.times(portion).plus(need.grams).div(keptAfterLoss(formula));
      const meat = blendMeatFor(
        seasoned,
        (formula.ingredients ?? []).map((i) => i.pct),
      );
      return { batch: { total: grams(meat) }, warnings: [] };
    }
    case 'dough': {
      if (need.grams.isZero()) return { batch: { pieces: need.pieces.toString() }, warnings: [] };
      if (need.pieces.isZero()) return { batch: { total: grams(need.grams) }, warnings: [] };
      const piece = parseMass(formula.piece ?? '');
      const loss = new Decimal(formula.loss_pct ?? 0);
      const forPieces = doughForPieces(need.pieces.toNumber(), piece, loss);
      return {
        batch: { total: grams(forPieces.plus(need.grams)) },
        warnings: [
          `${formula.title} is needed both by pieces and by weight: one batch of dough, from which ` +
            `${need.pieces.toString()} pieces of ${formula.piece} are divided (loss ${loss.toString()} %).`,
        ],
      };
    }
    case 'cure': {
      const sizes: RawBatchOptions = {
        ...(need.sizes.thicknessMm ? { thickness: `${need.sizes.thicknessMm.toString()} mm` } : {}),
        ...(need.sizes.largestPieceGrams
          ? { largestPiece: grams(need.sizes.largestPieceGrams) }
          : {}),
      };
      if (!formula.yields) {
        return {
          batch: { meat: grams(need.grams), ...sizes },
          green: need.grams,
          warnings: [
            `${formula.title} gives no yields, so its green weight was planned as the finished ` +
              'weight; add yields: to the formula to allow for what curing, smoking and slicing lose.',
          ],
        };
      }
      return {
        batch: { want: grams(need.grams), ...sizes },
        green: referenceFromFinished(need.grams, formula.yields),
        warnings: [],
      };
    }
    case 'mix':
      return { batch: { total: grams(need.grams) }, warnings: [] };
  }
}
