import type { Sequelize } from 'sequelize';
import { postgresRows } from './postgres-read.ts';

type Callback<T> = (error: Error | null, value: T) => void;

interface SqliteStatement {
  all(values: unknown[], callback: Callback<unknown[]>): SqliteStatement;
  finalize(callback: () => void): void;
}

interface SqliteConnection {
  all(sql: string, values: unknown[], callback: Callback<unknown[]>): SqliteConnection;
  prepare(sql: string, callback: (error: Error | null) => void): SqliteStatement;
  close(callback?: (error: Error | null) => void): void;
}

// Statements prepared once per connection: a one-off query would prepare, run and finalize, three
// trips through the thread pool where a prepared statement takes one.
const preparedOn = new WeakMap<SqliteConnection, Map<string, Promise<SqliteStatement>>>();

function statementFor(connection: SqliteConnection, sql: string): Promise<SqliteStatement> {
  let prepared = preparedOn.get(connection);
  if (!prepared) {
    const statements = new Map<string, Promise<SqliteStatement>>();
    prepared = statements;
    preparedOn.set(connection, statements);
    // SQLite will not close a connection while statements are prepared on it: finalize ours first.
    const close = connection.close.bind(connection);
    connection.close = (callback) => {
      const open = [...statements.values()];
      statements.clear();
      void Promise.allSettled(
        open.map(async (ready) => {
          const statement = await ready;
          await new Promise<void>((resolve) => statement.finalize(resolve));
        }),
      ).then(() => close(callback));
    };
  }
  let ready = prepared.get(sql);
  if (!ready) {
    const statements = prepared;
    ready = new Promise((resolve, reject) => {
      const statement = connection.prepare(sql, (error) =>
        error ? reject(error) : resolve(statement),
      );
    });
    statements.set(sql, ready);
    // A statement that failed to prepare is gone (sqlite3 finalizes it); the next call tries again.
    ready.catch(() => {
      if (statements.get(sql) === ready) statements.delete(sql);
    });
  }
  return ready;
}

/** Sequelize's connection for queries outside a transaction. */
function sharedConnection(sequelize: Sequelize): Promise<SqliteConnection> {
  const manager = sequelize.connectionManager as unknown as {
    getConnection(options: object): Promise<SqliteConnection>;
  };
  return manager.getConnection({});
}

/**
 * Reads at most one row straight from SQLite, with a statement prepared once, on the connection
 * Sequelize itself uses outside transactions. For the lookups every request makes (its session,
 * its person): Sequelize's own query path (parsing the replacements, shaping the result, a fresh
 * statement each time) costs several times the query. Reads only; writes go through Database.write.
 */
export async function readRow<T>(
  sequelize: Sequelize,
  sql: string,
  values: readonly (string | number)[],
): Promise<T | undefined> {
  if (sequelize.getDialect() === 'postgres')
    return (await postgresRows<T>(sequelize, sql, values))[0];
  const statement = await statementFor(await sharedConnection(sequelize), sql);
  return new Promise((resolve, reject) => {
    // all, not get: it steps the statement to its end, so no read transaction stays open on the
    // shared connection (a statement left on a row would pin an old snapshot of the database).
    statement.all([...values], (error, rows) =>
      error ? reject(error) : resolve(rows[0] as T | undefined),
    );
  });
}

/**
 * Reads rows straight from SQLite on the same connection, for the batch log's pages and counts:
 * Sequelize's query path (replacements inlined into the text, every row reshaped, a stack trace
 * captured per query) took about 1 ms of a page's 6 ms of CPU. Not kept prepared: a page's SQL
 * varies with its filters and sort, and preparing it is a small part of running it.
 */
export async function readRows<T>(
  sequelize: Sequelize,
  sql: string,
  values: readonly (string | number)[],
): Promise<T[]> {
  if (sequelize.getDialect() === 'postgres') return postgresRows<T>(sequelize, sql, values);
  const connection = await sharedConnection(sequelize);
  return new Promise((resolve, reject) => {
    connection.all(sql, [...values], (error, rows) =>
      error ? reject(error) : resolve(rows as T[]),
    );
  });
}
