import type { Decimal } from '../decimal.ts';
import type { FigureKind } from '../calculation/calc-result.ts';
import { MILLIMETRES_PER_INCH } from '../units/length.ts';
import {
  formatScaleAmount,
  isMinorAmount,
  roundForScale,
  type UnitSystem,
} from '../units/scale-amount.ts';
import { celsiusDifferenceToFahrenheit, celsiusToFahrenheit } from '../units/temperature.ts';

/** Rounds to the nearest half: 23.26 → 23.5. */
function toNearestHalf(value: Decimal): Decimal {
  return value.times(2).toDecimalPlaces(0).div(2);
}

/** Prints a mass for the batch sheet, weighed to 0.1 g when minor or `fine`. */
export function formatMass(grams: Decimal, system: UnitSystem, fine = false): string {
  return formatScaleAmount(roundForScale(grams, system, fine || isMinorAmount(grams)));
}

/** Prints a temperature to 0.5 °C, or to 1 °F in US units. */
export function formatTemperature(celsius: Decimal, system: UnitSystem): string {
  return system === 'us'
    ? `${celsiusToFahrenheit(celsius).toDecimalPlaces(0).toFixed(0)} °F`
    : `${toNearestHalf(celsius).toFixed(1)} °C`;
}

/** Prints a temperature difference (a friction factor) to 0.5 °C, or to 1 °F. */
export function formatTemperatureDifference(celsius: Decimal, system: UnitSystem): string {
  return system === 'us'
    ? `${celsiusDifferenceToFahrenheit(celsius).toDecimalPlaces(0).toFixed(0)} °F`
    : `${toNearestHalf(celsius).toFixed(1)} °C`;
}

/** Prints a ppm figure to 0.1 ppm. */
export function formatPpm(ppm: Decimal): string {
  return `${ppm.toFixed(1)} ppm`;
}

/** Prints a percentage with up to three decimals, dropping trailing zeros but keeping two. */
export function formatPercent(percent: Decimal): string {
  const fixed = percent.toFixed(3).replace(/0$/, '');
  return `${fixed} %`;
}

/** Prints a figure of any kind in the chosen units. */
export function formatFigure(
  kind: FigureKind,
  value: Decimal | string,
  system: UnitSystem,
): string {
  if (typeof value === 'string') return value;
  switch (kind) {
    case 'mass':
      return formatMass(value, system);
    case 'percent':
      return formatPercent(value);
    case 'ppm':
      return formatPpm(value);
    case 'temperature':
      return formatTemperature(value, system);
    case 'temperature-difference':
      return formatTemperatureDifference(value, system);
    case 'salinometer':
      return `${value.toFixed(1)} °SAL`;
    case 'length':
      return system === 'us'
        ? `${value.div(MILLIMETRES_PER_INCH).toFixed(2)} in`
        : `${value.div(10).toFixed(1)} cm`;
    case 'count':
      return value.toFixed(0);
    case 'days':
      return `${value.toFixed(0)} days`;
    case 'text':
      return value.toString();
  }
}
