/**
 * A staged cool: the clock starts at the last reading at or above the first stage's `from`
 * before the first reading below it; each stage ends at the first reading at or below its `to`,
 * and must do so by its deadline.
 */
import { Decimal } from '../decimal.ts';
import type { ControlLimit, ControlMiss, ControlState, ResolvedControl } from './control-types.ts';
import { clockWords, durationWords, temperatureWords } from './control-words.ts';
import type { Clock } from './evaluate-control.ts';
import { pointMs, type JudgedPoint } from './judged-point.ts';
import { addSeconds, instantMs, secondsBetween } from './judge-time.ts';

type CoolingLimit = Extract<ControlLimit, { type: 'cooling' }>;

/** The index of the first reading from `from` on at or below `toC`, or -1. */
function firstAtOrBelow(readings: readonly JudgedPoint[], from: number, toC: Decimal): number {
  for (let i = from; i < readings.length; i++) {
    if (readings[i].decimal.lessThanOrEqualTo(toC)) return i;
  }
  return -1;
}

/** The judgement of a cooling limit; stage numbers and miss keys ("stage-1") count from 1. */
export function judgeCooling(
  control: ResolvedControl,
  limit: CoolingLimit,
  readings: readonly JudgedPoint[],
  clock: Clock,
): ControlState {
  const when = (iso: string): string => clockWords(iso, clock.timeZone, clock.now);
  const first = limit.stages[0];
  const last = readings.at(-1);
  const nextDue = last && control.everyS !== null ? addSeconds(last.at, control.everyS) : null;
  if (!last) {
    return {
      status: 'waiting',
      summary: `No reading yet; the cooling clock starts below ${temperatureWords(first.fromC)}`,
      stage: null,
      nextDue: null,
      misses: [],
    };
  }
  const fromC = new Decimal(first.fromC);
  const below = readings.findIndex((reading) => reading.decimal.lessThan(fromC));
  if (below === -1) {
    return {
      status: 'in-progress',
      summary:
        `Not cooling yet: ${temperatureWords(last.value)} at ${when(last.at)}; the clock starts ` +
        `when it drops below ${temperatureWords(first.fromC)}`,
      stage: null,
      nextDue,
      misses: [],
    };
  }
  const startIndex = below === 0 ? 0 : below - 1;
  const coolingStartMs = pointMs(readings[startIndex]);
  const unseen =
    below === 0
      ? `; the start above ${temperatureWords(first.fromC)} was not seen, so it is timed from the first reading at ${when(readings[0].at)}`
      : '';
  const misses: ControlMiss[] = [];
  const reached: string[] = [];
  let stageStartMs = coolingStartMs;
  let index = startIndex;
  for (const [i, stage] of limit.stages.entries()) {
    const number = i + 1;
    const originMs = stage.countedFrom === 'stage-start' ? stageStartMs : coolingStartMs;
    const deadline = addSeconds(originMs, stage.withinS);
    const target = temperatureWords(stage.toC);
    const found = firstAtOrBelow(readings, index, new Decimal(stage.toC));
    if (found === -1) {
      if (instantMs(clock.now) > instantMs(deadline)) {
        misses.push({
          kind: 'deadline',
          at: deadline,
          key: `stage-${number}`,
          what: `Stage ${number}: not at ${target} by ${when(deadline)}; last ${temperatureWords(last.value)} at ${when(last.at)}`,
        });
      }
      const must = `Stage ${number}: must reach ${target} by ${when(deadline)}`;
      const missed = misses.length > 0;
      return {
        status: missed ? 'missed' : 'in-progress',
        summary: missed
          ? `Missed. ${misses.map((miss) => miss.what).join('. ')}. ${must}${unseen}`
          : `${must}${unseen}`,
        stage: { index: number, toC: stage.toC, deadline },
        nextDue,
        misses,
      };
    }
    const reading = readings[found];
    const reachedMs = pointMs(reading);
    const took = durationWords(secondsBetween(originMs, reachedMs));
    if (reachedMs > instantMs(deadline)) {
      misses.push({
        kind: 'reading',
        at: reading.at,
        key: `stage-${number}`,
        what: `Stage ${number}: ${temperatureWords(reading.value)} at ${when(reading.at)}; must be ${target} or below by ${when(deadline)}`,
      });
    }
    reached.push(
      stage.countedFrom === 'stage-start'
        ? `${target} in ${took}`
        : `${target} ${took} after the start`,
    );
    stageStartMs = reachedMs;
    index = found;
  }
  if (misses.length > 0) {
    return {
      status: 'missed',
      summary: `Missed. ${misses.map((miss) => miss.what).join('. ')}${unseen}`,
      stage: null,
      nextDue: null,
      misses,
    };
  }
  return {
    status: 'met',
    summary: `Cooled in time: ${reached.join(', then ')}${unseen}`,
    stage: null,
    nextDue: null,
    misses,
  };
}
