// The batch log's pages the issue sets targets for, built the same way for both databases.
import { encodeCursor } from '../server/batches/batch-query.ts';

/** A page of the log: its label as printed, and its query parameters. */
export type LogPageCase = [label: string, params: Record<string, string>];

/**
 * The four pages with a p95 target: the first page, a formula + status filter, a page half-way
 * down (by the cursor of the batch there) and a lot-code search.
 */
export function logPageCases(
  deep: { recorded_at: string; id: number },
  lotSearch: string,
): LogPageCase[] {
  return [
    ['first page', { limit: '50' }],
    [
      'filtered page (formula + status)',
      { formula: 'quillmoor-belly', status: 'done', limit: '50' },
    ],
    [
      'page deep in the list (half-way)',
      {
        limit: '50',
        cursor: encodeCursor('recorded', 'desc', {
          key: deep.recorded_at,
          id: deep.id,
          direction: 'next',
        }),
      },
    ],
    [`lot-code search (${lotSearch})`, { lot: lotSearch, limit: '50' }],
  ];
}
