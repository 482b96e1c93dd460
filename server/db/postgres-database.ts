import { Sequelize, Transaction } from 'sequelize';
import type { Database } from './database.ts';
import { isWriteConflict } from './postgres-faults.ts';
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
  return new Sequelize(url, {
    dialect: 'postgres',
    dialectModule: pg,
    logging: false,
    pool: { max: POOL_SIZE },
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
  return (work) =>
    queue.run(() =>
      retryConflicts(
        () =>
          sequelize.transaction(
            { isolationLevel: Transaction.ISOLATION_LEVELS.SERIALIZABLE },
            work,
          ),
        patienceMs,
      ),
    );
}
