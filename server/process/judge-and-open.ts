import type { Transaction } from 'sequelize';
import type { BatchControl, Reading } from '../../shared/api/process-record.ts';
import type { ResolvedControl } from '../../shared/process/control-types.ts';
import type { AuditRepository } from '../audit/audit-repository.ts';
import type { ChangeOptions } from '../batches/batch.ts';
import type { Database } from '../db/database.ts';
import { openDeviation } from './deviation-writes.ts';
import { deviationsToOpen, judgeBatch } from './judge-batch.ts';
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
 * @param by who caused the judgement; null when the server's deadline scan found the miss
 */
export async function judgeAndOpen(
  deps: ProcessDeps,
  t: Transaction,
  batch: ProcessBatch,
  controls: readonly ResolvedControl[],
  at: string,
  by: ChangeOptions | null,
): Promise<Judgement> {
  const readings = await deps.process.readings(batch.id, t);
  const judged = judgeBatch(controls, readings, batch.status, kitchenClock(at));
  const opened: Judgement['opened'] = [];
  for (const deviation of deviationsToOpen(batch, judged)) {
    const id = await openDeviation(deps.db, deps.audit, t, { ...deviation, openedAt: at }, by);
    if (id !== null) opened.push({ id, control: deviation.control });
  }
  return { controls: judged, readings, opened };
}
