import type { Sequelize } from 'sequelize';

type Callback<T> = (error: Error | null, value: T) => void;

interface SqliteStatement {
  all(values: unknown[], callback: Callback<unknown[]>): SqliteStatement;
  finalize(callback: () => void): void;
}

interface SqliteConnection {
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
  const manager = sequelize.connectionManager as unknown as {
    getConnection(options: object): Promise<SqliteConnection>;
  };
  const statement = await statementFor(await manager.getConnection({}), sql);
  return new Promise((resolve, reject) => {
    // all, not get: it steps the statement to its end, so no read transaction stays open on the
    // shared connection (a statement left on a row would pin an old snapshot of the database).
    statement.all([...values], (error, rows) =>
      error ? reject(error) : resolve(rows[0] as T | undefined),
    );
  });
}
