import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { Sequelize, Transaction } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import * as initial from './migrations/001-initial.ts';

/** Milliseconds a connection waits for another writer before giving up with SQLITE_BUSY. */
const BUSY_TIMEOUT_MS = 10_000;

/** Every schema change, in order. Bundled, so listed here rather than found on disk. */
const MIGRATIONS = [initial];

/** An open database: the Sequelize instance the repositories share. */
export interface Database {
  readonly sequelize: Sequelize;
  /** Runs `work` in one write transaction that takes the write lock at once (BEGIN IMMEDIATE). */
  write<T>(work: (transaction: Transaction) => Promise<T>): Promise<T>;
  close(): Promise<void>;
}

interface SqliteConnection {
  configure(option: 'busyTimeout', value: number): void;
  exec(sql: string): void;
}

/**
 * Opens (creating if needed) the SQLite file, sets WAL mode and a busy timeout on every
 * connection, and applies pending migrations. Never uses sync(): the schema is migrations only.
 */
export async function openDatabase(file: string): Promise<Database> {
  if (file !== ':memory:') mkdirSync(path.dirname(file), { recursive: true });
  const sequelize = new Sequelize({ dialect: 'sqlite', storage: file, logging: false });
  sequelize.addHook('afterConnect', (connection) => {
    const sqlite = connection as SqliteConnection;
    sqlite.configure('busyTimeout', BUSY_TIMEOUT_MS);
    // WAL with NORMAL sync keeps every committed transaction through a crash of the process.
    sqlite.exec('PRAGMA synchronous = NORMAL');
  });
  await sequelize.query('PRAGMA journal_mode = WAL');
  const umzug = new Umzug({
    migrations: MIGRATIONS.map((migration) => ({
      name: migration.name,
      up: () => migration.up(sequelize.getQueryInterface()),
    })),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
  await umzug.up();
  return {
    sequelize,
    write: (work) => sequelize.transaction({ type: Transaction.TYPES.IMMEDIATE }, work),
    close: () => sequelize.close(),
  };
}
