import type { AuditRepository } from '../audit/audit-repository.ts';
import type { Database } from '../db/database.ts';
import type { FormulaHistory } from '../formulas/formula-history.ts';
import type { Batch } from '../../shared/api/batch-record.ts';
import { keepingRefusals } from '../process/refusals.ts';
import type { ChangeOptions } from './batch.ts';
import type { BatchRepository } from './batch-repository.ts';
import { requireHoldSize } from './hold-size-needed.ts';
import { prepareBatch, type RecordRequest } from './prepare-batch.ts';

/**
 * Records one batch, calculated from its formula's current revision (noted in the formula's
 * history first, if it is new on disk), under the next lot code of its start day. A batch over a
 * critical limit is refused before the batch is written; the refusal itself is recorded. A cure
 * made now without the size its hold is reckoned on is refused too (nothing to keep).
 * @param today the recorder's today, YYYY-MM-DD: the start day when the request gives none
 */
export async function recordBatch(
  request: RecordRequest,
  today: string,
  deps: { db: Database; audit: AuditRepository; history: FormulaHistory; batches: BatchRepository },
  options: ChangeOptions,
): Promise<Batch> {
  const current = await deps.history.current(request.formula, options.formulas);
  // An assembly's parts are worked out from the other formulas as they are now.
  const library =
    current.formula.kind === 'assembly' ? await deps.history.library(options.formulas) : undefined;
  const tried = {
    formula: request.formula,
    revision: current.revision,
    inputs: { start: today, ...request.batch },
  };
  const prepared = await keepingRefusals(deps, tried, options, () =>
    prepareBatch(current, request, options.actor.id, today, library),
  );
  if (prepared.status !== 'planned') requireHoldSize(prepared.result);
  return deps.batches.record(prepared, options);
}
