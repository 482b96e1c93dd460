import type { Decimal } from '../../decimal.ts';
import { MILLION, fraction } from '../../decimal.ts';

// The FSIS calculation formulas. Any consistent mass unit works; we use grams throughout.
// source: USDA FSIS Directive 7620.3, Processing Inspectors' Calculations Handbook (1995), ch. 3

/**
 * Ingoing ppm when the substance goes straight onto or into the meat (comminuted and dry-cure
 * formulas): substance × 1 000 000 / green weight.
 */
export function ppmOfGreenWeight(substanceGrams: Decimal, greenGrams: Decimal): Decimal {
  return substanceGrams.times(MILLION).div(greenGrams);
}

/**
 * Ingoing ppm of a pumped (injected) product: substance in the pickle × pump fraction
 * × 1 000 000 / total pickle weight.
 */
export function ppmOfPumpedPickle(
  substanceInPickleGrams: Decimal,
  pumpPercent: Decimal,
  pickleGrams: Decimal,
): Decimal {
  return substanceInPickleGrams.times(fraction(pumpPercent)).times(MILLION).div(pickleGrams);
}

/**
 * Ingoing ppm of an immersion cure taken to equilibrium ("Method Two"): substance × 1 000 000
 * / (green weight + pickle weight).
 */
export function ppmAtEquilibrium(
  substanceGrams: Decimal,
  greenGrams: Decimal,
  pickleGrams: Decimal,
): Decimal {
  return substanceGrams.times(MILLION).div(greenGrams.plus(pickleGrams));
}

/**
 * Pump percent from weights: (pumped − green) / green × 100.
 * source: standard trade definition (from memory; handbook wording not confirmed)
 */
export function pumpPercentFromWeights(pumpedGrams: Decimal, greenGrams: Decimal): Decimal {
  return pumpedGrams.minus(greenGrams).div(greenGrams).times(100);
}

/**
 * Curing salt needed for a target ppm on a weight of meat: target × meat / 1 000 000 / nitrite
 * fraction of the curing salt.
 * @param nitritePercent sodium nitrite in the curing salt, percent (6.25, not 0.0625)
 */
export function curingSaltForTarget(
  targetPpm: Decimal,
  greenGrams: Decimal,
  nitritePercent: Decimal,
): Decimal {
  return targetPpm.times(greenGrams).div(MILLION).div(fraction(nitritePercent));
}
