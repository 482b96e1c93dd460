/**
 * A received quantity in its item's base measure: grams for an item stocked by weight,
 * millilitres for one stocked by volume, a count for one stocked each. Pure.
 */
import type { StockUnit } from '../catalogue/catalogue-types.ts';
import { Decimal } from '../decimal.ts';
import { parseMass } from '../units/mass.ts';
import { QuantityError } from '../units/quantity-error.ts';
import { parseVolume } from '../units/volume.ts';

/** What an item's stock is counted in. */
export type BaseMeasure = 'g' | 'ml' | 'each';

/** The units a delivery may be given in: the catalogue's and the US ones. */
export type ReceivedUnit = StockUnit | 'gal';

const MASS_UNITS: readonly ReceivedUnit[] = ['g', 'kg', 'oz', 'lb'];
const VOLUME_UNITS: readonly ReceivedUnit[] = ['ml', 'l', 'gal'];

/** Every unit a delivery may be given in. */
export const RECEIVED_UNITS: readonly ReceivedUnit[] = [...MASS_UNITS, ...VOLUME_UNITS, 'each'];

/** The base measure of an item stocked in `unit`. */
export function baseMeasureOf(unit: ReceivedUnit): BaseMeasure {
  if (MASS_UNITS.includes(unit)) return 'g';
  if (VOLUME_UNITS.includes(unit)) return 'ml';
  return 'each';
}

const MEASURE_WORDS: Readonly<Record<BaseMeasure, string>> = {
  g: 'a weight (g, kg, oz or lb)',
  ml: 'a volume (ml, l or gal)',
  each: 'a count (each)',
};

/**
 * A quantity received ("9.5" in "lb") in the base measure of an item stocked in `itemUnit`:
 * 9.5 lb of a kg item is 4309.127515 g. A count must be whole.
 * @throws QuantityError for a number that is no quantity, nothing, or a unit of the wrong measure
 */
export function baseAmount(quantity: string, unit: ReceivedUnit, itemUnit: StockUnit): Decimal {
  const measure = baseMeasureOf(itemUnit);
  const text = `${quantity.trim()} ${unit}`;
  if (baseMeasureOf(unit) !== measure)
    throw new QuantityError(
      text,
      MEASURE_WORDS[measure],
      `this item is stocked by ${measure === 'each' ? 'count' : measure === 'g' ? 'weight' : 'volume'}`,
    );
  let amount: Decimal;
  if (measure === 'g') amount = parseMass(text);
  else if (measure === 'ml') amount = parseVolume(text).times(1000);
  else {
    if (!/^\d+$/.test(quantity.trim()))
      throw new QuantityError(text, MEASURE_WORDS.each, 'give a whole number');
    amount = new Decimal(quantity.trim());
  }
  if (amount.lessThanOrEqualTo(0))
    throw new QuantityError(text, MEASURE_WORDS[measure], 'a delivery must be more than nothing');
  return amount;
}

/**
 * What is left of a lot in the unit it came in: 2000 g left of 10 lb received (4535.9237 g) is
 * 4.409 lb. Rounded half-up to 3 places, for display only; stock is kept in the base measure.
 */
export function remainingInUnit(remaining: Decimal, quantity: Decimal, amount: Decimal): Decimal {
  if (amount.isZero()) return new Decimal(0);
  return remaining.times(quantity).div(amount).toDecimalPlaces(3);
}
