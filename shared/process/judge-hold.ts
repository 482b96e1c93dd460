/**
 * Cooking and lethality: met once a run of consecutive readings, all at or above one row's
 * temperature, spans at least that row's time ("0": one reading at or above suffices).
 */
import { Decimal } from '../decimal.ts';
import type {
  ControlLimit,
  ControlState,
  HoldRow,
  ReadingPoint,
  ResolvedControl,
} from './control-types.ts';
import { clockWords, durationWords, temperatureWords } from './control-words.ts';
import type { Clock } from './evaluate-control.ts';
import { addSeconds, instantMs, secondsBetween } from './judge-time.ts';

type HoldLimit = Extract<ControlLimit, { type: 'hold' }>;

/** The first reading at which the row is met, with the run's first reading, or null. */
function rowMet(
  row: HoldRow,
  readings: readonly ReadingPoint[],
): { runStart: ReadingPoint; metAt: ReadingPoint } | null {
  const needMs = new Decimal(row.holdS).times(1000);
  let runStart: ReadingPoint | null = null;
  for (const reading of readings) {
    if (new Decimal(reading.value).lessThan(row.tempC)) {
      runStart = null;
      continue;
    }
    runStart ??= reading;
    if (needMs.lessThanOrEqualTo(instantMs(reading.at) - instantMs(runStart.at))) {
      return { runStart, metAt: reading };
    }
  }
  return null;
}

/** Seconds the readings have stayed at or above the row's temperature up to the last one. */
function trailingRunS(row: HoldRow, readings: readonly ReadingPoint[]): string | null {
  let start: ReadingPoint | null = null;
  for (let i = readings.length - 1; i >= 0; i--) {
    if (new Decimal(readings[i].value).lessThan(row.tempC)) break;
    start = readings[i];
  }
  const last = readings.at(-1);
  return start && last ? secondsBetween(instantMs(start.at), instantMs(last.at)) : null;
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
function progressWords(rows: readonly HoldRow[], readings: readonly ReadingPoint[]): string | null {
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
  readings: readonly ReadingPoint[],
  clock: Clock,
  stepOver: boolean,
): ControlState {
  const rows = [...limit.rows].sort((a, b) => new Decimal(a.tempC).comparedTo(b.tempC));
  const when = (iso: string): string => clockWords(iso, clock.timeZone, clock.now);
  let earliest: { row: HoldRow; runStart: ReadingPoint; metAt: ReadingPoint } | null = null;
  for (const row of rows) {
    const met = rowMet(row, readings);
    if (met && (!earliest || instantMs(met.metAt.at) < instantMs(earliest.metAt.at))) {
      earliest = { row, ...met };
    }
  }
  if (earliest) {
    const { row, runStart, metAt } = earliest;
    const held = secondsBetween(instantMs(runStart.at), instantMs(metAt.at));
    const summary =
      row.holdS === '0'
        ? `Met: ${temperatureWords(metAt.value)} at ${when(metAt.at)} (needs ${rowWords(row)})`
        : `Met: at or above ${temperatureWords(row.tempC)} for ${durationWords(held)} by ${when(metAt.at)} (needs ${durationWords(row.holdS)})`;
    return { status: 'met', summary, stage: null, nextDue: null, misses: [] };
  }
  const need = needWords(rows);
  const last = readings.at(-1);
  const highest = readings.reduce<Decimal | null>(
    (top, reading) =>
      top === null || top.lessThan(reading.value) ? new Decimal(reading.value) : top,
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
