import type { QueryInterface } from 'sequelize';
import { runStatements } from './run-statements.ts';

/**
 * The latest price of an item: the newest delivery of it that came with a price, on or before a
 * day. Costing asks it for every formula line no lot was recorded for, and receipts_on_hand holds
 * only the lots still on hand, so without this each ask would read every delivery ever taken in.
 */
export const name = '018-cost-indexes';

const STATEMENTS = [
  `CREATE INDEX receipts_latest_price ON receipts (item, received_on, received_at, id)
    WHERE unit_cost IS NOT NULL AND decision <> 'refused'`,
];

export async function up(queryInterface: QueryInterface): Promise<void> {
  await runStatements(queryInterface, STATEMENTS);
}
