import type { AppContext } from '../app-context.ts';
import { PeriodicRun } from '../reminders/periodic-run.ts';
import { deviationsToOpen, judgeBatch } from './judge-batch.ts';
import { judgeAndOpen, type ProcessDeps } from './judge-and-open.ts';
import { kitchenClock } from './kitchen-clock.ts';
import type { ProcessJobOptions } from './process-job-options.ts';
import { BEING_MADE } from './process-repository.ts';

/** How often the controls of batches being made are judged: a cooling deadline is to the minute. common practice, no source */
export const SCAN_EVERY_MS = 60_000;

/** What one run opened: each deviation's id and the lot it holds. */
export interface ScanRun {
  readonly at: string;
  readonly opened: readonly { readonly lotCode: string; readonly deviation: number }[];
}

/**
 * Finds deadlines that passed with no reading (a cool that did not reach its stage in time) and
 * opens their deviations, once: at start, then every minute. A miss is opened in one write with
 * the dedupe key that names it, so no run — in this process, after a restart, or on a second
 * server on the same database — opens it twice. A batch is read first and written only when it
 * has a miss not yet opened.
 */
export class DeadlineScan extends PeriodicRun<ScanRun> {
  private readonly now: () => Date;

  constructor(
    private readonly deps: ProcessDeps,
    context: Pick<AppContext, 'now'>,
    options: ProcessJobOptions = {},
  ) {
    super(options.intervalMs ?? SCAN_EVERY_MS, options.report);
    this.now = options.now ?? context.now;
  }

  protected async run(): Promise<ScanRun> {
    const { process, db } = this.deps;
    const at = this.now().toISOString();
    const opened: { lotCode: string; deviation: number }[] = [];
    for (const batch of await process.beingMade()) {
      const controls = await process.controlsOf(batch);
      if (controls.length === 0) continue;
      const judged = judgeBatch(
        controls,
        await process.readings(batch.id),
        batch.status,
        kitchenClock(at),
      );
      const known = new Set((await process.deviations(batch.id)).map((d) => d.key));
      if (deviationsToOpen(batch, judged).every((d) => known.has(d.key))) continue;
      const found = await db.write(async (t) => {
        // Judged again under the write lock: a reading or a move may have come in meanwhile.
        const current = await process.batch(batch.lotCode, t);
        if (!BEING_MADE.includes(current.status)) return [];
        return (await judgeAndOpen(this.deps, t, current, controls, at, null)).opened;
      });
      for (const { id } of found) opened.push({ lotCode: batch.lotCode, deviation: id });
    }
    return { at, opened };
  }
}
