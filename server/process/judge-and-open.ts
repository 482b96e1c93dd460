import type { Transaction } from 'sequelize';
import type { BatchControl, Reading } from '../../shared/api/process-record.ts';
import type { ResolvedControl } from '../../shared/process/control-types.ts';
import type { AuditRepository } from '../audit/audit-repository.ts';
import type { ChangeOptions } from '../batches/batch.ts';
import type { Database } from '../db/database.ts';
import { closeAsMet } from './corrective-actions.ts';
import { openDeviation } from './deviation-writes.ts';
import { deadlinesNowMet, deviationsToOpen, judgeBatch, type DeadlinesBy } from './judge-batch.ts';
import { kitchenClock } from './kitchen-clock.ts';
import type { ProcessBatch, ProcessRepository } from './process-repository.ts';

/** What the process writes work with. */
export interface ProcessDeps {
  readonly db: Database;
  readonly audit: AuditRepository;
  readonly process: ProcessRepository;
}

/** A batch judged inside a write, and the deviations that judgement opened. */
export interface Judgement {
  readonly controls: BatchControl[];
  readonly readings: Reading[];
  /** Ids of the deviations opened now, in the order of the controls and their misses. */
  readonly opened: { readonly id: number; readonly control: string | null }[];
}

/**
 * Inside the caller's write: judges every control of the batch on what the transaction sees, at
 * `at`, and opens a deviation for each miss not opened before (by anyone, ever: the dedupe key).
 * A deadline deviation still open that the readings now show was met (readings taken in time,
 * entered after the deadline) is closed by the server with the reason, never deleted.
 * @param by who caused the judgement; null when the server's deadline scan found the miss
 * @param deadlines 'readings' when readings were written: a deadline is then missed only on a
 *   reading taken after it, so readings entered late are judged by the time they were taken
 */
export async function judgeAndOpen(
  deps: ProcessDeps,
  t: Transaction,
  batch: ProcessBatch,
  controls: readonly ResolvedControl[],
  at: string,
  by: ChangeOptions | null,
  deadlines: DeadlinesBy = 'clock',
): Promise<Judgement> {
  const readings = await deps.process.readings(batch.id, t);
  const judged = judgeBatch(controls, readings, batch.status, kitchenClock(at));
  const opened: Judgement['opened'] = [];
  for (const deviation of deviationsToOpen(batch, judged, deadlines)) {
    const id = await openDeviation(deps.db, deps.audit, t, { ...deviation, openedAt: at }, by);
    if (id !== null) opened.push({ id, control: deviation.control });
  }
  const deviations = await deps.process.deviations(batch.id, t);
  for (const { deviation, control } of deadlinesNowMet(batch.id, judged, deviations))
    await closeAsMet(
      deps,
      t,
      { id: deviation.id, subject: batch.lotCode, key: deviation.key },
      control.control,
      at,
    );
  return { controls: judged, readings, opened };
}
