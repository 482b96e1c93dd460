import type { Decimal } from '../../decimal.ts';
import { HUNDRED, ONE, ZERO } from '../../decimal.ts';
import type { DoughFormula } from '../../formula/formula-types.ts';
import { parseTemperature, parseTemperatureDifference } from '../../units/temperature.ts';
import type { BatchInput } from '../batch-input.ts';
import type { Figure } from '../calc-result.ts';
import type { DoughLine } from './dough-line.ts';
import { temperatureCount, waterTemperature } from './water-temperature.ts';

/**
 * What the dough temperature inputs give: the temperature the liquids must go in at, which
 * {@link planLiquids} shares out among the liquids of the dough mixed now.
 */
export interface TemperaturePlan {
  readonly inputs: Figure[];
  readonly warnings: string[];
  /** The liquid temperature the rule gives, °C, when every temperature it needs was given. */
  readonly liquidC?: Decimal;
  /** The rule in words, for the note beside the liquid temperature. */
  readonly rule?: string;
}

/** A temperature in words for a note or warning, °C to 0.1. */
export function celsius(value: Decimal): string {
  return `${value.toFixed(1)} °C`;
}

function temperatureInput(label: string, value: Decimal, note?: string): Figure {
  return { label, kind: 'temperature', value, ...(note ? { note } : {}) };
}

function ddtOf(
  formula: DoughFormula,
  batch: BatchInput,
): { value: Decimal; fromFormula: boolean } | undefined {
  if (batch.ddt !== undefined) return { value: batch.ddt, fromFormula: false };
  if (formula.ddt) return { value: parseTemperature(formula.ddt.target), fromFormula: true };
  return undefined;
}

/** Whether any temperature option was given, to warn when there is no DDT to use them with. */
function temperatureOptionsGiven(batch: BatchInput): string[] {
  const given: [unknown, string][] = [
    [batch.room, '--room'],
    [batch.flourTemp, '--flour-temp'],
    [batch.prefermentTemp, '--preferment-temp'],
    [batch.tap, '--tap'],
    [batch.friction, '--friction'],
  ];
  return given.filter(([value]) => value !== undefined).map(([, option]) => option);
}

function frictionOf(
  formula: DoughFormula,
  batch: BatchInput,
): { value: Decimal; note?: string; warning?: string } {
  if (batch.friction !== undefined) return { value: batch.friction };
  if (formula.ddt?.friction !== undefined) {
    return { value: parseTemperatureDifference(formula.ddt.friction), note: 'from the formula' };
  }
  return {
    value: ZERO,
    note: 'none given, counted as 0',
    warning:
      'No friction factor was given (--friction, or ddt.friction in the formula), so it is counted ' +
      'as 0 and the dough will come out warmer than planned. Measure it once with a trial mix.',
  };
}

/**
 * Works out the liquid temperature for the desired dough temperature (n = 3, or 4 with a
 * preferment). Missing temperatures skip it with a warning that names the options to give.
 */
export function planWaterTemperature(
  formula: DoughFormula,
  batch: BatchInput,
  withPreferment: boolean,
): TemperaturePlan {
  const ddt = ddtOf(formula, batch);
  if (!ddt) {
    const given = temperatureOptionsGiven(batch);
    const warnings = given.length
      ? [
          `${given.join(', ')} ${given.length > 1 ? 'were' : 'was'} given, but there is no desired dough temperature: give --ddt or set ddt.target in the formula.`,
        ]
      : [];
    return { inputs: [], warnings };
  }
  const inputs: Figure[] = [
    temperatureInput(
      'Desired dough temperature',
      ddt.value,
      ddt.fromFormula ? 'from the formula' : undefined,
    ),
  ];
  const warnings: string[] = [];
  if (batch.room !== undefined) inputs.push(temperatureInput('Room temperature', batch.room));
  if (batch.flourTemp !== undefined)
    inputs.push(temperatureInput('Flour temperature', batch.flourTemp));
  if (withPreferment && batch.prefermentTemp !== undefined) {
    inputs.push(temperatureInput('Preferment temperature', batch.prefermentTemp));
  }
  if (!withPreferment && batch.prefermentTemp !== undefined) {
    warnings.push('--preferment-temp was ignored: this formula has no preferment.');
  }
  if (batch.tap !== undefined) inputs.push(temperatureInput('Tap water temperature', batch.tap));

  const missing = [
    batch.room === undefined ? '--room' : undefined,
    batch.flourTemp === undefined ? '--flour-temp' : undefined,
    withPreferment && batch.prefermentTemp === undefined ? '--preferment-temp' : undefined,
  ].filter((option): option is string => option !== undefined);
  if (missing.length > 0) {
    warnings.push(
      `The water temperature was not worked out: give ${missing.join(' and ')} (°C or °F).`,
    );
    return { inputs, warnings };
  }

  const friction = frictionOf(formula, batch);
  inputs.push({
    label: 'Friction factor',
    kind: 'temperature-difference',
    value: friction.value,
    ...(friction.note ? { note: friction.note } : {}),
  });
  if (friction.warning) warnings.push(friction.warning);

  const n = temperatureCount(withPreferment);
  const liquidC = waterTemperature({
    ddt: ddt.value,
    room: batch.room as Decimal,
    flour: batch.flourTemp as Decimal,
    ...(withPreferment ? { preferment: batch.prefermentTemp as Decimal } : {}),
    friction: friction.value,
  });
  const rule = `${n} × DDT − (room + flour${withPreferment ? ' + preferment' : ''}) − friction`;
  return { inputs, warnings, liquidC, rule };
}

/**
 * Splits each plain-water line into tap water and ice; other lines pass through.
 * @param fraction share of the water to weigh as ice, 0 < fraction < 1
 * @param tapC tap water temperature, °C, for the note
 */
export function splitWaterWithIce(
  lines: readonly DoughLine[],
  fraction: Decimal,
  tapC: Decimal,
): DoughLine[] {
  const rest = ONE.minus(fraction);
  return lines.flatMap((line) => {
    if (line.role !== 'water') return [line];
    const tapLine: DoughLine = {
      ...line,
      name: `${line.name} at tap temperature`,
      grams: line.grams.times(rest),
      percent: line.percent.times(rest),
      note: `tap water at ${celsius(tapC)}`,
    };
    const iceLine: DoughLine = {
      ...line,
      name: 'Ice',
      grams: line.grams.times(fraction),
      percent: line.percent.times(fraction),
      role: 'ice',
      note:
        `replaces ${fraction.times(HUNDRED).toFixed(1)} % of the ${line.name}; the rule counts ice at 0 °C, ` +
        'so ice straight from a freezer cools a little more',
    };
    return [tapLine, iceLine];
  });
}
