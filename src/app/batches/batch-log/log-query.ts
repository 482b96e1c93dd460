import { isFormulaId } from '../../../../shared/formula/formula-id.ts';
import { BATCH_STATUSES } from '../../../../shared/workflow/batch-status.ts';
import type { BatchStatus, FormulaKind } from '../batch-types';

/** What the batch log can be sorted by (the API's sort keys). */
export type LogSort = 'recorded' | 'lot' | 'started' | 'ready' | 'status' | 'formula';

/** Batches on a page. */
export type PageSize = 25 | 50 | 100;

/** The page sizes offered. */
export const PAGE_SIZES: readonly PageSize[] = [25, 50, 100];

/**
 * The log's quick filters, one at a time: the reviewer's queue (not signed off yet), batches with
 * a failed check, batches held past their ready day.
 */
export type LogShow = 'sign-off' | 'failed' | 'overdue';

/** The quick filters in the order they are offered, with their words. */
export const SHOWS: readonly { readonly value: LogShow; readonly words: string }[] = [
  { value: 'sign-off', words: 'Needs sign-off' },
  { value: 'failed', words: 'Failed checks' },
  { value: 'overdue', words: 'Overdue' },
];

/** The log's view: filters, sort and page size, as kept in the address bar. */
export interface LogQuery {
  readonly formula: string | null;
  readonly kind: FormulaKind | null;
  readonly statuses: readonly BatchStatus[];
  readonly operator: number | null;
  /** Recorded on or after, YYYY-MM-DD. */
  readonly from: string | null;
  /** Recorded on or before, YYYY-MM-DD. */
  readonly to: string | null;
  /** Start of a lot code, upper-case. */
  readonly lot: string | null;
  /** A quick filter, or null for none. */
  readonly show: LogShow | null;
  readonly sort: LogSort;
  readonly order: 'asc' | 'desc';
  readonly size: PageSize;
}

/** The order each sort takes unless asked otherwise, as the API defaults it. */
export const DEFAULT_ORDER: Readonly<Record<LogSort, 'asc' | 'desc'>> = {
  recorded: 'desc',
  lot: 'asc',
  started: 'desc',
  ready: 'asc',
  status: 'asc',
  formula: 'asc',
};

/** The log as it opens: everything, the latest started first, 25 a page. */
export const DEFAULT_QUERY: LogQuery = {
  formula: null,
  kind: null,
  statuses: [],
  operator: null,
  from: null,
  to: null,
  lot: null,
  show: null,
  sort: 'started',
  order: 'desc',
  size: 25,
};

const KINDS: readonly FormulaKind[] = ['cure', 'dough', 'blend', 'mix', 'assembly'];
const DATE = /^\d{4}-\d{2}-\d{2}$/;

/** The query parameters of the address bar, as the router gives them. */
export type QueryParams = Readonly<Record<string, string | undefined>>;

/**
 * Reads the log's view from the address bar. Anything that cannot be read is left at its default,
 * so a hand-edited or old link still opens the log.
 */
export function queryFromParams(params: QueryParams): LogQuery {
  const kind = params['kind'];
  const sort = params['sort'];
  const validSort =
    sort !== undefined && sort in DEFAULT_ORDER ? (sort as LogSort) : DEFAULT_QUERY.sort;
  const show = SHOWS.find((s) => s.value === params['show'])?.value ?? null;
  const order = params['order'];
  const size = Number(params['size']);
  const operator = Number(params['operator']);
  const formula = params['formula'];
  const lot = params['lot']?.trim().toUpperCase();
  return {
    formula: formula && isFormulaId(formula) ? formula : null,
    kind: kind && (KINDS as readonly string[]).includes(kind) ? (kind as FormulaKind) : null,
    statuses: [
      ...new Set(
        (params['status'] ?? '')
          .split(',')
          .filter((s): s is BatchStatus => (BATCH_STATUSES as readonly string[]).includes(s)),
      ),
    ],
    operator: Number.isSafeInteger(operator) && operator >= 1 ? operator : null,
    from: params['from'] && DATE.test(params['from']) ? params['from'] : null,
    to: params['to'] && DATE.test(params['to']) ? params['to'] : null,
    lot: lot && /^[0-9A-Z-]{1,20}$/.test(lot) ? lot : null,
    show,
    sort: validSort,
    order: order === 'asc' || order === 'desc' ? order : DEFAULT_ORDER[validSort],
    size: (PAGE_SIZES as readonly number[]).includes(size) ? (size as PageSize) : 25,
  };
}

/**
 * The address-bar parameters of a view: only what differs from the default, so a plain log has a
 * plain address. Null removes a parameter when merged into the current URL.
 */
export function paramsFromQuery(query: LogQuery): Record<string, string | null> {
  const sortShown = query.sort !== DEFAULT_QUERY.sort || query.order !== DEFAULT_QUERY.order;
  return {
    formula: query.formula,
    kind: query.kind,
    status: query.statuses.length ? query.statuses.join(',') : null,
    operator: query.operator === null ? null : String(query.operator),
    from: query.from,
    to: query.to,
    lot: query.lot,
    show: query.show,
    sort: sortShown ? query.sort : null,
    order: sortShown ? query.order : null,
    size: query.size === 25 ? null : String(query.size),
  };
}

/**
 * The API's filter and sort parameters for a view (GET /api/batches and /api/batches.csv share
 * them), without empty ones.
 * @param today the kitchen's calendar day, YYYY-MM-DD: "overdue" is a ready day before it
 */
export function apiFilterParams(query: LogQuery, today: string): Record<string, string> {
  const params: Record<string, string> = {};
  if (query.formula) params['formula'] = query.formula;
  if (query.kind) params['kind'] = query.kind;
  if (query.statuses.length) params['status'] = query.statuses.join(',');
  if (query.operator !== null) params['operator'] = String(query.operator);
  if (query.from) params['from'] = query.from;
  if (query.to) params['to'] = query.to;
  if (query.lot) params['lot'] = query.lot;
  if (query.show === 'sign-off') params['needsSignOff'] = 'true';
  if (query.show === 'failed') params['checks'] = 'failed';
  if (query.show === 'overdue') params['overdueOn'] = today;
  params['sort'] = query.sort;
  params['order'] = query.order;
  return params;
}

/** The CSV export of exactly the batches a view lists (every page of it). */
export function csvHref(query: LogQuery, today: string): string {
  return `/api/batches.csv?${new URLSearchParams(apiFilterParams(query, today)).toString()}`;
}

/** Whether a view narrows the log at all. */
export function isFiltered(query: LogQuery): boolean {
  return (
    query.formula !== null ||
    query.kind !== null ||
    query.statuses.length > 0 ||
    query.operator !== null ||
    query.from !== null ||
    query.to !== null ||
    query.lot !== null ||
    query.show !== null
  );
}

/**
 * How many of the filter boxes narrow the view (formula, kind, status, operator, dates, lot
 * code), for a folded "Filters" heading; the quick filters stay in sight and are not counted.
 */
export function filterCount(query: LogQuery): number {
  return [
    query.formula !== null,
    query.kind !== null,
    query.statuses.length > 0,
    query.operator !== null,
    query.from !== null || query.to !== null,
    query.lot !== null,
  ].filter(Boolean).length;
}
