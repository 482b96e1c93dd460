import { Decimal } from '../decimal.ts';
import type { BatchKind, Formula, FormulaKind, YeastKind } from '../formula/formula-types.ts';
import { parseLength } from '../units/length.ts';
import { parseMass } from '../units/mass.ts';
import { parseCount, parsePercent } from '../units/percent.ts';
import { QuantityError } from '../units/quantity-error.ts';
import { parseTemperature, parseTemperatureDifference } from '../units/temperature.ts';
import { parseVolume, waterGramsFromLitres } from '../units/volume.ts';
import { BatchError } from './batch-error.ts';
import type { BatchInput, RawBatchOptions } from './batch-input.ts';
import { isIsoDate } from './dates.ts';
import { checkStartDate } from './start-window.ts';

export type { RawBatchOptions } from './batch-input.ts';

/** What reading an option may need besides its text: the caller's today. */
export interface ReadContext {
  /** Today, YYYY-MM-DD, from the caller's clock: the core never reads one. */
  readonly today: string;
}

type Reader = (text: string, option: string, context: ReadContext) => unknown;

const ALL: readonly BatchKind[] = ['cure', 'dough', 'blend', 'mix'];
const KG = new Decimal(1000);

/** Most units one batch of an assembly makes, as a plan's count: beyond this it is a typo. */
const MAX_UNITS = 100_000;

/** A reader for a whole number from 1 to `max`. */
function counted(max: number): Reader {
  return (text, option) => {
    const count = parseCount(text);
    if (count < 1 || count > max)
      throw new BatchError(`--${option} must be between 1 and ${max}`, option);
    return count;
  };
}

/** A reader for a mass that must be more than zero and at most `maxKg`. */
function mass(maxKg: number): (text: string, option: string) => Decimal {
  return (text, option) => {
    const grams = parseMass(text);
    if (grams.isZero()) throw new BatchError(`--${option} must be more than 0`, option);
    // Below a gram nothing on the sheet could be weighed; it is a typo for kg or lb.
    if (grams.lessThan(1))
      throw new BatchError(`--${option} ${text} is less than 1 g; check the unit`, option);
    if (grams.greaterThan(KG.times(maxKg)))
      throw new BatchError(`--${option} ${text} is more than ${maxKg} kg; check the unit`, option);
    return grams;
  };
}

/** A reader for a number (percent, °C…) parsed by `parse` that must lie within [min, max]. */
function ranged(parse: (text: string) => Decimal, min: number, max: number, unit: string): Reader {
  return (text, option) => {
    const value = parse(text);
    if (value.lessThan(min) || value.greaterThan(max)) {
      throw new BatchError(
        `--${option} must be between ${min} and ${max} ${unit}, not ${text}`,
        option,
      );
    }
    return value;
  };
}

function waterReader(text: string, option: string): Decimal {
  // Brine water may be weighed or measured; a volume is converted at 1 kg per litre.
  try {
    return mass(1000)(text, option);
  } catch (error) {
    if (!(error instanceof QuantityError)) throw error;
    const litres = parseVolume(text);
    if (litres.isZero() || litres.greaterThan(1000))
      throw new BatchError(`--${option} must be more than 0 and at most 1000 L`, option);
    return waterGramsFromLitres(litres);
  }
}

/**
 * Reads "KEY=VALUE" entries, several separated by commas ("lean=12kg, fat=3kg"); a comma followed
 * by anything but another KEY= stays in the value, so "lean=1,5kg" is one entry.
 */
function keyedEntries(text: string, option: string, example: string): [string, string][] {
  return text.split(/,(?=\s*[a-z][a-z0-9-]*\s*=)/).map((entry) => {
    const match = /^\s*([a-z][a-z0-9-]*)\s*=\s*(.+?)\s*$/.exec(entry);
    if (!match) throw new BatchError(`--${option} takes KEY=VALUE, such as "${example}"`, option);
    return [match[1], match[2]];
  });
}

function onHandReader(text: string, option: string): BatchInput['onHand'] {
  return keyedEntries(text, option, 'lean=12kg').map(([key, value]) => ({
    key,
    grams: mass(1000)(value, option),
  }));
}

function fatTestReader(text: string, option: string, context: ReadContext): BatchInput['fatTest'] {
  const percent = ranged(parsePercent, 0, 100, '%');
  return keyedEntries(text, option, 'lean=18.5').map(([key, value]) => ({
    key,
    fat: percent(value, option, context) as Decimal,
  }));
}

const YEASTS: readonly YeastKind[] = ['fresh', 'active-dry', 'instant'];

/** Every batch option: which kinds take it and how to read it. */
const OPTIONS: Record<keyof BatchInput, { kinds: readonly FormulaKind[]; read: Reader }> = {
  start: {
    kinds: [...ALL, 'assembly'],
    read: (text, option, { today }) => {
      if (!isIsoDate(text))
        throw new BatchError(`--${option} takes a date written YYYY-MM-DD, not "${text}"`, option);
      return checkStartDate(text, today, option);
    },
  },
  want: { kinds: ['cure', 'blend'], read: mass(1000) },
  meat: { kinds: ['cure'], read: mass(1000) },
  thickness: { kinds: ['cure'], read: ranged(parseLength, 1, 300, 'mm') },
  largestPiece: { kinds: ['cure'], read: mass(100) },
  water: { kinds: ['cure'], read: waterReader },
  pump: { kinds: ['cure'], read: ranged(parsePercent, 1, 100, '%') },
  pumpedWeight: { kinds: ['cure'], read: mass(1000) },
  pieces: { kinds: ['dough'], read: counted(100_000) },
  piece: { kinds: ['dough'], read: mass(10) },
  loss: { kinds: ['dough'], read: ranged(parsePercent, 0, 49, '%') },
  flour: { kinds: ['dough'], read: mass(1000) },
  ddt: { kinds: ['dough'], read: ranged(parseTemperature, 10, 40, '°C') },
  room: { kinds: ['dough'], read: ranged(parseTemperature, -10, 50, '°C') },
  flourTemp: { kinds: ['dough'], read: ranged(parseTemperature, -20, 50, '°C') },
  prefermentTemp: { kinds: ['dough'], read: ranged(parseTemperature, 0, 40, '°C') },
  tap: { kinds: ['dough'], read: ranged(parseTemperature, 0, 60, '°C') },
  friction: { kinds: ['dough'], read: ranged(parseTemperatureDifference, 0, 40, '°C') },
  yeast: {
    kinds: ['dough'],
    read: (text, option) => {
      if (!(YEASTS as readonly string[]).includes(text))
        throw new BatchError(`--${option} must be one of ${YEASTS.join(', ')}`, option);
      return text;
    },
  },
  total: { kinds: ['dough', 'blend', 'mix'], read: mass(1000) },
  targetFat: { kinds: ['blend'], read: ranged(parsePercent, 0, 100, '%') },
  onHand: { kinds: ['blend'], read: onHandReader },
  fatTest: { kinds: ['blend'], read: fatTestReader },
  portion: { kinds: ['blend'], read: mass(10) },
  base: { kinds: ['mix'], read: mass(1000) },
  count: { kinds: ['assembly'], read: counted(MAX_UNITS) },
};

/** Options that apply only to one cure method. */
const CURE_METHOD_OPTIONS: Partial<Record<keyof BatchInput, string>> = {
  water: 'brine',
  pump: 'pump',
  pumpedWeight: 'pump',
};

/** The command-line spelling of an option: largestPiece → largest-piece. */
export function optionName(key: string): string {
  return key.replace(/[A-Z]/g, (letter) => `-${letter.toLowerCase()}`);
}

/**
 * Reads batch options for a formula into exact values, refusing options that do not apply to
 * its kind (or cure method) and values that cannot be right, such as a start day more than a
 * year from today (start-window.ts).
 * @param context today, from the caller's clock
 * @throws BatchError naming the option at fault
 */
export function parseBatchOptions(
  raw: RawBatchOptions,
  formula: Formula,
  context: ReadContext,
): BatchInput {
  const input: Record<string, unknown> = {};
  for (const [key, text] of Object.entries(raw)) {
    if (text === undefined) continue;
    const option = optionName(key);
    const spec = OPTIONS[key as keyof BatchInput];
    if (!spec) throw new BatchError(`there is no batch option --${option}`, option);
    if (!spec.kinds.includes(formula.kind))
      throw new BatchError(
        `--${option} does not apply to ${formula.kind === 'assembly' ? 'an' : 'a'} ${formula.kind} formula`,
        option,
      );
    const method = CURE_METHOD_OPTIONS[key as keyof BatchInput];
    if (method && formula.kind === 'cure' && formula.method !== method) {
      throw new BatchError(
        `--${option} applies only to ${method} cures; this one is ${formula.method}`,
        option,
      );
    }
    try {
      input[key] = spec.read(String(text), option, context);
    } catch (error) {
      if (error instanceof QuantityError)
        throw new BatchError(`--${option}: ${error.message}`, option);
      throw error;
    }
  }
  return input as BatchInput;
}
