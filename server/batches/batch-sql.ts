import { addDays } from '../../shared/index.ts';
import { withoutIndex, type Dialect } from '../db/dialect-sql.ts';
import { UNSIGNABLE_STATUSES } from '../../shared/workflow/batch-status.ts';
import { SORTS, type BatchFilter, type ListQuery, type SortKey } from './batch-query.ts';
import { BATCHES_WITH_PEOPLE, LIST_COLUMNS, SUMMARY_COLUMNS } from './batch-rows.ts';
import { prefixRange } from './lot-code.ts';

/** An SQL fragment with its replacement values in order. */
export interface SqlPart {
  readonly sql: string;
  readonly values: readonly (string | number)[];
}

/** Statuses a batch leaves within days: however long the log, few batches are in them. */
const ACTIVE_STATUSES: readonly string[] = ['planned', 'in-progress', 'curing', 'proofing'];

/** Not signed off, in a status that can be (not planned, not discarded): the reviewer's queue. */
const NEEDS_SIGN_OFF = `b.signed_off_at IS NULL AND b.status NOT IN (${UNSIGNABLE_STATUSES.map((s) => `'${s}'`).join(', ')})`;

/**
 * The WHERE clauses of a filter (on batches as `b`).
 *
 * When a page is walked along a sort other than recorded (`walking`), the broad filters — formula,
 * kind, operator, a status list with done or discarded — are written `+column`, which keeps SQLite
 * from driving the query with their index: it then walks the sort's index and filters, reading
 * about limit ÷ share-of-matches rows, instead of fetching a quarter of a million matches to sort
 * them (SQLite has no statistics to tell it a kind matches 25 % of the log). Narrow filters —
 * active statuses, a lot prefix, a recorded date range, not signed off — keep their indexes. With
 * the recorded sort every filter has an index in recorded order (001), so all stay plain.
 */
export function whereOf(
  filter: BatchFilter,
  walking?: SortKey,
  dialect: Dialect = 'sqlite',
): { clauses: string[]; values: (string | number)[] } {
  const clauses: string[] = [];
  const values: (string | number)[] = [];
  const broad = (column: string, sort?: SortKey): string =>
    walking && walking !== 'recorded' && walking !== sort ? withoutIndex(dialect, column) : column;
  // Set only on an install with several sites (a single site's log needs no condition). The
  // default order walks 021's (site_id, recorded_at, id); another sort walks its own index and
  // tests the site, as it does a broad filter.
  if (filter.siteId !== undefined) {
    clauses.push(`${broad('b.site_id')} = ?`);
    values.push(filter.siteId);
  }
  if (filter.formula !== undefined) {
    clauses.push(`${broad('b.formula_id', 'formula')} = ?`);
    values.push(filter.formula);
  }
  if (filter.kind !== undefined) {
    clauses.push(`${broad('b.kind')} = ?`);
    values.push(filter.kind);
  }
  if (filter.statuses !== undefined) {
    const active = filter.statuses.every((status) => ACTIVE_STATUSES.includes(status));
    clauses.push(
      `${active ? 'b.status' : broad('b.status')} IN (${filter.statuses.map(() => '?').join(', ')})`,
    );
    values.push(...filter.statuses);
  }
  if (filter.operatorId !== undefined) {
    clauses.push(`${broad('b.operator_id')} = ?`);
    values.push(filter.operatorId);
  }
  // recorded_at is an ISO timestamp in UTC: a day is [that day, the next day).
  if (filter.from !== undefined) {
    clauses.push('b.recorded_at >= ?');
    values.push(filter.from);
  }
  if (filter.to !== undefined) {
    clauses.push('b.recorded_at < ?');
    values.push(addDays(filter.to, 1));
  }
  if (filter.lot !== undefined) {
    // A range rather than LIKE, so the UNIQUE index on lot_code is walked, not the table.
    const [low, high] = prefixRange(filter.lot);
    clauses.push('b.lot_code >= ? AND b.lot_code < ?');
    values.push(low, high);
  }
  if (filter.signedOff !== undefined)
    clauses.push(filter.signedOff ? 'b.signed_off_at IS NOT NULL' : 'b.signed_off_at IS NULL');
  // These two are written with literals, as the partial indexes of 011 are, so that SQLite sees
  // the query implies an index's WHERE and walks that index: it holds only the matching rows.
  if (filter.needsSignOff) clauses.push(NEEDS_SIGN_OFF);
  if (filter.checksPassed !== undefined)
    clauses.push(filter.checksPassed ? `${broad('b.checks_passed')} = 1` : 'b.checks_passed = 0');
  if (filter.overdueOn !== undefined) {
    // Held batches are few at any size of log: the (status, ready_on) index finds them.
    clauses.push("b.status IN ('curing', 'proofing') AND b.ready_on < ?");
    values.push(filter.overdueOn);
  }
  return { clauses, values };
}

function where(clauses: readonly string[]): string {
  return clauses.length ? `WHERE ${clauses.join(' AND ')}` : '';
}

/**
 * How many batches a filter matches; with `upTo`, counting stops after upTo + 1 matches (an
 * answer above upTo means "more than upTo"). A count cannot use the keyset that makes a page
 * cheap: it reads every match, and a filter on two columns (formula and status, say) reads each
 * match's row, not an index alone. Stopping early keeps it within a page's time on any log.
 */
export function countSql(filter: BatchFilter, upTo?: number, dialect: Dialect = 'sqlite'): SqlPart {
  const { clauses, values } = whereOf(filter, undefined, dialect);
  if (upTo === undefined)
    return { sql: `SELECT COUNT(*) AS n FROM batches b ${where(clauses)}`, values };
  return {
    sql: `SELECT COUNT(*) AS n FROM (SELECT 1 FROM batches b ${where(clauses)} LIMIT ?) matches`,
    values: [...values, upTo + 1],
  };
}

/**
 * One page of a sorted list, read one row beyond the limit to learn whether there is more: the
 * columns of list items (LIST_COLUMNS) or of summaries alone (the CSV export).
 * A backward page (a prev cursor) is read in reverse order and must be turned round by the caller.
 * `sort_key` is the value of the sort expression, for the cursors.
 *
 * In two steps: the page's ids and sort keys first, from batches alone, then the columns of those
 * rows only. A filter whose index is not in the page's order (overdue, a lot prefix) sorts its
 * matches; sorting ids and keys leaves building each row's columns (the people's names, the
 * nitrite check picked out of the stored result) to the page's rows, not every match. The outer
 * query reads the ids in the order the inner one gives them, so it sorts nothing again.
 */
export function pageSql(
  query: ListQuery,
  columns: 'list' | 'summary',
  dialect: Dialect = 'sqlite',
): SqlPart {
  const { clauses, values } = whereOf(query.filter, query.sort, dialect);
  const sort = SORTS[query.sort];
  const backwards = query.cursor?.direction === 'prev';
  const descending = (query.order === 'desc') !== backwards;
  if (query.cursor) {
    const comparison = descending ? '<' : '>';
    if (query.sort === 'formula' && query.filter.formula !== undefined) {
      // One formula sorted by formula: the key is the same on every row, so the id alone places
      // the cursor, and SQLite seeks (formula_id = ?, rowid > ?) on the formula index.
      clauses.push(`b.id ${comparison} ?`);
      values.push(query.cursor.id);
    } else {
      // A row value: SQLite seeks the index on the sort column straight to (key, rowid).
      clauses.push(`(${sort.expr}, b.id) ${comparison} (?, ?)`);
      values.push(query.cursor.key, query.cursor.id);
    }
  }
  const direction = descending ? 'DESC' : 'ASC';
  return {
    sql: `SELECT ${columns === 'list' ? LIST_COLUMNS[dialect] : SUMMARY_COLUMNS}, page.sort_key
      FROM (
        SELECT b.id, ${sort.expr} AS sort_key FROM batches b
        ${where(clauses)}
        ORDER BY ${sort.expr} ${direction}, b.id ${direction}
        LIMIT ?
      ) page
      CROSS JOIN ${BATCHES_WITH_PEOPLE}
      WHERE b.id = page.id
      ORDER BY page.sort_key ${direction}, page.id ${direction}`,
    values: [...values, query.limit + 1],
  };
}
