import type { Batch, BatchPage } from '../../shared/api/batch-record.ts';
import { parseListQuery } from './batch-query.ts';
import type { BatchRepository } from './batch-repository.ts';
import { LOT_CODE_PATTERN } from './lot-code.ts';
import { RecordsError } from '../records/records-error.ts';

/** A page of the batch log, filtered and sorted by a query as the API takes it (formula, status, from…). */
export function listBatches(
  query: Record<string, unknown>,
  batches: BatchRepository,
): Promise<BatchPage> {
  return batches.list(parseListQuery(query, true));
}

/** The lot code asked for, upper-cased; not found when the text cannot be one. */
export function lotCodeOf(lot: string): string {
  const code = lot.toUpperCase();
  if (!LOT_CODE_PATTERN.test(code))
    throw new RecordsError('not-found', 'not-found', `no batch with lot code ${lot}`);
  return code;
}

/** One batch of the log with its events, by lot code in either case. */
export async function showBatch(lot: string, batches: BatchRepository): Promise<Batch> {
  const code = lotCodeOf(lot);
  const batch = await batches.get(code);
  if (!batch) throw new RecordsError('not-found', 'not-found', `no batch with lot code ${code}`);
  return batch;
}
