import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { Sequelize, Transaction } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import * as initial from './migrations/001-initial.ts';
import { WriteQueue, retryWhileBusy } from './write-queue.ts';
import * as batchSortIndexes from './migrations/002-batch-sort-indexes.ts';
import * as sessionCutoff from './migrations/003-session-cutoff.ts';
import * as outbox from './migrations/004-outbox.ts';
import * as invitations from './migrations/005-invitations.ts';
import * as reminders from './migrations/006-reminders.ts';

/** Milliseconds a connection waits for another writer before giving up with SQLITE_BUSY. */
const BUSY_TIMEOUT_MS = 10_000;

/** Every schema change, in order. Bundled, so listed here rather than found on disk. */
const MIGRATIONS = [initial, batchSortIndexes, sessionCutoff, outbox, invitations, reminders];

/** An open database: the Sequelize instance the repositories share. */
export interface Database {
  readonly sequelize: Sequelize;
  /** Runs `work` in one write transaction that takes the write lock at once (BEGIN IMMEDIATE). */
  write<T>(work: (transaction: Transaction) => Promise<T>): Promise<T>;
  close(): Promise<void>;
}

/**
 * Sets the busy timeout and sync mode on every SQLite connection as it is first handed out.
 * Sequelize's SQLite dialect opens one connection per transaction and never runs the
 * afterConnect hook, so we wrap its connection manager instead.
 */
function configureEachConnection(sequelize: Sequelize): void {
  const manager = sequelize.connectionManager as unknown as {
    getConnection(options?: object): Promise<SqliteConnection>;
  };
  const getConnection = manager.getConnection.bind(manager);
  const configured = new WeakSet<SqliteConnection>();
  manager.getConnection = async (options) => {
    const connection = await getConnection(options);
    if (!configured.has(connection)) {
      connection.configure('busyTimeout', BUSY_TIMEOUT_MS);
      // WAL with NORMAL sync keeps every committed transaction through a crash of the process.
      connection.exec('PRAGMA synchronous = NORMAL');
      configured.add(connection);
    }
    return connection;
  };
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
  configureEachConnection(sequelize);
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
  const queue = new WriteQueue();
  return {
    sequelize,
    // One write transaction at a time in this process (see write-queue.ts), retried while another
    // process or an autocommit statement holds the lock.
    write: (work) =>
      queue.run(() =>
        retryWhileBusy(() => sequelize.transaction({ type: Transaction.TYPES.IMMEDIATE }, work)),
      ),
    close: () => sequelize.close(),
  };
}
