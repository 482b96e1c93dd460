import {
  BATCH_OPTION_NAMES,
  type BatchOptionName,
} from '../../../../shared/calculation/batch-option-names.ts';
import { holdSizeOfRule, type HoldSize } from '../../../../shared/calculation/cure/hold-size.ts';
import type { FormulaFacts, RawBatchOptions } from '../batch-types';

/** What a batch option measures, which decides the unit a bare number is taken in. */
export type Measure = 'mass' | 'small-mass' | 'length' | 'percent' | 'count' | 'temperature';

// The batch options with no box of their own: the start has its date picker and a blend's
// trimmings their own rows; the rest are left to the formula.
const NOT_BOXES = ['start', 'want', 'friction', 'yeast', 'onHand', 'fatTest', 'portion'] as const;

/** The batch options the record form offers a box for (keys of the API's batch options). */
export type FieldKey = Exclude<BatchOptionName, (typeof NOT_BOXES)[number]>;

/** Every {@link FieldKey}. */
export const FIELD_KEYS: readonly FieldKey[] = BATCH_OPTION_NAMES.filter(
  (name): name is FieldKey => !(NOT_BOXES as readonly string[]).includes(name),
);

/** One box of the record form. */
export interface BatchField {
  readonly key: FieldKey;
  readonly label: string;
  readonly measure: Measure;
  /** A line under the box: what to enter, or that the formula's own value is used when empty. */
  readonly hint: string;
  /** Whether a batch made now cannot be recorded without it (the size the hold goes by). */
  readonly required?: boolean;
}

/** Unit systems a batch sheet can be printed in. */
export type Units = 'metric' | 'us';

const f = (key: FieldKey, label: string, measure: Measure, hint: string): BatchField => ({
  key,
  label,
  measure,
  hint,
});

/** The two sizes a cure's hold may go by, as boxes. */
const SIZE_FIELDS: Readonly<Record<HoldSize, BatchField>> = {
  thickness: f('thickness', 'Thickness of the thickest piece', 'length', 'For the hold time'),
  largestPiece: f('largestPiece', 'Weight of the heaviest piece', 'mass', 'For the hold time'),
};

/**
 * The size boxes of a cure: only the size its own hold rule goes by (none for fixed days); both
 * when it has no rule of its own, since the default rule depends on the brine the batch makes.
 * The size the hold goes by (its own rule's, or the one the preview says is missing) is required.
 */
function sizeFields(formula: FormulaFacts, missing: HoldSize | null): BatchField[] {
  const own = formula.hold ? holdSizeOfRule(formula.hold) : null;
  const offered: HoldSize[] = formula.hold ? (own ? [own] : []) : ['thickness', 'largestPiece'];
  if (missing && !offered.includes(missing)) offered.push(missing);
  return offered.map((size) =>
    size === own || size === missing
      ? { ...SIZE_FIELDS[size], hint: 'Needed: the hold time goes by it', required: true }
      : SIZE_FIELDS[size],
  );
}

/**
 * The boxes a formula's batch takes, in the order a cook thinks of them; options that apply only
 * to another cure method (water for brine, pump for injected) or another hold rule are left out.
 * @param missing the size the latest preview says the hold needs and was not given
 */
export function fieldsFor(formula: FormulaFacts, missing: HoldSize | null = null): BatchField[] {
  switch (formula.kind) {
    case 'cure':
      return [
        f('meat', 'Green meat weight', 'mass', 'Trimmed, raw, uncured'),
        ...sizeFields(formula, missing),
        ...(formula.method === 'brine'
          ? [f('water', 'Water', 'mass', 'By weight, or in litres (12 L); empty: the formula’s')]
          : []),
        ...(formula.method === 'pump'
          ? [
              f(
                'pump',
                'Pump',
                'percent',
                'Brine injected, % of green weight; empty: the formula’s',
              ),
              f(
                'pumpedWeight',
                'Weight after injecting',
                'mass',
                'Nitrite is checked on the pump reached',
              ),
            ]
          : []),
      ];
    case 'dough':
      return [
        f('pieces', 'Pieces', 'count', 'How many to divide'),
        f('piece', 'Piece weight', 'small-mass', 'Empty: the formula’s'),
        f('loss', 'Loss allowance', 'percent', 'Dough lost in mixing and dividing'),
        f('flour', 'Total flour', 'mass', 'Or scale to a flour weight'),
        f('total', 'Mixed dough weight', 'mass', 'Or scale to a dough weight'),
        f('ddt', 'Desired dough temperature', 'temperature', 'Empty: the formula’s'),
        f('room', 'Room temperature', 'temperature', 'For the water temperature'),
        f('flourTemp', 'Flour temperature', 'temperature', 'For the water temperature'),
        ...(formula.preferment
          ? [
              f(
                'prefermentTemp',
                'Preferment temperature',
                'temperature',
                'For the water temperature',
              ),
            ]
          : []),
        f('tap', 'Tap water temperature', 'temperature', 'Ice is added when the tap is too warm'),
      ];
    case 'blend':
      return [
        f('total', 'Meat weight', 'mass', 'The blend’s total'),
        f('targetFat', 'Target fat', 'percent', 'Empty: the formula’s'),
      ];
    case 'mix':
      return [
        f('base', 'Base ingredient weight', 'mass', 'Scale to the base'),
        f('total', 'Total weight', 'mass', 'Or scale to the total'),
      ];
    case 'assembly':
      // Its parts come from their own formulas, at the count made.
      return [
        f('count', 'Number of units', 'count', 'Burgers, packs: one unit as the formula serves it'),
      ];
  }
}

const UNITS: Readonly<Record<Units, Readonly<Record<Measure, string>>>> = {
  metric: {
    mass: 'kg',
    'small-mass': 'g',
    length: 'cm',
    percent: '%',
    count: '',
    temperature: '°C',
  },
  us: { mass: 'lb', 'small-mass': 'oz', length: 'in', percent: '%', count: '', temperature: '°F' },
};

/** The unit a bare number in a box is taken in, shown beside the box. */
export function unitOf(measure: Measure, units: Units): string {
  return UNITS[units][measure];
}

/** The unit of every measure in a unit system. */
export function unitsOf(units: Units): Readonly<Record<Measure, string>> {
  return UNITS[units];
}

const BARE_NUMBER = /^\s*(\d+(?:[.,]\d+)?)\s*$/;

/**
 * The text the API reads for a box: a bare number gets the box's unit ("4.26" → "4.26 kg"; a
 * decimal comma is read as a point); anything with a unit is sent as typed ("9 lb 6 oz", "12 L").
 */
export function withUnit(text: string, measure: Measure, units: Units): string {
  const bare = BARE_NUMBER.exec(text);
  if (!bare) return text.trim();
  const number = bare[1].replace(',', '.');
  const unit = unitOf(measure, units);
  if (measure === 'percent' || measure === 'count') return number;
  return measure === 'temperature' ? `${number}${unit === '°C' ? 'C' : 'F'}` : `${number} ${unit}`;
}

/**
 * A recorded option as it goes back into its box: the bare number when its unit is the box's
 * own ("4.26kg" → "4.26" beside kg), so the box never reads "4.26kg kg"; any other text as it is.
 */
export function inBox(text: string, measure: Measure, units: Units): string {
  const said = /^\s*(\d+(?:[.,]\d+)?)\s*(\S*)\s*$/.exec(text);
  if (!said) return text;
  const plain = (unit: string): string => unit.replace('°', '').toLowerCase();
  return plain(said[2]) === plain(unitOf(measure, units)) ? said[1] : text;
}

/** What was typed for one trimming of a blend: the weight on hand and a fat test, if any. */
export interface TrimmingValues {
  readonly key: string;
  readonly onHand: string;
  readonly fatTest: string;
}

/** The labels of a blend's per-trimming boxes, for messages that name their options. */
const TRIMMING_LABELS: Readonly<Record<string, string>> = {
  'on-hand': 'On hand',
  'fat-test': 'Fat test',
};

/**
 * The batch options for the API from what was typed: empty boxes are left out, bare numbers get
 * their unit, and a blend's trimmings become KEY=VALUE lists ("lean=12 kg, plate=3 kg").
 */
export function batchOptions(
  fields: readonly BatchField[],
  values: Readonly<Partial<Record<FieldKey, string>>>,
  units: Units,
  trimmings: readonly TrimmingValues[],
  start: string | null,
): RawBatchOptions {
  const options: Record<string, string> = {};
  for (const field of fields) {
    const text = values[field.key]?.trim() ?? '';
    if (text === '') continue;
    options[field.key] = withUnit(text, field.measure, units);
  }
  const keyed = (pick: 'onHand' | 'fatTest', measure: Measure): string =>
    trimmings
      .filter((t) => t[pick].trim() !== '')
      .map((t) => `${t.key}=${withUnit(t[pick], measure, units)}`)
      .join(', ');
  const onHand = keyed('onHand', 'mass');
  const fatTest = keyed('fatTest', 'percent');
  if (onHand) options['onHand'] = onHand;
  if (fatTest) options['fatTest'] = fatTest;
  if (start) options['start'] = start;
  return options;
}

/**
 * An API message about a batch option in the form's words: "--largest-piece" becomes the box's
 * label, since the console has boxes, not command-line options.
 */
export function inFormWords(message: string, fields: readonly BatchField[]): string {
  const text = message.replace(/--([a-z]+(?:-[a-z]+)*)/g, (whole, option: string) => {
    const key = option.replace(/-([a-z])/g, (_m, letter: string) => letter.toUpperCase());
    const field = fields.find((x) => x.key === key);
    const label = field?.label ?? TRIMMING_LABELS[option];
    return label ? `“${label}”` : whole;
  });
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/** The box an API message is about, from its details ({ option: "largest-piece" }). */
export function fieldOf(details: readonly unknown[]): FieldKey | null {
  for (const detail of details) {
    const option = (detail as { option?: unknown } | null)?.option;
    if (typeof option === 'string')
      return option.replace(/-([a-z])/g, (_m, letter: string) => letter.toUpperCase()) as FieldKey;
  }
  return null;
}
