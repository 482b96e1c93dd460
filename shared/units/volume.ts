import { Decimal, sum } from '../decimal.ts';
import { QuantityError } from './quantity-error.ts';
import { tokenize } from './tokenize.ts';

/** Litres in one US gallon (231 cubic inches), exact. source: NIST SP 811 (2008), Appendix B.8 */
export const LITRES_PER_US_GALLON = new Decimal('3.785411784');

/**
 * Grams of water per litre when a brine's water is measured by volume. We take 1 kg per litre,
 * the density of water at about 4 °C; at kitchen temperatures (15–25 °C) water is 0.997–0.999 kg/L,
 * so a measured litre of tap water weighs at most 0.3 % less than we count. Weigh the water when it
 * matters. (Convention stated in README; density figures from memory.)
 */
export const WATER_GRAMS_PER_LITRE = new Decimal(1000);

const LITRES_PER_UNIT: ReadonlyMap<string, Decimal> = new Map([
  ...['ml', 'millilitre', 'millilitres', 'milliliter', 'milliliters'].map(
    (u) => [u, new Decimal('0.001')] as const,
  ),
  ...['l', 'litre', 'litres', 'liter', 'liters'].map((u) => [u, new Decimal(1)] as const),
  ...['qt', 'quart', 'quarts'].map((u) => [u, LITRES_PER_US_GALLON.div(4)] as const),
  ...['gal', 'gallon', 'gallons'].map((u) => [u, LITRES_PER_US_GALLON] as const),
]);

const EXPECTED = 'a volume of water such as "12 L", "1500 ml" or "3 gal" (US gallons)';

/**
 * Reads a volume of water and returns it in litres.
 * @throws QuantityError when the text is not a volume
 */
export function parseVolume(text: string): Decimal {
  const terms = tokenize(text);
  if (typeof terms === 'string') throw new QuantityError(text, EXPECTED, terms);
  return sum(
    terms.map((term) => {
      if (term.unit === '')
        throw new QuantityError(text, EXPECTED, 'a unit is missing (ml, L, qt or gal)');
      const factor = LITRES_PER_UNIT.get(term.unit);
      if (!factor) throw new QuantityError(text, EXPECTED, `"${term.unit}" is not a volume unit`);
      if (term.value.isNegative())
        throw new QuantityError(text, EXPECTED, 'a volume cannot be negative');
      return term.value.times(factor);
    }),
  );
}

/** Grams of water in a volume of litres, by the convention of {@link WATER_GRAMS_PER_LITRE}. */
export function waterGramsFromLitres(litres: Decimal): Decimal {
  return litres.times(WATER_GRAMS_PER_LITRE);
}
