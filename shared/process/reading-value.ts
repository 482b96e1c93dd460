/**
 * A reading as typed ("71.5 °C", "160 °F", "6.2") in its measure's canonical unit: °C, seconds,
 * grams, pH, water activity.
 */
import type { Decimal } from '../decimal.ts';
import { parseDuration } from '../units/duration.ts';
import { parseMass } from '../units/mass.ts';
import { QuantityError } from '../units/quantity-error.ts';
import { parseTemperature } from '../units/temperature.ts';
import { tokenize } from '../units/tokenize.ts';
import type { CanonicalUnit, Measure } from './control-types.ts';

/** The unit every value of a measure is kept in. */
export function canonicalUnit(measure: Measure): CanonicalUnit {
  switch (measure) {
    case 'internal-temperature':
    case 'chamber-temperature':
      return '°C';
    case 'time':
      return 's';
    case 'weight':
      return 'g';
    case 'ph':
      return 'pH';
    case 'water-activity':
      return 'aw';
  }
}

const EXPECTED: Readonly<Record<CanonicalUnit, string>> = {
  '°C': 'a temperature such as "71.5 °C" or "160 °F"',
  s: 'a time such as "17 s", "30 min" or "1.5 h"',
  g: 'a weight such as "4.26 kg", "950 g" or "9.4 lb"',
  pH: 'a pH between 0 and 14, such as "5.2"',
  aw: 'a water activity between 0 and 1, such as "0.92"',
};

/** A bare number ("6.2"), or null when the text carries a unit or is not one number. */
function bareNumber(text: string): Decimal | null {
  const terms = tokenize(text);
  if (typeof terms === 'string' || terms.length !== 1 || terms[0].unit !== '') return null;
  return terms[0].value;
}

/** pH or water activity: a plain number in range, its name allowed before or after it. */
function readScale(text: string, unit: 'pH' | 'aw', max: number): Decimal {
  const name = unit.toLowerCase();
  const stripped = text
    .trim()
    .replace(new RegExp(`^${name}\\s*[:=]?\\s*`, 'i'), '')
    .replace(new RegExp(`\\s*${name}$`, 'i'), '');
  const value = bareNumber(stripped);
  if (value === null) {
    const terms = tokenize(stripped);
    const reason = typeof terms === 'string' ? terms : `give one number, with no unit`;
    throw new QuantityError(text, EXPECTED[unit], reason);
  }
  if (value.isNegative() || value.greaterThan(max)) {
    throw new QuantityError(text, EXPECTED[unit], `it must be between 0 and ${max}`);
  }
  return value;
}

/**
 * The value in the measure's canonical unit. A bare number is read in that unit (°C, s, g);
 * throws QuantityError with words for bad input.
 */
export function parseReadingValue(text: string, measure: Measure): Decimal {
  const unit = canonicalUnit(measure);
  if (unit === 'pH') return readScale(text, 'pH', 14);
  if (unit === 'aw') return readScale(text, 'aw', 1);
  const bare = bareNumber(text);
  if (bare !== null) {
    if (unit !== '°C' && bare.isNegative()) {
      throw new QuantityError(text, EXPECTED[unit], 'it cannot be negative');
    }
    if (unit === '°C' && bare.lessThan('-273.15')) {
      throw new QuantityError(text, EXPECTED[unit], 'it is below absolute zero');
    }
    return bare;
  }
  if (unit === '°C') return parseTemperature(text);
  if (unit === 's') return parseDuration(text);
  return parseMass(text);
}

/**
 * A value in a formula's limit: like a reading, but temperatures, times and weights must say
 * their unit, since a bare "60" could be °C or °F.
 */
export function parseLimitValue(text: string, measure: Measure): Decimal {
  const unit = canonicalUnit(measure);
  if (unit !== 'pH' && unit !== 'aw' && bareNumber(text) !== null) {
    throw new QuantityError(text, EXPECTED[unit], 'write its unit after the number');
  }
  return parseReadingValue(text, measure);
}
