import type { QueryInterface } from 'sequelize';
import { runStatements } from './run-statements.ts';

/**
 * Partial indexes for the batch log's quick filters, so that a reviewer's queue ("needs sign-off")
 * and the batches with a failed check page as fast as the whole log at a million batches. Each
 * holds only the rows its filter matches, in the two orders the console lists by (recorded, and
 * started, its default). The filters are written in batch-sql.ts with the same literals as these
 * WHERE clauses: SQLite uses a partial index only when the query's terms imply its WHERE.
 */
export const name = '011-review-queue-indexes';

const QUEUE = "signed_off_at IS NULL AND status NOT IN ('planned', 'discarded')";
const FAILED = 'checks_passed = 0';

const STATEMENTS = [
  `CREATE INDEX batches_queue_recorded ON batches (recorded_at, id) WHERE ${QUEUE}`,
  `CREATE INDEX batches_queue_started ON batches (started_on) WHERE ${QUEUE}`,
  `CREATE INDEX batches_failed_recorded ON batches (recorded_at, id) WHERE ${FAILED}`,
  `CREATE INDEX batches_failed_started ON batches (started_on) WHERE ${FAILED}`,
];

export async function up(queryInterface: QueryInterface): Promise<void> {
  await runStatements(queryInterface, STATEMENTS);
}
