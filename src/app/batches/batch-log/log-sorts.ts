import type { LogQuery, LogSort } from './log-query';

/** One way to order the log, as the sort select offers it where there are no column headers. */
export interface SortChoice {
  readonly sort: LogSort;
  readonly order: 'asc' | 'desc';
  /** What the select says. */
  readonly words: string;
}

/** Every order the log can be read in (each key both ways), the log's own first. */
export const SORT_CHOICES: readonly SortChoice[] = [
  { sort: 'started', order: 'desc', words: 'Newest first' },
  { sort: 'started', order: 'asc', words: 'Oldest first' },
  { sort: 'ready', order: 'asc', words: 'Ready soonest first' },
  { sort: 'ready', order: 'desc', words: 'Ready latest first' },
  { sort: 'recorded', order: 'desc', words: 'Last recorded first' },
  { sort: 'recorded', order: 'asc', words: 'First recorded first' },
  { sort: 'status', order: 'asc', words: 'Status, planned first' },
  { sort: 'status', order: 'desc', words: 'Status, done and discarded first' },
  { sort: 'formula', order: 'asc', words: 'Formula, A to Z' },
  { sort: 'formula', order: 'desc', words: 'Formula, Z to A' },
  { sort: 'lot', order: 'asc', words: 'Lot code, A to Z' },
  { sort: 'lot', order: 'desc', words: 'Lot code, Z to A' },
];

/** The choice a view is sorted by: its key and order as the select's value ("started desc"). */
export function sortValueOf(query: Pick<LogQuery, 'sort' | 'order'>): string {
  return `${query.sort} ${query.order}`;
}

/** The sort and order of a select value; null for one that is not offered. */
export function sortOfValue(value: string): Pick<SortChoice, 'sort' | 'order'> | null {
  const choice = SORT_CHOICES.find((c) => sortValueOf(c) === value);
  return choice ? { sort: choice.sort, order: choice.order } : null;
}
