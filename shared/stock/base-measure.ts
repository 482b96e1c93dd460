import { Decimal } from '../decimal.ts';
import type { StockUnit } from '../catalogue/catalogue-types.ts';
import { GRAMS_PER_OUNCE, GRAMS_PER_POUND, parseMass } from '../units/mass.ts';
import { QuantityError } from '../units/quantity-error.ts';
import { parseVolume, WATER_GRAMS_PER_LITRE } from '../units/volume.ts';

/**
 * The measure stock of an item is kept in: grams for an item bought by weight, millilitres for
 * one bought by volume, a count for one bought by the each (migration 015-stock).
 */
export type BaseMeasure = 'g' | 'ml' | 'each';

/** The base measure of a stock unit. */
export function baseMeasureOf(unit: StockUnit): BaseMeasure {
  if (unit === 'ml' || unit === 'l') return 'ml';
  if (unit === 'each') return 'each';
  return 'g';
}

/** How many of the base measure one of the unit is. */
const PER_UNIT: Readonly<Record<StockUnit, Decimal>> = {
  g: new Decimal(1),
  kg: new Decimal(1000),
  lb: GRAMS_PER_POUND,
  oz: GRAMS_PER_OUNCE,
  ml: new Decimal(1),
  l: new Decimal(1000),
  each: new Decimal(1),
};

/** An amount in the base measure expressed in a lot's own unit: 2500 g of a kg lot is 2.5. */
export function inLotUnit(base: Decimal, unit: StockUnit): Decimal {
  return base.div(PER_UNIT[unit]);
}

/**
 * Grams a formula weighs, in the base measure of an item: grams stay grams; water weighed for an
 * item kept in millilitres counts 1 ml a gram (the project's water convention,
 * WATER_GRAMS_PER_LITRE); anything else bought by volume or by the each has no weight per unit in
 * the catalogue, so undefined: the cook says how much of the lot went in.
 */
export function gramsToBase(grams: Decimal, unit: StockUnit, water: boolean): Decimal | undefined {
  const base = baseMeasureOf(unit);
  if (base === 'g') return grams;
  if (base === 'ml' && water) return grams.div(WATER_GRAMS_PER_LITRE).times(1000);
  return undefined;
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
