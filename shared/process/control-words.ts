/**
 * Temperatures, lengths of time and clock times in a cook's words, for the judging's summaries.
 * Rounded for reading only; the judging compares unrounded values.
 */
import { Decimal } from '../decimal.ts';
import { celsiusToFahrenheit } from '../units/temperature.ts';
import { clockMomentWords } from '../presentation/date-words.ts';

/** "26.7 °C (80 °F)": °C to a tenth, °F to a whole degree. */
export function temperatureWords(celsius: Decimal | string): string {
  const value = new Decimal(celsius);
  const tenth = value.toDecimalPlaces(1).toString();
  const fahrenheit = celsiusToFahrenheit(value).toDecimalPlaces(0).toString();
  return `${tenth} °C (${fahrenheit} °F)`;
}

/** "1 h 24 min", "12 min", "17 s", "instant" for zero. */
export function durationWords(seconds: Decimal | string): string {
  const total = new Decimal(seconds);
  if (total.isZero()) return 'instant';
  if (total.lessThan(60)) return `${total.toDecimalPlaces(0).toString()} s`;
  const minutes = total.div(60).toDecimalPlaces(0).toNumber();
  const hours = Math.floor(minutes / 60);
  const rest = minutes % 60;
  if (hours === 0) return `${rest} min`;
  return rest === 0 ? `${hours} h` : `${hours} h ${rest} min`;
}

/**
 * A time of the process record on the kitchen's clock, in the product's words
 * (presentation/date-words.ts): "14:32" today, "Tue 3 Mar, 02:10" on another day.
 */
export function clockWords(iso: string, timeZone: string, todayIso: string): string {
  return clockMomentWords(iso, todayIso, timeZone);
}

/** A value in its canonical unit in words: "26.7 °C (80 °F)", "12 min", "950 g", "pH 5.2". */
export function valueWords(value: Decimal | string, unit: string): string {
  switch (unit) {
    case '°C':
      return temperatureWords(value);
    case 's':
      return durationWords(value);
    case 'pH':
      return `pH ${new Decimal(value).toString()}`;
    case 'aw':
      return `water activity ${new Decimal(value).toString()}`;
    default:
      return `${new Decimal(value).toDecimalPlaces(1).toString()} ${unit}`;
  }
}
