import type { QueryInterface } from 'sequelize';
import { runStatements } from './run-statements.ts';

/**
 * A delivery's judgement at the door as it was made: the receiving limit in words, its source,
 * and what was found against it ("8 °C (46 °F): over its limit of 5 °C (41 °F) or colder"). A
 * record keeps what was judged then, whatever the limits or the catalogue say later; and a
 * product shipped frozen is judged on the cook's word that it arrived frozen solid, which no
 * other column holds.
 */
export const name = '017-receipt-judgement';

const STATEMENTS = [
  'ALTER TABLE receipts ADD COLUMN limit_words TEXT',
  'ALTER TABLE receipts ADD COLUMN limit_source TEXT',
  'ALTER TABLE receipts ADD COLUMN found TEXT',
];

export async function up(queryInterface: QueryInterface): Promise<void> {
  await runStatements(queryInterface, STATEMENTS);
}
