import { Decimal } from '../decimal.ts';
import { GRAMS_PER_OUNCE } from './mass.ts';

/** The units a batch sheet is printed in. */
export type UnitSystem = 'metric' | 'us';

/** A mass rounded to what a kitchen scale can weigh, in grams (metric) or ounces (US). */
export interface ScaleAmount {
  /** The rounded amount in {@link unit}; totals add these up so that they match the printed lines. */
  readonly value: Decimal;
  readonly unit: 'g' | 'oz';
  /** Decimal places of {@link value}. */
  readonly places: number;
}

/** Above this many grams a metric line is printed in kilograms (three decimals, still 1 g). */
export const KILOGRAM_DISPLAY_FROM = new Decimal(10_000);
/** Below this many grams an ingredient is "minor" and weighed to 0.1 g. source: product brief */
export const MINOR_INGREDIENT_BELOW_GRAMS = new Decimal(100);

/**
 * Rounds a mass for the scale: metric to 0.1 g when `fine`, else to 1 g; US units to 0.1 oz.
 * Rounding is half-up on the exact value.
 * @param grams the exact mass
 * @param system metric or US units
 * @param fine whether the line is weighed to 0.1 g (curing salt and minor ingredients)
 */
export function roundForScale(grams: Decimal, system: UnitSystem, fine: boolean): ScaleAmount {
  if (system === 'us') {
    return { value: grams.div(GRAMS_PER_OUNCE).toDecimalPlaces(1), unit: 'oz', places: 1 };
  }
  const places = fine ? 1 : 0;
  return { value: grams.toDecimalPlaces(places), unit: 'g', places };
}

/** Whether an exact mass counts as a minor ingredient, weighed to 0.1 g. */
export function isMinorAmount(grams: Decimal): boolean {
  return grams.lessThan(MINOR_INGREDIENT_BELOW_GRAMS);
}

/**
 * Prints a rounded amount: "95.9 g", "12.345 kg", "6.3 oz", "2 lb 3.4 oz". Metric amounts of
 * 10 kg or more print in kilograms; so do all 1 g lines of a block whose total reaches 10 kg
 * (`inKilograms`), so that one column reads in one unit. Minor 0.1 g lines stay in grams.
 */
export function formatScaleAmount(amount: ScaleAmount, inKilograms = false): string {
  if (amount.unit === 'oz') {
    const pounds = amount.value.div(16).floor();
    const ounces = amount.value.minus(pounds.times(16));
    if (pounds.isZero()) return `${ounces.toFixed(1)} oz`;
    return `${pounds.toFixed(0)} lb ${ounces.toFixed(1)} oz`;
  }
  const large = amount.value.greaterThanOrEqualTo(KILOGRAM_DISPLAY_FROM);
  if ((amount.places === 0 && (inKilograms || large)) || (amount.places > 0 && large)) {
    return `${amount.value.div(1000).toFixed(amount.places + 3)} kg`;
  }
  return `${amount.value.toFixed(amount.places)} g`;
}

/** Prints an exact mass in grams to 0.1 g, for the gram figure beside a curing-salt line. */
export function formatGramsFine(grams: Decimal): string {
  return `${grams.toFixed(1)} g`;
}
