import { Decimal, HUNDRED } from '../../decimal.ts';

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
