/**
 * Cooking and lethality: met once a run of consecutive readings, all at or above one row's
 * temperature, spans at least that row's time ("0": one reading at or above suffices).
 */
import { Decimal } from '../decimal.ts';
import type { ControlLimit, ControlState, HoldRow, ResolvedControl } from './control-types.ts';
import { clockWords, durationWords, temperatureWords } from './control-words.ts';
import type { Clock } from './evaluate-control.ts';
import { pointMs, type JudgedPoint } from './judged-point.ts';
import { addSeconds, secondsBetween } from './judge-time.ts';

type HoldLimit = Extract<ControlLimit, { type: 'hold' }>;

/**
 * The least whole number of milliseconds a run must span to meet the row: times are whole
 * milliseconds, so "needs ≤ span" holds exactly when the need rounded up is ≤ span. Beyond the
 * integers a number holds exactly, no span of real times reaches it.
 */
function needWholeMs(row: HoldRow): number {
  const need = new Decimal(row.holdS).times(1000).ceil();
  return need.lessThanOrEqualTo(Number.MAX_SAFE_INTEGER) ? need.toNumber() : Infinity;
}

/** The first reading at which the row is met, with the run's first reading, or null. */
function rowMet(
  row: HoldRow,
  readings: readonly JudgedPoint[],
): { runStart: JudgedPoint; metAt: JudgedPoint } | null {
  const needMs = needWholeMs(row);
  const tempC = new Decimal(row.tempC);
  let runStart: JudgedPoint | null = null;
  for (const reading of readings) {
    if (reading.decimal.lessThan(tempC)) {
      runStart = null;
      continue;
    }
    runStart ??= reading;
    if (needMs <= pointMs(reading) - pointMs(runStart)) {
      return { runStart, metAt: reading };
    }
  }
  return null;
}

/** Seconds the readings have stayed at or above the row's temperature up to the last one. */
function trailingRunS(row: HoldRow, readings: readonly JudgedPoint[]): string | null {
  const tempC = new Decimal(row.tempC);
  let start: JudgedPoint | null = null;
  for (let i = readings.length - 1; i >= 0; i--) {
    if (readings[i].decimal.lessThan(tempC)) break;
    start = readings[i];
  }
  const last = readings.at(-1);
  return start && last ? secondsBetween(pointMs(start), pointMs(last)) : null;
}

function rowWords(row: HoldRow): string {
  const temperature = temperatureWords(row.tempC);
  return row.holdS === '0' ? temperature : `${temperature} for ${durationWords(row.holdS)}`;
}

function needWords(rows: readonly HoldRow[]): string {
  if (rows.length === 1) return rowWords(rows[0]);
  return `${rowWords(rows[0])}, or a hotter temperature of its table for its time`;
}

/** How close the run that ends at the last reading is to meeting a row. */
function progressWords(rows: readonly HoldRow[], readings: readonly JudgedPoint[]): string | null {
  let best: { row: HoldRow; soFar: string; left: Decimal } | null = null;
  for (const row of rows) {
    const soFar = trailingRunS(row, readings);
    if (soFar === null) continue;
    const left = new Decimal(row.holdS).minus(soFar);
    if (!best || left.lessThan(best.left)) best = { row, soFar, left };
  }
  if (!best) return null;
  return (
    `at or above ${temperatureWords(best.row.tempC)} for ${durationWords(best.soFar)} ` +
    `of the ${durationWords(best.row.holdS)} it needs`
  );
}

/** The judgement of a hold limit. */
export function judgeHold(
  control: ResolvedControl,
  limit: HoldLimit,
  readings: readonly JudgedPoint[],
  clock: Clock,
  stepOver: boolean,
): ControlState {
  const rows = [...limit.rows].sort((a, b) => new Decimal(a.tempC).comparedTo(b.tempC));
  const when = (iso: string): string => clockWords(iso, clock.timeZone, clock.now);
  let earliest: { row: HoldRow; runStart: JudgedPoint; metAt: JudgedPoint } | null = null;
  for (const row of rows) {
    const met = rowMet(row, readings);
    if (met && (!earliest || pointMs(met.metAt) < pointMs(earliest.metAt))) {
      earliest = { row, ...met };
    }
  }
  if (earliest) {
    const { row, runStart, metAt } = earliest;
    const held = secondsBetween(pointMs(runStart), pointMs(metAt));
    const summary =
      row.holdS === '0'
        ? `Met: ${temperatureWords(metAt.value)} at ${when(metAt.at)} (needs ${rowWords(row)})`
        : `Met: at or above ${temperatureWords(row.tempC)} for ${durationWords(held)} by ${when(metAt.at)} (needs ${durationWords(row.holdS)})`;
    return { status: 'met', summary, stage: null, nextDue: null, misses: [] };
  }
  const need = needWords(rows);
  const last = readings.at(-1);
  const highest = readings.reduce<Decimal | null>(
    (top, reading) => (top === null || top.lessThan(reading.decimal) ? reading.decimal : top),
    null,
  );
  const highestWords =
    highest === null ? 'no reading was taken' : `the highest was ${temperatureWords(highest)}`;
  if (stepOver) {
    const at = last?.at ?? clock.now;
    const what = `Not reached before the step ended: needs ${need}; ${highestWords}`;
    return {
      status: 'missed',
      summary: what,
      stage: null,
      nextDue: null,
      misses: [{ kind: 'reading', at, key: 'not-reached', what }],
    };
  }
  if (!last)
    return {
      status: 'waiting',
      summary: `No reading yet; needs ${need}`,
      stage: null,
      nextDue: null,
      misses: [],
    };
  const nextDue = control.everyS === null ? null : addSeconds(last.at, control.everyS);
  const progress = progressWords(rows, readings);
  const lastWords = `${temperatureWords(last.value)} at ${when(last.at)}`;
  const summary = `Not yet ${need}: ${progress ?? `last ${lastWords}`}`;
  return { status: 'in-progress', summary, stage: null, nextDue, misses: [] };
}
