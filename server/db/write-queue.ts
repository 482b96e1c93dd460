/**
 * Write transactions one at a time within this process (used by Database.write).
 *
 * Each write transaction gets its own SQLite connection, and node-sqlite3 runs every statement on
 * libuv's small thread pool (4 threads). When several transactions wait in BEGIN IMMEDIATE's busy
 * handler they hold those threads, and the transaction that has the lock cannot get a thread for
 * its next statement: all of them time out with SQLITE_BUSY. Queuing the writes here, in
 * JavaScript, lets each transaction run straight through; SQLite's lock still guards against
 * other processes.
 */
export class WriteQueue {
  private tail: Promise<unknown> = Promise.resolve();

  /** Runs `work` after every write queued before it has finished, whatever their outcome. */
  run<T>(work: () => Promise<T>): Promise<T> {
    const result = this.tail.then(work, work);
    this.tail = result.catch(() => undefined);
    return result;
  }
}

/** Whether an error is SQLite saying another connection holds the write lock. */
export function isBusy(error: unknown): boolean {
  const e = error as { parent?: { code?: string }; original?: { code?: string }; code?: string };
  return [e.parent?.code, e.original?.code, e.code].some((code) => code?.startsWith('SQLITE_BUSY'));
}

/** Pauses between tries when the database is busy, in milliseconds: about 3 s in all. */
const BUSY_PAUSES = [20, 40, 80, 160, 320, 500, 800, 1000];

/**
 * Runs a whole write transaction again while another connection (a session save, another
 * process) holds the write lock. Safe because a busy transaction wrote nothing. Each try already
 * waits in SQLite's busy handler, so tries stop once `patienceMs` has gone by since the first:
 * a lock held longer (another program's open transaction) is answered, not waited out 9 times.
 */
export async function retryWhileBusy<T>(work: () => Promise<T>, patienceMs = 10_000): Promise<T> {
  const started = Date.now();
  for (let attempt = 0; ; attempt++) {
    try {
      return await work();
    } catch (error) {
      if (
        !isBusy(error) ||
        attempt >= BUSY_PAUSES.length ||
        Date.now() - started + BUSY_PAUSES[attempt] > patienceMs
      )
        throw error;
      await new Promise((resolve) => setTimeout(resolve, BUSY_PAUSES[attempt]));
    }
  }
}
