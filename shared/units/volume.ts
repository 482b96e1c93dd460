import { Decimal } from '../decimal.ts';
import { parseWithTable, spellings, type UnitTable } from './unit-table.ts';

/** Litres in one US gallon (231 cubic inches), exact. source: NIST SP 811 (2008), Appendix B.8 */
export const LITRES_PER_US_GALLON = new Decimal('3.785411784');

/**
 * Litres in one US cup: a sixteenth of the US gallon (8 of its 128 fluid ounces), exact: the cup
 * of US household measures, as food composition tables give "1 cup". source: NIST SP 811 (2008),
 * Appendix B.8, cup (U.S.) = 2.365 882 E−04 m³ (from memory)
 */
export const LITRES_PER_US_CUP = LITRES_PER_US_GALLON.div(16);

/**
 * Grams of water per litre when a brine's water is measured by volume. We take 1 kg per litre,
 * the density of water at about 4 °C; at kitchen temperatures (15–25 °C) water is 0.997–0.999 kg/L,
 * so a measured litre of tap water weighs at most 0.3 % less than we count. Weigh the water when it
 * matters. (Convention stated in formulas/README.md, "Numbers on the sheet"; density figures from
 * memory.)
 */
export const WATER_GRAMS_PER_LITRE = new Decimal(1000);

const VOLUME: UnitTable = {
  factors: new Map([
    ...spellings(
      ['ml', 'millilitre', 'millilitres', 'milliliter', 'milliliters'],
      new Decimal('0.001'),
    ),
    ...spellings(['l', 'litre', 'litres', 'liter', 'liters'], new Decimal(1)),
    ...spellings(['qt', 'quart', 'quarts'], LITRES_PER_US_GALLON.div(4)),
    ...spellings(['gal', 'gallon', 'gallons'], LITRES_PER_US_GALLON),
  ]),
  expected: 'a volume of water such as "12 L", "1500 ml" or "3 gal" (US gallons)',
  noun: 'volume',
  unitHint: 'ml, L, qt or gal',
};

/**
 * Reads a volume of water and returns it in litres.
 * @throws QuantityError when the text is not a volume
 */
export function parseVolume(text: string): Decimal {
  return parseWithTable(text, VOLUME);
}

/** Grams of water in a volume of litres, by the convention of {@link WATER_GRAMS_PER_LITRE}. */
export function waterGramsFromLitres(litres: Decimal): Decimal {
  return litres.times(WATER_GRAMS_PER_LITRE);
}
