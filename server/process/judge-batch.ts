import type { BatchStatus } from '../../shared/api/batch-record.ts';
import type { BatchControl, Reading } from '../../shared/api/process-record.ts';
import type {
  ControlMiss,
  ReadingPoint,
  ResolvedControl,
} from '../../shared/process/control-types.ts';
import { evaluateControl, type Clock } from '../../shared/process/evaluate-control.ts';
import type { DeviationToOpen } from './deviation-writes.ts';
import type { KeyedDeviation } from './process-repository.ts';

/** Statuses past every step: the product is finished or gone. */
const PAST_EVERY_STEP: readonly BatchStatus[] = ['done', 'discarded'];

/**
 * Every control of a batch judged on its standing readings (a corrected reading replaced by its
 * correction), at the clock's moment. A control's step is over once a later control in the
 * formula's list has a reading, or the batch is done or discarded: a cook lethality not reached
 * by then is missed, not still in progress.
 * @param readings every reading of the batch, corrected ones included, oldest first per control
 */
export function judgeBatch(
  controls: readonly ResolvedControl[],
  readings: readonly Reading[],
  status: BatchStatus,
  clock: Clock,
): BatchControl[] {
  const byControl = new Map<string, Reading[]>();
  for (const reading of readings) {
    const list = byControl.get(reading.control);
    if (list) list.push(reading);
    else byControl.set(reading.control, [reading]);
  }
  const standing = new Map<string, ReadingPoint[]>();
  for (const [id, all] of byControl)
    standing.set(
      id,
      all
        .filter((r) => r.correctedBy === null)
        .sort((a, b) => (a.at === b.at ? a.id - b.id : a.at < b.at ? -1 : 1))
        .map((r) => ({ at: r.at, value: r.value })),
    );
  return judgeStanding(controls, standing, status, clock).map((judged) => ({
    ...judged,
    readings: byControl.get(judged.control.id) ?? [],
  }));
}

/**
 * Every control judged as `judgeBatch` does, given each control's standing readings.
 * @param standing by control id, the standing readings oldest first (by time, then id); a
 * control with readings, all of them corrected, is there with none
 */
export function judgeStanding(
  controls: readonly ResolvedControl[],
  standing: ReadonlyMap<string, readonly ReadingPoint[]>,
  status: BatchStatus,
  clock: Clock,
): Omit<BatchControl, 'readings'>[] {
  const over = PAST_EVERY_STEP.includes(status);
  return controls.map((control, index) => {
    const stepOver = over || controls.slice(index + 1).some((later) => standing.has(later.id));
    return {
      control,
      state: evaluateControl(control, standing.get(control.id) ?? [], clock, { stepOver }),
    };
  });
}

/**
 * What opens a deadline's miss: the clock passing it with no reading (the deadline scan, marking
 * a batch done, verifying it), or only the readings (a reading, a correction or a logger file
 * written: see {@link shownByReadings}).
 */
export type DeadlinesBy = 'clock' | 'readings';

/** The dedupe key of one miss: `batch <id>/<control>/<miss key>`, opened once across servers. */
export function missKey(batchId: number, control: string, miss: ControlMiss): string {
  return `batch ${batchId}/${control}/${miss.key}`;
}

/**
 * A deviation to open for every miss of every control (the dedupe key skips the ones already
 * open). A reading's miss names the standing reading it was.
 */
export function deviationsToOpen(
  batch: { readonly id: number; readonly lotCode: string },
  judged: readonly BatchControl[],
  deadlines: DeadlinesBy = 'clock',
): DeviationToOpen[] {
  return judged.flatMap(({ control, state, readings }) =>
    state.misses
      .filter((miss) => deadlines === 'clock' || shownByReadings(miss, readings))
      .map((miss) => ({
        batchId: batch.id,
        subject: batch.lotCode,
        control: control.id,
        kind: miss.kind,
        what: `${control.title}: ${miss.what}`,
        readingId:
          miss.kind === 'reading'
            ? (readings.find((r) => r.correctedBy === null && r.at === miss.at)?.id ?? null)
            : null,
        key: missKey(batch.id, control.id, miss),
      })),
  );
}

/**
 * Whether a miss is shown by the readings themselves: any but a deadline; a deadline only when a
 * standing reading of the control was taken after it (and none reached the stage by then). A
 * reading entered late is judged by the time it was taken: the readings typed in after a deadline,
 * one by one, do not miss it before the one taken after it (or the one that reached it) is in.
 */
export function shownByReadings(miss: ControlMiss, readings: readonly Reading[]): boolean {
  if (miss.kind !== 'deadline') return true;
  const deadline = Date.parse(miss.at);
  return readings.some((r) => r.correctedBy === null && Date.parse(r.at) > deadline);
}

/**
 * The open deadline deviations of a batch that its readings as they now stand no longer miss:
 * readings taken in time came in after the deadline had passed. A stage reached late is still
 * missed (the same key, now a reading's miss): its deviation stands.
 * @param deviations the batch's deviations, with their dedupe keys
 */
export function deadlinesNowMet<
  D extends Pick<KeyedDeviation, 'kind' | 'control' | 'action' | 'key'>,
>(
  batchId: number,
  judged: readonly BatchControl[],
  deviations: readonly D[],
): { deviation: D; control: BatchControl }[] {
  const missed = new Set(
    judged.flatMap(({ control, state }) =>
      state.misses.map((miss) => missKey(batchId, control.id, miss)),
    ),
  );
  return deviations.flatMap((deviation) => {
    if (deviation.kind !== 'deadline' || deviation.action !== null || missed.has(deviation.key))
      return [];
    const control = judged.find((c) => c.control.id === deviation.control);
    return control ? [{ deviation, control }] : [];
  });
}

/** The limit types judged reading by reading: in limit so far is all they can ever be. */
const EACH_READING = new Set(['at-most', 'at-least', 'between']);

/**
 * Whether a control lets a finished batch be released: met; or judged reading by reading with
 * readings all in limit; or missed with a closed deviation for every miss.
 * @param closedKeys the dedupe keys of the batch's deviations that have a corrective action
 */
export function controlClosed(
  batchId: number,
  { control, state }: BatchControl,
  closedKeys: ReadonlySet<string>,
): boolean {
  const missesClosed = state.misses.every((miss) =>
    closedKeys.has(missKey(batchId, control.id, miss)),
  );
  if (state.status === 'met') return missesClosed;
  if (state.status === 'missed') return state.misses.length > 0 && missesClosed;
  if (state.status === 'in-progress') return EACH_READING.has(control.limit.type) && missesClosed;
  return false;
}
