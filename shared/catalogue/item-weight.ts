/**
 * What an item stocked by count or by volume weighs, from the catalogue's `weighs:` ("50 g" for
 * one egg, "244 g per cup" of milk): how a formula's grams become the lots' pieces or
 * millilitres. Pure.
 */
import { Decimal } from '../decimal.ts';
import { parseMass } from '../units/mass.ts';
import { QuantityError } from '../units/quantity-error.ts';
import { LITRES_PER_US_CUP, parseVolume } from '../units/volume.ts';
import type { CatalogueItem, StockUnit } from './catalogue-types.ts';

/** So many grams for so much of the item's base measure: pieces, or millilitres. */
export interface ItemWeight {
  /** Grams, above 0. */
  readonly grams: Decimal;
  /** Pieces (1 for an item stocked by count) or millilitres, above 0. */
  readonly per: Decimal;
}

const EACH_EXAMPLE = 'the weight of one, such as "50 g" or "1.8 oz"';
const VOLUME_EXAMPLE = 'a weight per volume, such as "244 g per cup", "1.03 kg per l"';

/** A volume after "per" in millilitres: "cup", "2 cups", "l", "250 ml", "1 qt". */
function volumeMillilitres(text: string): Decimal {
  const cups = /^(\d+(?:\.\d+)?)?\s*cups?$/i.exec(text);
  if (cups) return new Decimal(cups[1] ?? '1').times(LITRES_PER_US_CUP).times(1000);
  // A bare unit is one of it: "per l" is per litre.
  return parseVolume(/^\d|^\./.test(text) ? text : `1 ${text}`).times(1000);
}

/**
 * Reads what an item weighs for its unit: for an item stocked by count, the weight of one
 * ("50 g", "50 g each"); for one stocked by volume, a weight per volume ("244 g per cup", a US
 * cup; "1.03 kg per l"). Exact.
 * @throws QuantityError for an item stocked by weight, text that is neither, or nothing
 */
export function parseItemWeight(text: string, unit: StockUnit): ItemWeight {
  const given = text.trim();
  if (unit !== 'each' && unit !== 'ml' && unit !== 'l')
    throw new QuantityError(
      given,
      'no weight per unit',
      `this item is stocked by weight (${unit}): leave weighs out`,
    );
  const [mass, volume, more] = given.split(/\s+per\s+/i);
  const expected = unit === 'each' ? EACH_EXAMPLE : VOLUME_EXAMPLE;
  if (more !== undefined) throw new QuantityError(given, expected, '"per" is given twice');
  let grams: Decimal;
  let per: Decimal;
  if (unit === 'each') {
    if (volume !== undefined)
      throw new QuantityError(given, expected, 'this item is stocked by count: give one’s weight');
    grams = parseMass(mass.replace(/\s+(each|apiece)$/i, ''));
    per = new Decimal(1);
  } else {
    if (volume === undefined)
      throw new QuantityError(
        given,
        expected,
        'this item is stocked by volume: say per how much, such as "per cup"',
      );
    grams = parseMass(mass);
    per = volumeMillilitres(volume.trim());
  }
  if (!grams.greaterThan(0) || !per.greaterThan(0))
    throw new QuantityError(given, expected, 'a weight per unit must be more than nothing');
  return { grams, per };
}

/**
 * The weight per unit of a catalogue item read as it stands; undefined when it gives none, or
 * (in a catalogue that was never checked) one that does not read.
 */
export function itemWeightOf(item: Pick<CatalogueItem, 'weighs' | 'unit'>): ItemWeight | undefined {
  if (item.weighs === undefined) return undefined;
  try {
    return parseItemWeight(item.weighs, item.unit);
  } catch (error) {
    if (error instanceof QuantityError) return undefined;
    throw error;
  }
}
