import { isIsoDate, type FormulaKind } from '../../shared/index.ts';
import { AppError, badRequest } from '../http/app-error.ts';
import type { BatchStatus } from '../../shared/api/batch-record.ts';
import { isFormulaId } from '../../shared/formula/formula-id.ts';
import { BATCH_STATUSES } from '../../shared/workflow/batch-status.ts';

/** What a list of batches can be sorted by. */
export type SortKey = 'recorded' | 'lot' | 'started' | 'ready' | 'status' | 'formula';
/** asc: smallest key first; desc: largest first. Ties are broken by id in the same direction. */
export type SortOrder = 'asc' | 'desc';

/**
 * Each sort: the column rows are ordered by (then by id) and its default order. Each column has
 * an index on it alone (001, 002-batch-sort-indexes), so a page is a seek to the cursor's
 * (key, id) and a walk of `limit` rows, however many batches there are. status_rank (the work's
 * order) and ready_key (no ready date last) are virtual generated columns.
 */
export const SORTS: Readonly<
  Record<SortKey, { readonly expr: string; readonly order: SortOrder }>
> = {
  recorded: { expr: 'b.recorded_at', order: 'desc' },
  lot: { expr: 'b.lot_code', order: 'asc' },
  started: { expr: 'b.started_on', order: 'desc' },
  ready: { expr: 'b.ready_key', order: 'asc' },
  status: { expr: 'b.status_rank', order: 'asc' },
  formula: { expr: 'b.formula_id', order: 'asc' },
};

/** What a list or export is narrowed to; every field is optional and they combine with AND. */
export interface BatchFilter {
  /** The site's batches only; set by the server (never a query parameter) when there are several. */
  readonly siteId?: number;
  readonly formula?: string;
  readonly kind?: FormulaKind;
  readonly statuses?: readonly BatchStatus[];
  readonly operatorId?: number;
  /** Recorded on or after this day (UTC), YYYY-MM-DD. */
  readonly from?: string;
  /** Recorded on or before this day (UTC), YYYY-MM-DD. */
  readonly to?: string;
  /** Lot codes starting with this, upper-case. */
  readonly lot?: string;
  readonly signedOff?: boolean;
  /** Not signed off yet and in a status a reviewer can sign off (made, not thrown away). */
  readonly needsSignOff?: boolean;
  /** Whether every limit check passed (true) or one failed (false). */
  readonly checksPassed?: boolean;
  /** Still curing or proofing with a ready day before this day, YYYY-MM-DD: overdue then. */
  readonly overdueOn?: string;
}

/** Where a page starts: just after (next) or just before (prev) the row with this key and id. */
export interface Cursor {
  readonly key: string | number;
  readonly id: number;
  readonly direction: 'next' | 'prev';
}

/** A list request, checked. */
export interface ListQuery {
  readonly filter: BatchFilter;
  readonly sort: SortKey;
  readonly order: SortOrder;
  readonly limit: number;
  readonly cursor?: Cursor;
}

/** Batches on a page when the request does not say. */
export const DEFAULT_LIMIT = 50;
/** The most batches one page may hold. */
export const MAX_LIMIT = 200;

const FILTER_KEYS = [
  'formula',
  'kind',
  'status',
  'operator',
  'from',
  'to',
  'lot',
  'signedOff',
  'needsSignOff',
  'checks',
  'overdueOn',
];
const SORT_KEYS = ['sort', 'order'];
const PAGE_KEYS = ['limit', 'cursor'];
const KINDS: readonly FormulaKind[] = ['cure', 'dough', 'blend', 'mix', 'assembly'];

interface CursorJson {
  s: SortKey;
  o: SortOrder;
  k: string | number;
  i: number;
  d: 'n' | 'p';
}

/** The opaque cursor for a row of a sorted list: base64url JSON of sort, key and id. */
export function encodeCursor(sort: SortKey, order: SortOrder, cursor: Cursor): string {
  const json: CursorJson = {
    s: sort,
    o: order,
    k: cursor.key,
    i: cursor.id,
    d: cursor.direction === 'next' ? 'n' : 'p',
  };
  return Buffer.from(JSON.stringify(json), 'utf8').toString('base64url');
}

const badCursor = (message: string): AppError =>
  new AppError(400, 'bad-cursor', `${message}; start again from the first page`, [
    { field: 'cursor', message },
  ]);

function decodeCursor(text: string, sort: SortKey, order: SortOrder): Cursor {
  let json: Partial<CursorJson>;
  try {
    json = JSON.parse(Buffer.from(text, 'base64url').toString('utf8')) as Partial<CursorJson>;
  } catch {
    // Anything that is not our base64url JSON is a cursor someone made up or cut short.
    throw badCursor('the cursor is not one this server gave out');
  }
  const keyType = sort === 'status' ? 'number' : 'string';
  if (
    typeof json !== 'object' ||
    json === null ||
    typeof json.k !== keyType ||
    !Number.isSafeInteger(json.i) ||
    (json.d !== 'n' && json.d !== 'p')
  )
    throw badCursor('the cursor is not one this server gave out');
  if (json.s !== sort || json.o !== order)
    throw badCursor('the cursor belongs to a list in another order');
  return {
    key: json.k as string | number,
    id: json.i as number,
    direction: json.d === 'n' ? 'next' : 'prev',
  };
}

function single(
  query: Record<string, unknown>,
  key: string,
  problems: Problem[],
): string | undefined {
  const value = query[key];
  if (value === undefined) return undefined;
  if (typeof value !== 'string') {
    problems.push({ field: key, message: 'must be given once' });
    return undefined;
  }
  return value;
}

interface Problem {
  field: string;
  message: string;
}

function parseFilter(query: Record<string, unknown>, problems: Problem[]): BatchFilter {
  const filter: {
    -readonly [K in keyof BatchFilter]: BatchFilter[K];
  } = {};
  const formula = single(query, 'formula', problems);
  if (formula !== undefined) {
    if (isFormulaId(formula)) filter.formula = formula;
    else problems.push({ field: 'formula', message: 'must be a formula id' });
  }
  const kind = single(query, 'kind', problems);
  if (kind !== undefined) {
    if ((KINDS as readonly string[]).includes(kind)) filter.kind = kind as FormulaKind;
    else problems.push({ field: 'kind', message: `must be one of ${KINDS.join(', ')}` });
  }
  const status = single(query, 'status', problems);
  if (status !== undefined) {
    const statuses = status.split(',').map((s) => s.trim());
    const wrong = statuses.filter((s) => !(BATCH_STATUSES as readonly string[]).includes(s));
    if (wrong.length === 0) filter.statuses = [...new Set(statuses)] as BatchStatus[];
    else
      problems.push({
        field: 'status',
        message: `takes a comma list of ${BATCH_STATUSES.join(', ')}; not ${wrong.map((w) => `"${w}"`).join(', ')}`,
      });
  }
  const operator = single(query, 'operator', problems);
  if (operator !== undefined) {
    const id = Number(operator);
    if (/^\d{1,15}$/.test(operator) && id >= 1) filter.operatorId = id;
    else problems.push({ field: 'operator', message: 'must be a person id' });
  }
  for (const key of ['from', 'to'] as const) {
    const date = single(query, key, problems);
    if (date === undefined) continue;
    if (isIsoDate(date)) filter[key] = date;
    else problems.push({ field: key, message: 'must be a date written YYYY-MM-DD' });
  }
  if (filter.from && filter.to && filter.from > filter.to)
    problems.push({ field: 'to', message: 'must not be before from' });
  const lot = single(query, 'lot', problems);
  if (lot !== undefined) {
    const upper = lot.trim().toUpperCase();
    if (/^[0-9A-Z-]{1,20}$/.test(upper)) filter.lot = upper;
    else
      problems.push({
        field: 'lot',
        message: 'takes the start of a lot code: digits, letters, dashes',
      });
  }
  const signedOff = single(query, 'signedOff', problems);
  if (signedOff !== undefined) {
    if (signedOff === 'true' || signedOff === 'false') filter.signedOff = signedOff === 'true';
    else problems.push({ field: 'signedOff', message: 'must be true or false' });
  }
  const needsSignOff = single(query, 'needsSignOff', problems);
  if (needsSignOff !== undefined) {
    // Only true narrows: "does not need sign-off" is no list a reviewer asks for.
    if (needsSignOff === 'true') filter.needsSignOff = true;
    else problems.push({ field: 'needsSignOff', message: 'takes only true' });
  }
  const checks = single(query, 'checks', problems);
  if (checks !== undefined) {
    if (checks === 'passed' || checks === 'failed') filter.checksPassed = checks === 'passed';
    else problems.push({ field: 'checks', message: 'must be passed or failed' });
  }
  const overdueOn = single(query, 'overdueOn', problems);
  if (overdueOn !== undefined) {
    if (isIsoDate(overdueOn)) filter.overdueOn = overdueOn;
    else problems.push({ field: 'overdueOn', message: 'must be a date written YYYY-MM-DD' });
  }
  return filter;
}

/**
 * Reads and checks the query string of a list (`paged`) or an export: filters, sort, order and,
 * for lists, limit and cursor. Unknown or repeated parameters are refused, so a typo never
 * silently returns every batch.
 * @throws AppError 400 listing every parameter at fault
 */
export function parseListQuery(query: Record<string, unknown>, paged: boolean): ListQuery {
  const problems: Problem[] = [];
  const known = [...FILTER_KEYS, ...SORT_KEYS, ...(paged ? PAGE_KEYS : [])];
  for (const key of Object.keys(query))
    if (!known.includes(key))
      problems.push({ field: key, message: `is not a parameter here; use ${known.join(', ')}` });
  const filter = parseFilter(query, problems);

  const sortText = single(query, 'sort', problems) ?? 'recorded';
  const sort = (Object.hasOwn(SORTS, sortText) ? sortText : 'recorded') as SortKey;
  if (sort !== sortText)
    problems.push({ field: 'sort', message: `must be one of ${Object.keys(SORTS).join(', ')}` });
  const orderText = single(query, 'order', problems) ?? SORTS[sort].order;
  if (orderText !== 'asc' && orderText !== 'desc')
    problems.push({ field: 'order', message: 'must be asc or desc' });
  const order: SortOrder = orderText === 'asc' ? 'asc' : 'desc';

  const limitText = single(query, 'limit', problems);
  const limit = limitText === undefined ? DEFAULT_LIMIT : Number(limitText);
  if (!/^\d{1,3}$/.test(limitText ?? '50') || limit < 1 || limit > MAX_LIMIT)
    problems.push({ field: 'limit', message: `must be a whole number from 1 to ${MAX_LIMIT}` });

  const cursorText = single(query, 'cursor', problems);
  if (problems.length > 0)
    throw badRequest(
      `the query is not valid: ${problems.map((p) => `${p.field} ${p.message}`).join('; ')}`,
      problems,
    );
  const cursor = cursorText === undefined ? undefined : decodeCursor(cursorText, sort, order);
  return { filter, sort, order, limit, ...(cursor ? { cursor } : {}) };
}
