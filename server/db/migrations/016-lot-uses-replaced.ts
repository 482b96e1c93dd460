import type { QueryInterface } from 'sequelize';
import { runStatements } from './run-statements.ts';

/**
 * Lot uses recorded again: when a cook corrects the lots a batch used, the earlier rows stay (as
 * every record does) marked with when and by whom they were replaced, and what they took from
 * each lot is given back. The lots a batch used are its rows with replaced_at IS NULL.
 */
export const name = '016-lot-uses-replaced';

const STATEMENTS = [
  'ALTER TABLE lot_uses ADD COLUMN replaced_at TEXT',
  'ALTER TABLE lot_uses ADD COLUMN replaced_by INTEGER REFERENCES people(id)',
];

export async function up(queryInterface: QueryInterface): Promise<void> {
  await runStatements(queryInterface, STATEMENTS);
}
