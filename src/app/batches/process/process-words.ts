import { Decimal } from '../../../../shared/decimal.ts';
import {
  clockWords as coreClockWords,
  durationWords,
  valueWords as coreValueWords,
} from '../../../../shared/process/control-words.ts';
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

/** The kitchen's time zone: the clocks on the tablet's wall. */
const KITCHEN_ZONE = Intl.DateTimeFormat().resolvedOptions().timeZone;

export { durationWords };

/** A decimal rounded half-up to `places`, without a trailing ".0". */
function rounded(value: string, places: number): string {
  const text = new Decimal(value).toFixed(places);
  return text.includes('.') ? text.replace(/\.?0+$/, '') : text;
}

/** A grams figure as a scale shows it: "950 g", "12.45 kg". */
export function weightWords(grams: string): string {
  const value = new Decimal(grams);
  return value.abs().greaterThanOrEqualTo(1000)
    ? `${rounded(value.div(1000).toString(), 2)} kg`
    : `${rounded(grams, 1)} g`;
}

/** A value in its canonical unit, as a cook reads it: "21.1 °C (70 °F)", "17 s", "12.45 kg". */
export function valueWords(value: string, unit: CanonicalUnit): string {
  return unit === 'g' ? weightWords(value) : coreValueWords(value, unit);
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

/** What happened to the product, in words; the dialog offers all but `unaffected`. */
export const DISPOSITION_WORDS: Readonly<Record<Disposition, string>> = {
  recooked: 'Re-cooked',
  rechilled: 'Re-chilled',
  reworked: 'Re-worked',
  diverted: 'Diverted to another use',
  discarded: 'Discarded',
  unaffected: 'Not affected: the readings show the limit was met',
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

/** A time of day on the kitchen's clock, with the day when it is not today: "14:32", "Tue 3 Mar, 09:10". */
export function clockWords(iso: string, now: Date = new Date()): string {
  if (Number.isNaN(new Date(iso).getTime())) return iso;
  return coreClockWords(iso, KITCHEN_ZONE, now.toISOString());
}

/** When the next reading is due, in words: "due by 14:32, in 12 min", "overdue since 14:02". */
export function dueWords(nextDue: string | null, now: Date): string | null {
  if (!nextDue) return null;
  const due = new Date(nextDue);
  const minutes = Math.round((due.getTime() - now.getTime()) / 60_000);
  if (minutes < 0) return `overdue since ${clockWords(nextDue, now)}`;
  if (minutes === 0) return `due now (${clockWords(nextDue, now)})`;
  const left = minutes >= 60 ? durationWords(String(minutes * 60)) : `${minutes} min`;
  return `due by ${clockWords(nextDue, now)}, in ${left}`;
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
