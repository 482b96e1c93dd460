import { Decimal } from '../decimal.ts';
import type { CanonicalUnit, ControlLimit } from '../process/control-types.ts';
import { celsiusToFahrenheit } from '../units/temperature.ts';

/** A value as recorded, to 0.1 (°C, g, s), 0.01 (pH) or 0.001 (aw), with its unit: "71.5 °C". */
export function recordedValue(value: string, unit: CanonicalUnit): string {
  const decimal = new Decimal(value);
  switch (unit) {
    case 'pH':
      return `pH ${decimal.toFixed(2)}`;
    case 'aw':
      return `aw ${decimal.toFixed(3)}`;
    default:
      return `${decimal.toFixed(1)} ${unit}`;
  }
}

/** A limit temperature in °C to 0.1, with °F to 1 beside it: "21.1 °C (70 °F)". */
function limitTemperature(celsius: string): string {
  const c = new Decimal(celsius);
  return `${c.toFixed(1)} °C (${celsiusToFahrenheit(c).toFixed(0)} °F)`;
}

/** A limit value in its unit. */
function limitValue(value: string, unit: CanonicalUnit): string {
  return unit === '°C' ? limitTemperature(value) : recordedValue(value, unit);
}

/** Seconds in the largest unit that fits: "17 s", "90 min", "1.5 h". */
export function durationWords(seconds: string): string {
  const s = new Decimal(seconds);
  if (s.gte(3600) && s.mod(900).isZero()) return `${s.div(3600).toString()} h`;
  if (s.gte(60) && s.mod(60).isZero()) return `${s.div(60).toString()} min`;
  return `${s.toString()} s`;
}

/** A cooling limit's stages in words, each with what its time is counted from. */
function coolingWords(limit: Extract<ControlLimit, { type: 'cooling' }>): string {
  return limit.stages
    .map((stage, i) => {
      const counted =
        stage.countedFrom === 'cooling-start'
          ? ' of the start of cooling'
          : i === 0
            ? ''
            : ` of reaching ${limitValue(limit.stages[i - 1].toC, '°C')}`;
      const from = i === 0 ? `from ${limitValue(stage.fromC, '°C')} ` : '';
      return `${from}to ${limitValue(stage.toC, '°C')} within ${durationWords(stage.withinS)}${counted}`;
    })
    .join('; then ');
}

/** A critical limit in words, for records: "at most 5.0 °C (41 °F)". */
export function limitWords(limit: ControlLimit, unit: CanonicalUnit): string {
  switch (limit.type) {
    case 'at-most':
      return `at most ${limitValue(limit.max, unit)}`;
    case 'at-least':
      return `at least ${limitValue(limit.min, unit)}`;
    case 'between':
      return `from ${limitValue(limit.min, unit)} to ${limitValue(limit.max, unit)}`;
    case 'hold':
      return limit.rows
        .map((row) =>
          new Decimal(row.holdS).isZero()
            ? `${limitValue(row.tempC, '°C')} reached`
            : `${limitValue(row.tempC, '°C')} for ${durationWords(row.holdS)}`,
        )
        .join(', or ');
    case 'cooling':
      return coolingWords(limit);
  }
}
