import type { QueryInterface } from 'sequelize';
import { runStatements } from './run-statements.ts';

/**
 * Sign-in attempts counted in the database rather than in each server process's memory, so that
 * every process of a server, and every server on the database, holds an address to one limit:
 * one row per address with failures in its window, and one per password check going on. Plain
 * SQL both SQLite and PostgreSQL take (text ids, BIGINT milliseconds, no AUTOINCREMENT).
 */
export const name = '020-sign-in-attempts';

const STATEMENTS = [
  `CREATE TABLE sign_in_windows (
    address TEXT PRIMARY KEY,
    failed INTEGER NOT NULL,
    reset_at BIGINT NOT NULL,
    refused INTEGER NOT NULL CHECK (refused IN (0, 1))
  )`,
  `CREATE TABLE sign_in_checks (
    id TEXT PRIMARY KEY,
    address TEXT NOT NULL,
    began_at BIGINT NOT NULL
  )`,
  'CREATE INDEX sign_in_checks_address ON sign_in_checks (address, began_at)',
];

export async function up(queryInterface: QueryInterface): Promise<void> {
  await runStatements(queryInterface, STATEMENTS);
}
