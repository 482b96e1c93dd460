import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { Sequelize, Transaction } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import * as initial from './migrations/001-initial.ts';
import { WriteQueue, retryWhileBusy } from './write-queue.ts';
import { sqliteCommitMark } from './commit-mark.ts';
import { connectPostgres, isPostgresUrl, postgresWrite } from './postgres-database.ts';
import * as batchSortIndexes from './migrations/002-batch-sort-indexes.ts';
import * as sessionCutoff from './migrations/003-session-cutoff.ts';
import * as outbox from './migrations/004-outbox.ts';
import * as invitations from './migrations/005-invitations.ts';
import * as reminders from './migrations/006-reminders.ts';
import * as processRecords from './migrations/007-process-records.ts';
import * as startedCalculation from './migrations/008-started-calculation.ts';
import * as processAlertPrefs from './migrations/009-process-alert-prefs.ts';
import * as plans from './migrations/010-plans.ts';
import * as reviewQueueIndexes from './migrations/011-review-queue-indexes.ts';
import * as unaffectedDisposition from './migrations/012-unaffected-disposition.ts';
import * as loggerSummaries from './migrations/013-logger-summaries.ts';
import * as turns from './migrations/014-turns.ts';
import * as stock from './migrations/015-stock.ts';
import * as lotUsesReplaced from './migrations/016-lot-uses-replaced.ts';
import * as receiptJudgement from './migrations/017-receipt-judgement.ts';
import * as costIndexes from './migrations/018-cost-indexes.ts';
import * as formulaStatusIndex from './migrations/019-formula-status-index.ts';
import * as signInAttempts from './migrations/020-sign-in-attempts.ts';
import * as sites from './migrations/021-sites.ts';
import * as siteUniqueNames from './migrations/022-site-unique-names.ts';

/** Milliseconds a connection waits for another writer before giving up with SQLITE_BUSY. */
const BUSY_TIMEOUT_MS = 10_000;

/** How a database is opened. */
export interface OpenOptions {
  /** How long a write waits for another connection's write lock (LARDER_BUSY_TIMEOUT_MS). */
  readonly busyTimeoutMs?: number;
}

/** Every schema change, in order. Bundled, so listed here rather than found on disk. */
const MIGRATIONS = [
  initial,
  batchSortIndexes,
  sessionCutoff,
  outbox,
  invitations,
  reminders,
  processRecords,
  startedCalculation,
  processAlertPrefs,
  plans,
  reviewQueueIndexes,
  unaffectedDisposition,
  loggerSummaries,
  turns,
  stock,
  lotUsesReplaced,
  receiptJudgement,
  costIndexes,
  formulaStatusIndex,
  signInAttempts,
  sites,
  siteUniqueNames,
];

/** An open database: the Sequelize instance the repositories share. */
export interface Database {
  readonly sequelize: Sequelize;
  /** Which database: the embedded SQLite file, or a PostgreSQL server (LARDER_DB_URL). */
  readonly dialect: 'sqlite' | 'postgres';
  /**
   * Runs `work` in one write transaction: on SQLite one that takes the write lock at once (BEGIN
   * IMMEDIATE), on PostgreSQL a serializable one, run again when it loses a race.
   */
  write<T>(work: (transaction: Transaction) => Promise<T>): Promise<T>;
  /**
   * Text that changes whenever any connection of any process commits, read without a query;
   * undefined when the database cannot say so cheaply (PostgreSQL, SQLite in memory). What is
   * kept under one mark holds until the mark changes (server/auth/session-cache.ts).
   */
  commitMark(): string | undefined;
  close(): Promise<void>;
}

/**
 * Sets the busy timeout and sync mode on every SQLite connection as it is first handed out.
 * Sequelize's SQLite dialect opens one connection per transaction and never runs the
 * afterConnect hook, so we wrap its connection manager instead.
 */
function configureEachConnection(sequelize: Sequelize, busyTimeoutMs: number): void {
  const manager = sequelize.connectionManager as unknown as {
    getConnection(options?: object): Promise<SqliteConnection>;
  };
  const getConnection = manager.getConnection.bind(manager);
  const configured = new WeakSet<SqliteConnection>();
  manager.getConnection = async (options) => {
    const connection = await getConnection(options);
    if (!configured.has(connection)) {
      // A statement run without a callback (Sequelize's own PRAGMA foreign_keys) reports its
      // failure as an 'error' event, which would end the process: the next query fails anyway.
      connection.on('error', () => undefined);
      connection.configure('busyTimeout', busyTimeoutMs);
      // WAL with NORMAL sync keeps every committed transaction through a crash of the process.
      // When it cannot be set (a read-only file) SQLite keeps FULL, which is safer still.
      connection.exec('PRAGMA synchronous = NORMAL', () => undefined);
      configured.add(connection);
    }
    return connection;
  };
}

interface SqliteConnection {
  configure(option: 'busyTimeout', value: number): void;
  exec(sql: string, callback: (error: Error | null) => void): void;
  on(event: 'error', listener: (error: Error) => void): void;
}

/**
 * Applies the migrations not applied yet, the same list on either database; with `to`, only
 * those up to that one (a spec makes a database as an older version left it).
 */
export async function migrate(sequelize: Sequelize, to?: string): Promise<void> {
  const umzug = new Umzug({
    migrations: MIGRATIONS.map((migration) => ({
      name: migration.name,
      up: () => migration.up(sequelize.getQueryInterface()),
    })),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
  await umzug.up(to === undefined ? undefined : { to });
}

/**
 * Connects to a PostgreSQL server's database and applies pending migrations. Two processes
 * starting at once take turns: an advisory lock held for the migration keeps the second waiting.
 */
async function openPostgres(
  url: string,
  { busyTimeoutMs = BUSY_TIMEOUT_MS }: OpenOptions,
): Promise<Database> {
  const sequelize = await connectPostgres(url, busyTimeoutMs);
  try {
    await sequelize.transaction(async (transaction) => {
      // A second process waits out the first's migrations however long they take.
      await sequelize.query('SET LOCAL lock_timeout = 0', { transaction });
      // Any fixed number names the lock: it is this database's migration lock.
      await sequelize.query('SELECT pg_advisory_xact_lock(1765)', { transaction });
      await migrate(sequelize);
    });
  } catch (error) {
    await sequelize.close();
    const where = new URL(url);
    // Say which server, without its password.
    throw new Error(
      `cannot open the database ${where.hostname}:${where.port || 5432}${where.pathname}: ${(error as Error).message}`,
      { cause: error },
    );
  }
  return {
    sequelize,
    dialect: 'postgres',
    // How long a write keeps trying after lost races: the same setting as SQLite's busy wait.
    write: postgresWrite(sequelize, busyTimeoutMs),
    // No cheap way to know of other processes' commits: every request asks the database.
    commitMark: () => undefined,
    close: () => sequelize.close(),
  };
}

/**
 * Opens the database: a PostgreSQL server when `location` is a postgres:// URL, else the SQLite
 * file at that path (created if needed; WAL mode and a busy timeout on every connection).
 * Applies pending migrations. Never uses sync(): the schema is migrations only.
 */
export async function openDatabase(location: string, options: OpenOptions = {}): Promise<Database> {
  return isPostgresUrl(location) ? openPostgres(location, options) : openSqlite(location, options);
}

async function openSqlite(
  file: string,
  { busyTimeoutMs = BUSY_TIMEOUT_MS }: OpenOptions,
): Promise<Database> {
  if (file !== ':memory:') mkdirSync(path.dirname(file), { recursive: true });
  const sequelize = new Sequelize({
    dialect: 'sqlite',
    storage: file,
    logging: false,
    // SQLite's busy timeout does the waiting; Sequelize's default of 5 tries on SQLITE_BUSY would
    // make a write wait five busy timeouts for a lock another program holds.
    retry: { max: 1 },
  });
  configureEachConnection(sequelize, busyTimeoutMs);
  try {
    await sequelize.query('PRAGMA journal_mode = WAL');
  } catch (error) {
    await sequelize.close();
    // Say which file: SQLite's own message ("attempt to write a readonly database") does not.
    throw new Error(`cannot open the database ${file}: ${(error as Error).message}`, {
      cause: error,
    });
  }
  await migrate(sequelize);
  const queue = new WriteQueue();
  const marks = file === ':memory:' ? undefined : sqliteCommitMark(file);
  return {
    sequelize,
    dialect: 'sqlite',
    // One write transaction at a time in this process (see write-queue.ts), retried while another
    // process or an autocommit statement holds the lock.
    write: (work) =>
      queue.run(() =>
        retryWhileBusy(
          () => sequelize.transaction({ type: Transaction.TYPES.IMMEDIATE }, work),
          busyTimeoutMs,
        ),
      ),
    commitMark: () => marks?.read(),
    close: async () => {
      marks?.close();
      await sequelize.close();
    },
  };
}
