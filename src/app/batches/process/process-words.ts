import { Decimal } from '../../../../shared/decimal.ts';
import type {
  BatchControl,
  CanonicalUnit,
  ControlLimit,
  ControlStatus,
  Disposition,
  Measure,
  Reading,
  StageName,
} from './process-types';

const CLOCK = new Intl.DateTimeFormat('en-GB', { hour: '2-digit', minute: '2-digit' });
const DAY_AND_CLOCK = new Intl.DateTimeFormat('en-GB', {
  day: 'numeric',
  month: 'short',
  hour: '2-digit',
  minute: '2-digit',
});

/** A decimal rounded half-up to `places`, without a trailing ".0". */
function rounded(value: string, places: number): string {
  const text = new Decimal(value).toFixed(places);
  return text.includes('.') ? text.replace(/\.?0+$/, '') : text;
}

/** A number of seconds in a cook's words: "17 s", "3 min", "1 h 30 min". */
export function durationWords(seconds: string): string {
  const total = new Decimal(seconds);
  if (total.lessThan(60)) return `${rounded(seconds, 0)} s`;
  const minutes = total.div(60).toDecimalPlaces(0).toNumber();
  const hours = Math.floor(minutes / 60);
  const rest = minutes % 60;
  if (hours === 0) return `${minutes} min`;
  return rest === 0 ? `${hours} h` : `${hours} h ${rest} min`;
}

/** A grams figure as a scale shows it: "950 g", "12.45 kg". */
export function weightWords(grams: string): string {
  const value = new Decimal(grams);
  return value.abs().greaterThanOrEqualTo(1000)
    ? `${rounded(value.div(1000).toString(), 2)} kg`
    : `${rounded(grams, 1)} g`;
}

/** A value in its canonical unit, as a cook reads it: "21.1 °C", "17 s", "6.2 pH". */
export function valueWords(value: string, unit: CanonicalUnit): string {
  switch (unit) {
    case '°C':
      return `${rounded(value, 1)} °C`;
    case 's':
      return durationWords(value);
    case 'g':
      return weightWords(value);
    case 'pH':
      return `pH ${rounded(value, 2)}`;
    case 'aw':
      return `water activity ${rounded(value, 3)}`;
  }
}

/** The critical limit in words: "at most 5 °C", "from 54.4 °C to 26.7 °C within 1 h 30 min, …". */
export function limitWords(limit: ControlLimit, unit: CanonicalUnit): string {
  const v = (value: string): string => valueWords(value, unit);
  switch (limit.type) {
    case 'at-most':
      return `at most ${v(limit.max)}`;
    case 'at-least':
      return `at least ${v(limit.min)}`;
    case 'between':
      return `between ${v(limit.min)} and ${v(limit.max)}`;
    case 'hold': {
      const rows = limit.rows.map((row) =>
        new Decimal(row.holdS).isZero()
          ? `${v(row.tempC)} at once`
          : `${v(row.tempC)} for ${durationWords(row.holdS)}`,
      );
      return `at least ${rows.join(', or ')}`;
    }
    case 'cooling':
      return limit.stages
        .map((stage, index) => {
          const from =
            index === 0 ? `from ${v(stage.fromC)} ` : index === 1 ? 'then ' : 'and then ';
          const counted = stage.countedFrom === 'cooling-start' && index > 0 ? ' of the start' : '';
          return `${from}to ${v(stage.toC)} within ${durationWords(stage.withinS)}${counted}`;
        })
        .join(', ');
  }
}

/** The unit a bare number typed for a measure is taken in, shown beside the reading box. */
export function entryUnit(measure: Measure): string {
  switch (measure) {
    case 'internal-temperature':
    case 'chamber-temperature':
      return '°C';
    case 'time':
      return 'min';
    case 'weight':
      return 'kg';
    case 'ph':
      return 'pH';
    case 'water-activity':
      return 'aw';
  }
}

const BARE_NUMBER = /^\s*(-?\d+(?:[.,]\d+)?)\s*$/;

/**
 * The reading as the API reads it: a bare number gets the box's unit ("71.5" → "71.5 °C"; a
 * decimal comma is a point); anything with a unit ("160 F") is sent as typed.
 */
export function readingText(typed: string, measure: Measure): string {
  const bare = BARE_NUMBER.exec(typed);
  if (!bare) return typed.trim();
  const number = bare[1].replace(',', '.');
  const unit = entryUnit(measure);
  return unit === 'pH' || unit === 'aw' ? number : `${number} ${unit}`;
}

/** A control's status in words, said beside its colour. */
export const STATUS_WORDS: Readonly<Record<ControlStatus, string>> = {
  waiting: 'No reading yet',
  'in-progress': 'Within the limit so far',
  met: 'Limit met',
  missed: 'Limit missed',
};

/** What happened to the product, as the corrective action dialog offers it. */
export const DISPOSITION_WORDS: Readonly<Record<Disposition, string>> = {
  recooked: 'Re-cooked',
  rechilled: 'Re-chilled',
  reworked: 'Re-worked',
  diverted: 'Diverted to another use',
  discarded: 'Discarded',
};

/** The stage weights in the order of the work, with their words. */
export const STAGE_WORDS: Readonly<Record<StageName, string>> = {
  green: 'Green (raw, trimmed)',
  pumped: 'After pumping',
  cured: 'After curing',
  smoked: 'After smoking',
  cooked: 'After cooking',
  sliced: 'After slicing',
};

/** A time of day on the kitchen's clock, with the day when it is not today: "14:32", "3 Mar, 09:10". */
export function clockWords(iso: string, now: Date = new Date()): string {
  const moment = new Date(iso);
  if (Number.isNaN(moment.getTime())) return iso;
  return moment.toDateString() === now.toDateString()
    ? CLOCK.format(moment)
    : DAY_AND_CLOCK.format(moment);
}

/** When the next reading is due, in words: "due by 14:32, in 12 min", "overdue since 14:02". */
export function dueWords(nextDue: string | null, now: Date): string | null {
  if (!nextDue) return null;
  const due = new Date(nextDue);
  const minutes = Math.round((due.getTime() - now.getTime()) / 60_000);
  if (minutes < 0) return `Overdue since ${clockWords(nextDue, now)}`;
  if (minutes === 0) return `Due now (${clockWords(nextDue, now)})`;
  const left = minutes >= 60 ? durationWords(String(minutes * 60)) : `${minutes} min`;
  return `Due by ${clockWords(nextDue, now)}, in ${left}`;
}

/**
 * The controls in the order a cook works them: the one whose next reading is due soonest first,
 * then the ones with nothing due, in the formula's order.
 */
export function controlsByDue(controls: readonly BatchControl[]): BatchControl[] {
  const dueAt = (c: BatchControl): number =>
    c.state.nextDue ? new Date(c.state.nextDue).getTime() : Number.POSITIVE_INFINITY;
  return controls
    .map((control, index) => ({ control, index }))
    .sort((a, b) => dueAt(a.control) - dueAt(b.control) || a.index - b.index)
    .map(({ control }) => control);
}

/** A control's readings newest first, each standing one beside the one it replaced. */
export function readingsNewestFirst(readings: readonly Reading[]): Reading[] {
  return [...readings].sort(
    (a, b) => new Date(b.at).getTime() - new Date(a.at).getTime() || b.id - a.id,
  );
}

/** The readings that stand: corrected ones left out (their correction stands in their place). */
export function standingReadings(readings: readonly Reading[]): Reading[] {
  return readings.filter((reading) => reading.correctedBy === null);
}
