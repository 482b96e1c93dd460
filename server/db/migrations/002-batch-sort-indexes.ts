import type { QueryInterface } from 'sequelize';
import { runStatements } from './run-statements.ts';

/**
 * Indexes for the batch log's other sort orders, so that every page, however deep, is a seek to
 * its cursor and a walk of `limit` rows at any number of batches; and one for the unsigned
 * batches a reviewer works through.
 *
 * The keyset condition is the row value (key, id) < (?, ?). SQLite seeks on both parts only when
 * the index is on the key alone (every index entry ends with the rowid, which id is) and the key is
 * a column: an index on (key, id) seeks on the key only, and an index on an expression is not
 * used for the row value at all. So the two computed keys are VIRTUAL generated columns (computed
 * on read, nothing stored in the table) with plain indexes. The UNIQUE index on lot_code serves the
 * lot order; 001's (recorded_at, id) serves the default order, recorded_at being all but unique.
 */
export const name = '002-batch-sort-indexes';

const STATEMENTS = [
  // Status in the order of the work, not of the alphabet.
  `ALTER TABLE batches ADD COLUMN status_rank INTEGER GENERATED ALWAYS AS (
    CASE status WHEN 'planned' THEN 1 WHEN 'in-progress' THEN 2 WHEN 'curing' THEN 3
      WHEN 'proofing' THEN 4 WHEN 'done' THEN 5 ELSE 6 END) VIRTUAL`,
  // Batches without a ready date (doughs, blends, mixes) sort after every dated one.
  `ALTER TABLE batches ADD COLUMN ready_key TEXT GENERATED ALWAYS AS (
    IFNULL(ready_on, '9999-12-31')) VIRTUAL`,
  'CREATE INDEX batches_started_order ON batches (started_on)',
  'CREATE INDEX batches_ready_order ON batches (ready_key)',
  // The "curing now" view: one status, soonest ready first.
  'CREATE INDEX batches_status_ready_order ON batches (status, ready_key)',
  'CREATE INDEX batches_status_order ON batches (status_rank)',
  'CREATE INDEX batches_formula_order ON batches (formula_id)',
  // The reviewer's queue: batches not signed off yet, by status, newest first. Partial, so it
  // holds only the unsigned batches, a small share of a log that is kept up to date.
  'CREATE INDEX batches_unsigned ON batches (status, recorded_at, id) WHERE signed_off_at IS NULL',
];

export async function up(queryInterface: QueryInterface): Promise<void> {
  await runStatements(queryInterface, STATEMENTS);
}
