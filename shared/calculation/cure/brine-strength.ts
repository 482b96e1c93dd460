import { Decimal, HUNDRED } from '../../decimal.ts';
import { BatchError } from '../batch-error.ts';
import type { Figure } from '../calc-result.ts';

/**
 * Salt in a saturated sodium chloride brine at 60 °F, % by weight: 100 degrees salinometer.
 * source: "The Salometer and How to Use It", meat-plant equipment technical note, section 14
 */
export const SATURATED_BRINE_SALT_PCT = new Decimal('26.395');

/** Brine strength: salt ÷ (salt + water) × 100, % by weight. */
export function brineStrength(saltGrams: Decimal, waterGrams: Decimal): Decimal {
  const brine = saltGrams.plus(waterGrams);
  return brine.isZero() ? new Decimal(0) : saltGrams.div(brine).times(HUNDRED);
}

/**
 * Degrees salinometer (°SAL) on the 60 °F scale: strength ÷ 26.395 × 100.
 * source: "The Salometer and How to Use It" (see SATURATED_BRINE_SALT_PCT)
 */
export function salinometerDegrees(strengthPercent: Decimal): Decimal {
  return strengthPercent.div(SATURATED_BRINE_SALT_PCT).times(HUNDRED);
}

/**
 * A brine's strength and its salinometer reading, as figures for the sheet.
 * @param labels the two labels, for a sheet with more than one brine
 */
export function brineStrengthFigures(
  strength: Decimal,
  labels = { strength: 'Brine strength', salinometer: 'Salinometer' },
): Figure[] {
  return [
    { label: labels.strength, kind: 'percent', value: strength, note: 'salt ÷ (salt + water)' },
    {
      label: labels.salinometer,
      kind: 'salinometer',
      value: salinometerDegrees(strength),
      note: '60 °F scale',
    },
  ];
}

/**
 * From this many degrees salinometer a brine is close to saturated: the last of the salt
 * dissolves slowly, less of it in a cold brine, and what lies undissolved on the bottom is not in
 * the brine the sheet counts on. (common practice, no source)
 */
export const NEAR_SATURATION_DEGREES = new Decimal(95);

/** What fixed a brine's strength and how to weaken it, for the words of a refusal. */
export interface BrineSource {
  /** What made the brine this strong, e.g. "at 10 % pump" or "with 800 g of water". */
  readonly made: string;
  /** What to change, e.g. "raise --pump". */
  readonly fix: string;
  /** The batch option at fault; none when the formula itself makes the brine. */
  readonly option?: string;
}

/**
 * The one saturation rule for every brine a cure makes (equilibrium brine, pump and cover brine):
 * a brine stronger than saturated is refused, since no stirring dissolves that much salt and
 * every figure worked out from it would be wrong; one from 95 °SAL up gets a warning. Compares
 * the unrounded strength.
 * @param strength salt ÷ (salt + water) × 100, % by weight (brineStrength)
 * @returns the warnings for the batch (none, or one near saturation)
 * @throws BatchError naming the option at fault when the brine is stronger than saturated
 */
export function checkBrineStrength(strength: Decimal, source: BrineSource): string[] {
  if (strength.greaterThan(SATURATED_BRINE_SALT_PCT)) {
    throw new BatchError(
      `${source.made}, the brine would be ${strength.toFixed(1)} % salt: more than water can ` +
        `dissolve (${SATURATED_BRINE_SALT_PCT} %, 100 °SAL at 60 °F); ${source.fix}`,
      source.option,
    );
  }
  const degrees = salinometerDegrees(strength);
  if (degrees.lessThan(NEAR_SATURATION_DEGREES)) return [];
  return [
    `The brine is ${strength.toFixed(1)} % salt (${degrees.toFixed(0)} °SAL), close to saturated ` +
      `(${SATURATED_BRINE_SALT_PCT} %, 100 °SAL): salt may be left undissolved, more so in a cold ` +
      `brine; stir until it is clear and check it with a salinometer.`,
  ];
}
