import { Decimal } from '../decimal.ts';
import { QuantityError } from './quantity-error.ts';
import { tokenize } from './tokenize.ts';

/** Which scale a temperature is written in. */
export type TemperatureScale = 'C' | 'F';

const NINE_FIFTHS = new Decimal(9).div(5);
const THIRTY_TWO = new Decimal(32);

const SCALE_BY_UNIT: ReadonlyMap<string, TemperatureScale> = new Map([
  ['c', 'C'],
  ['degc', 'C'],
  ['celsius', 'C'],
  ['f', 'F'],
  ['degf', 'F'],
  ['fahrenheit', 'F'],
]);

/** °F → °C, t/°C = (t/°F − 32) × 5/9. source: NIST SP 811 (2008), temperature conversion */
export function fahrenheitToCelsius(fahrenheit: Decimal): Decimal {
  return fahrenheit.minus(THIRTY_TWO).div(NINE_FIFTHS);
}

/** °C → °F, the inverse of {@link fahrenheitToCelsius}. */
export function celsiusToFahrenheit(celsius: Decimal): Decimal {
  return celsius.times(NINE_FIFTHS).plus(THIRTY_TWO);
}

/**
 * A temperature *difference* in °F as a difference in °C: only the 5/9 factor, no 32° offset
 * (a friction factor is such a difference).
 */
export function fahrenheitDifferenceToCelsius(difference: Decimal): Decimal {
  return difference.div(NINE_FIFTHS);
}

/** A temperature difference in °C as a difference in °F. */
export function celsiusDifferenceToFahrenheit(difference: Decimal): Decimal {
  return difference.times(NINE_FIFTHS);
}

function readOne(text: string, expected: string): { value: Decimal; scale: TemperatureScale } {
  const terms = tokenize(text);
  if (typeof terms === 'string') throw new QuantityError(text, expected, terms);
  if (terms.length !== 1) throw new QuantityError(text, expected, 'give one number with °C or °F');
  const [term] = terms;
  if (term.unit === '') throw new QuantityError(text, expected, 'say °C or °F after the number');
  const scale = SCALE_BY_UNIT.get(term.unit);
  if (!scale) throw new QuantityError(text, expected, `"${term.unit}" is not °C or °F`);
  return { value: term.value, scale };
}

/**
 * Reads a temperature such as "26 °C", "78F" and returns it in °C.
 * @throws QuantityError when the text is not a temperature
 */
export function parseTemperature(text: string): Decimal {
  return readTemperature(text).celsius;
}

/**
 * Reads a temperature such as "26 °C", "78F": in °C, and the number and scale as written (a
 * tolerance stated per scale, like the ice-point check's ±1 °C or ±2 °F, is judged in it).
 * @throws QuantityError when the text is not a temperature
 */
export function readTemperature(text: string): {
  celsius: Decimal;
  value: Decimal;
  scale: TemperatureScale;
} {
  const { value, scale } = readOne(text, 'a temperature such as "26 °C" or "78 °F"');
  const celsius = scale === 'C' ? value : fahrenheitToCelsius(value);
  if (celsius.lessThan('-273.15')) {
    throw new QuantityError(text, 'a temperature', 'it is below absolute zero');
  }
  return { celsius, value, scale };
}

/**
 * Reads a temperature difference such as a friction factor ("14 °F", "7.8 °C") and returns it
 * in °C, converting °F without the 32° offset.
 * @throws QuantityError when the text is not a temperature difference
 */
export function parseTemperatureDifference(text: string): Decimal {
  const { value, scale } = readOne(text, 'a temperature rise such as "14 °F" or "7.8 °C"');
  return scale === 'C' ? value : fahrenheitDifferenceToCelsius(value);
}
