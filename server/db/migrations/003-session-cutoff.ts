import type { QueryInterface } from 'sequelize';
import { statementFor } from './run-statements.ts';

/**
 * A per-person cut-off for sessions: a password reset or a deactivation moves it to now, and any
 * session signed in before it ends at its next request.
 */
export const name = '003-session-cutoff';

export async function up(queryInterface: QueryInterface): Promise<void> {
  await queryInterface.sequelize.query(
    statementFor(queryInterface, 'ALTER TABLE people ADD COLUMN sessions_valid_from TEXT'),
  );
}
