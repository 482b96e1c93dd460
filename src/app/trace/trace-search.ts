import type { TraceSearch } from '../../../shared/api/trace-record.ts';

/** The search in the address: ?lot=… or ?supplierLot=…&supplier=…; null when it names neither. */
export function searchFromParams(params: {
  readonly get: (name: string) => string | null;
}): TraceSearch | null {
  const lot = params.get('lot')?.trim();
  const supplierLot = params.get('supplierLot')?.trim();
  const supplier = params.get('supplier')?.trim();
  if (lot) return { lot };
  if (supplierLot) return supplier ? { supplierLot, supplier } : { supplierLot };
  return null;
}

/** The address's query for a search. */
export function paramsOfSearch(search: TraceSearch): Record<string, string> {
  return { ...search };
}

/** Where the recall report of a search downloads from. */
export function recallUrl(format: 'pdf' | 'csv', search: TraceSearch): string {
  return `/api/trace/recall.${format}?${new URLSearchParams(paramsOfSearch(search))}`;
}
