import type pgModule from 'pg';
import { Sequelize, Transaction } from 'sequelize';
import type { Database } from './database.ts';
import { isWriteConflict, postgresCode } from './postgres-faults.ts';
import { WriteQueue } from './write-queue.ts';

/** Whether a database setting names a PostgreSQL server rather than a SQLite file. */
export function isPostgresUrl(location: string): boolean {
  return /^postgres(ql)?:\/\//.test(location);
}

/** Pauses between tries of a write that lost a race, in milliseconds (jittered), the last repeated. */
const CONFLICT_PAUSES = [5, 10, 20, 40, 80, 160, 250];

/**
 * Runs a whole write transaction again after a serialization failure or a deadlock, which
 * PostgreSQL rolled back whole. Each round of a race lets at least one writer through, so tries
 * go on (as SQLite's writers wait for its lock) until `patienceMs` has gone by since the first;
 * the pause is jittered so that two writers that collided do not collide again on the next try.
 */
export async function retryConflicts<T>(work: () => Promise<T>, patienceMs = 10_000): Promise<T> {
  const started = Date.now();
  for (let attempt = 0; ; attempt++) {
    try {
      return await work();
    } catch (error) {
      const pause =
        CONFLICT_PAUSES[Math.min(attempt, CONFLICT_PAUSES.length - 1)] * (0.5 + Math.random());
      if (!isWriteConflict(error) || Date.now() - started + pause > patienceMs) throw error;
      await new Promise((resolve) => setTimeout(resolve, pause));
    }
  }
}

/** The pg module, as imported. */
type PgModule = typeof pgModule;

/** A pg connection as Sequelize's pool sees it, with the time it was opened. */
interface PooledClient {
  _invalid?: boolean;
  _ending?: boolean;
  generation?: number;
}

/**
 * pg with one change to its Client, and the pool check that goes with it. A PostgreSQL session
 * keeps the read-only setting it started with (a standby's, or ALTER DATABASE … SET
 * default_transaction_read_only), so once any connection of the process is refused a write
 * (25006), every connection opened before that refusal is ended rather than handed out again
 * (`validate`); a new connection reads the database's current setting, so the server takes
 * writes again as soon as the database does, without a restart.
 */
function watchReadOnly(pg: PgModule): { module: PgModule; validate: (c: unknown) => boolean } {
  // Raised at each refusal: a connection of an older generation is ended.
  let generation = 0;
  class Client extends pg.Client {
    readonly generation = generation;
    // eslint-disable-next-line @typescript-eslint/no-explicit-any -- pg's query has many overloads
    override query(...args: any[]): any {
      const last = args.length - 1;
      if (typeof args[last] === 'function') {
        const callback = args[last] as (error: unknown, result: unknown) => void;
        args[last] = (error: unknown, result: unknown) => {
          if (error && postgresCode(error) === '25006') generation += 1;
          callback(error, result);
        };
      }
      return (super.query as (...a: any[]) => any)(...args); // eslint-disable-line @typescript-eslint/no-explicit-any
    }
  }
  return {
    // Everything else (types, defaults) is pg's own, read through the prototype.
    module: Object.assign(Object.create(pg) as typeof pg, { Client }),
    // Sequelize's own check (a broken or ending connection), and not opened before a refusal.
    validate: (connection) => {
      const c = connection as PooledClient;
      return !c._invalid && !c._ending && c.generation === generation;
    },
  };
}

/** Connections each server process keeps to PostgreSQL (Sequelize's pool). */
const POOL_SIZE = 10;

/**
 * Connects to PostgreSQL through Sequelize's pg dialect. Counts and ids come back as numbers, as
 * SQLite gives them: PostgreSQL's COUNT is a 64-bit integer, which pg hands over as a string.
 * A statement waits at most `lockTimeoutMs` for a lock another connection holds (a stuck script's
 * LOCK TABLE, a long transaction), then fails with 55P03, answered as SQLite's busy file is.
 */
export async function connectPostgres(url: string, lockTimeoutMs?: number): Promise<Sequelize> {
  const pg = (await import('pg')).default;
  pg.types.setTypeParser(pg.types.builtins.INT8, (text: string) => Number(text));
  const watched = watchReadOnly(pg);
  return new Sequelize(url, {
    dialect: 'postgres',
    dialectModule: watched.module,
    logging: false,
    pool: { max: POOL_SIZE, validate: watched.validate },
    // Our own retry (retryConflicts) tries a whole transaction again; one statement alone never.
    retry: { max: 1 },
    ...(lockTimeoutMs === undefined ? {} : { dialectOptions: { lock_timeout: lockTimeoutMs } }),
  });
}

/**
 * The write of a PostgreSQL database. SERIALIZABLE, because every write of Larderbook was made
 * for SQLite's single writer: it reads (the last lot code of a day, a formula's revision, a
 * reminder already sent) and then writes on what it read. Serializable transactions keep that
 * true with many writers at once: PostgreSQL refuses, with a serialization failure, any that could
 * not have run one after the other, and that one runs again. Within one process the writes still
 * queue (as on SQLite): thirty records of one burst all read and extend the same day's lot codes,
 * so run side by side they mostly refuse each other, and some ran out of patience (503) before
 * their turn came. Queued, a process has one writer, the processes' writers run side by side, and
 * only a race between processes is tried again.
 */
export function postgresWrite(sequelize: Sequelize, patienceMs: number): Database['write'] {
  const queue = new WriteQueue();
  const tries = <T>(work: (transaction: Transaction) => Promise<T>): Promise<T> =>
    retryConflicts(
      () =>
        sequelize.transaction({ isolationLevel: Transaction.ISOLATION_LEVELS.SERIALIZABLE }, work),
      patienceMs,
    );
  return (work) =>
    queue.run(async () => {
      try {
        return await tries(work);
      } catch (error) {
        // Refused as read-only (nothing written): perhaps on a connection opened before the
        // database took writes again. Once more, on a connection opened since (watchReadOnly).
        if (postgresCode(error) !== '25006') throw error;
        return tries(work);
      }
    });
}
