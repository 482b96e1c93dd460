import type { Batch, BatchPage } from '../../shared/api/batch-record.ts';
import type { SiteScope } from '../sites/site-scope.ts';
import { parseListQuery, type ListQuery } from './batch-query.ts';
import type { BatchRepository } from './batch-repository.ts';
import { LOT_CODE_PATTERN } from './lot-code.ts';
import { RecordsError } from '../records/records-error.ts';

/**
 * A list query narrowed to a site's batches: on an install of several sites only (one site's
 * log needs no condition, and keeps its query plans).
 */
export function atSite<Q extends Pick<ListQuery, 'filter'>>(query: Q, site?: SiteScope): Q {
  return site?.filters ? { ...query, filter: { ...query.filter, siteId: site.id } } : query;
}

/** A page of the batch log, filtered and sorted by a query as the API takes it (formula, status, from…). */
export function listBatches(
  query: Record<string, unknown>,
  batches: BatchRepository,
  site?: SiteScope,
): Promise<BatchPage> {
  return batches.list(atSite(parseListQuery(query, true), site));
}

/** The lot code asked for, upper-cased; not found when the text cannot be one. */
export function lotCodeOf(lot: string): string {
  const code = lot.toUpperCase();
  if (!LOT_CODE_PATTERN.test(code))
    throw new RecordsError('not-found', 'not-found', `no batch with lot code ${lot}`);
  return code;
}

/** One batch of the log with its events, by lot code in either case; another site's is not found. */
export async function showBatch(
  lot: string,
  batches: BatchRepository,
  site?: SiteScope,
): Promise<Batch> {
  const code = lotCodeOf(lot);
  const batch = await batches.get(code, undefined, site);
  if (!batch) throw new RecordsError('not-found', 'not-found', `no batch with lot code ${code}`);
  return batch;
}
