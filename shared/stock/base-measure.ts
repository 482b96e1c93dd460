/**
 * A received quantity in its item's base measure: grams for an item stocked by weight,
 * millilitres for one stocked by volume, a count for one stocked each. Pure.
 */
import type { CatalogueItem, StockUnit } from '../catalogue/catalogue-types.ts';
import { itemWeightOf } from '../catalogue/item-weight.ts';
import { Decimal } from '../decimal.ts';
import { GRAMS_PER_OUNCE, GRAMS_PER_POUND, parseMass } from '../units/mass.ts';
import { QuantityError } from '../units/quantity-error.ts';
import { LITRES_PER_US_GALLON, parseVolume, WATER_GRAMS_PER_LITRE } from '../units/volume.ts';

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

/** How many of the base measure one of the unit is. */
const PER_UNIT: Readonly<Record<ReceivedUnit, Decimal>> = {
  g: new Decimal(1),
  kg: new Decimal(1000),
  lb: GRAMS_PER_POUND,
  oz: GRAMS_PER_OUNCE,
  ml: new Decimal(1),
  l: new Decimal(1000),
  gal: LITRES_PER_US_GALLON.times(1000),
  each: new Decimal(1),
};

/** How many of the base measure one of a unit holds: 1000 for kg and l, 453.59237 for lb. */
export function basePerUnit(unit: ReceivedUnit): Decimal {
  return PER_UNIT[unit];
}

/** Whether a text is a unit lots are received in (a receipt's unit as stored). */
export function isReceivedUnit(text: string): text is ReceivedUnit {
  return (RECEIVED_UNITS as readonly string[]).includes(text);
}

/** An amount in the base measure expressed in a lot's own unit: 2500 g of a kg lot is 2.5. */
export function inLotUnit(base: Decimal, unit: ReceivedUnit): Decimal {
  return base.div(PER_UNIT[unit]);
}

/**
 * Grams a formula weighs, in the base measure of an item: grams stay grams; water weighed for an
 * item kept in millilitres counts 1 ml a gram (the project's water convention,
 * WATER_GRAMS_PER_LITRE); anything else bought by volume or by the each goes through the
 * catalogue's weight per unit (`weighs:`): 1500 g of milk at 244 g per cup is 1500 × 236.5882365
 * ÷ 244 ml. A count is rounded up to whole pieces (510 g of egg at 50 g is 11 eggs, not 10.2):
 * a piece is used whole, and what is left of it does not go back into stock (our rule). Without
 * a weight per unit, undefined: the cook says how much of the lot went in.
 */
export function gramsToBase(
  grams: Decimal,
  item: Pick<CatalogueItem, 'unit' | 'weighs'>,
  water: boolean,
): Decimal | undefined {
  const base = baseMeasureOf(item.unit);
  if (base === 'g') return grams;
  if (base === 'ml' && water) return grams.div(WATER_GRAMS_PER_LITRE).times(1000);
  const weight = itemWeightOf(item);
  if (!weight) return undefined;
  // Multiply first: one division, so a round figure stays exact.
  const amount = grams.times(weight.per).div(weight.grams);
  return base === 'each' ? amount.ceil() : amount;
}

/**
 * Reads an amount a cook typed for an item into its base measure: a weight ("2.5 kg", "12 oz")
 * for an item bought by weight, a volume ("750 ml", "1.5 l") for one bought by volume, a whole
 * count ("12") for one bought by the each.
 * @throws QuantityError when the text is not such an amount, or it is not above zero
 */
export function parseBaseAmount(text: string, unit: StockUnit): Decimal {
  const base = baseMeasureOf(unit);
  let amount: Decimal;
  if (base === 'g') amount = parseMass(text);
  else if (base === 'ml') amount = parseVolume(text).times(1000);
  else {
    const trimmed = text.trim().replace(/\s*(each|ea|pieces?|pcs?)$/i, '');
    if (!/^\d{1,9}$/.test(trimmed))
      throw new QuantityError(text, 'a whole count such as "12"', 'it is not a whole number');
    amount = new Decimal(trimmed);
  }
  if (!amount.greaterThan(0)) throw new QuantityError(text, 'an amount above 0', 'it is nothing');
  return amount;
}
