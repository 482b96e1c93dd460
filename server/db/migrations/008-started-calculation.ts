import type { QueryInterface } from 'sequelize';
import { runStatements } from './run-statements.ts';

/**
 * A planned batch started on what was really there keeps its planned calculation: the batch's
 * own columns (inputs, result, nitrite, start and ready days) carry the calculation it was made
 * by, and planned_calculation the one it was planned with, as JSON, written once at the start and
 * never changed. A column rather than a batch event: an event's reason is words for people, and
 * the plan is a whole calculation the console shows beside the started one.
 */
export const name = '008-started-calculation';

const STATEMENTS = ['ALTER TABLE batches ADD COLUMN planned_calculation TEXT'];

export async function up(queryInterface: QueryInterface): Promise<void> {
  await runStatements(queryInterface, STATEMENTS);
}
