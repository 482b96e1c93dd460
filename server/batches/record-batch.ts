import type { FormulaHistory } from '../formulas/formula-history.ts';
import type { Batch } from '../../shared/api/batch-record.ts';
import type { ChangeOptions } from './batch.ts';
import type { BatchRepository } from './batch-repository.ts';
import { prepareBatch, type RecordRequest } from './prepare-batch.ts';

/**
 * Records one batch, calculated from its formula's current revision (noted in the formula's
 * history first, if it is new on disk), under the next lot code of its start day. A batch over a
 * critical limit is refused before anything is written.
 * @param today the recorder's today, YYYY-MM-DD: the start day when the request gives none
 */
export async function recordBatch(
  request: RecordRequest,
  today: string,
  { history, batches }: { history: FormulaHistory; batches: BatchRepository },
  options: ChangeOptions,
): Promise<Batch> {
  const current = await history.current(request.formula);
  return batches.record(prepareBatch(current, request, options.actor.id, today), options);
}
