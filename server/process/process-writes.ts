import type { Transaction } from 'sequelize';
import type { AuditRepository } from '../audit/audit-repository.ts';
import type { ChangeOptions } from '../batches/batch.ts';
import type { Database } from '../db/database.ts';
import type { FormulaHistory } from '../formulas/formula-history.ts';
import { recordAction } from './corrective-actions.ts';
import { FormulaControls } from './formula-controls.ts';
import { judgeAndOpen, type ProcessDeps } from './judge-and-open.ts';
import { uploadReadings } from './logger-upload.ts';
import { processNow } from './process-now.ts';
import { ProcessRepository } from './process-repository.ts';
import { addReading, correctReading } from './reading-writes.ts';
import { verifyBatch } from './verification.ts';

/** The process records over a database and the formulas' history. */
export function processDeps(deps: {
  readonly db: Database;
  readonly audit: AuditRepository;
  readonly history: FormulaHistory;
}): ProcessDeps {
  return {
    db: deps.db,
    audit: deps.audit,
    process: new ProcessRepository(deps.db, new FormulaControls(deps.history)),
  };
}

/**
 * What runs in the write that marks a batch done: every control judged as finished (a lethality
 * not reached is now missed) and its deviations opened. The controls are read before the write.
 */
async function finishing(
  deps: ProcessDeps,
  lot: string,
  by: ChangeOptions,
): Promise<(t: Transaction) => Promise<void>> {
  const controls = await deps.process.controlsOf(await deps.process.batch(lot));
  return async (t) => {
    if (controls.length === 0) return;
    const batch = await deps.process.batch(lot, t);
    await judgeAndOpen(deps, t, batch, controls, by.at ?? new Date().toISOString(), by);
  };
}

/** The process records' use cases, for the records door. */
export const processWrites = {
  addReading,
  correctReading,
  uploadReadings,
  recordAction,
  verifyBatch,
  processNow,
  finishing,
};

/** The process records' use cases, as the records door calls them. */
export type ProcessUseCases = typeof processWrites;
