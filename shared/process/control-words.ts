/**
 * Temperatures, lengths of time and clock times in a cook's words, for the judging's summaries.
 * Rounded for reading only; the judging compares unrounded values.
 */
import { Decimal } from '../decimal.ts';
import { celsiusToFahrenheit } from '../units/temperature.ts';

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

// Building an Intl.DateTimeFormat costs far more than formatting with one (a zone's rules are
// looked up each time), and a process record puts thousands of times in words: one formatter per
// zone and option set, kept.
const formatters = new Map<string, Intl.DateTimeFormat>();

function formatter(
  locale: string,
  timeZone: string,
  options: Intl.DateTimeFormatOptions,
): Intl.DateTimeFormat {
  const key = `${locale}|${timeZone}|${JSON.stringify(options)}`;
  let format = formatters.get(key);
  if (!format) {
    format = new Intl.DateTimeFormat(locale, { ...options, timeZone });
    formatters.set(key, format);
  }
  return format;
}

const DAY: Intl.DateTimeFormatOptions = { dateStyle: 'short' };
const TIME: Intl.DateTimeFormatOptions = { hour: '2-digit', minute: '2-digit', hourCycle: 'h23' };
const DAY_MONTH: Intl.DateTimeFormatOptions = { day: 'numeric', month: 'short' };

/** The calendar day of an instant in a zone, to see whether two instants share it. */
function dayIn(date: Date, timeZone: string): string {
  return formatter('en-CA', timeZone, DAY).format(date);
}

/**
 * "14:32" in the kitchen's zone, or "3 Mar 02:10" when the day differs from `todayIso`'s.
 */
export function clockWords(iso: string, timeZone: string, todayIso: string): string {
  const date = new Date(iso);
  const time = formatter('en-GB', timeZone, TIME).format(date);
  if (dayIn(date, timeZone) === dayIn(new Date(todayIso), timeZone)) return time;
  const day = formatter('en-GB', timeZone, DAY_MONTH).format(date);
  return `${day} ${time}`;
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
