// How many threads `larder check` reads formula files on (see check-pool.ts).
import { availableParallelism } from 'node:os';
import { CliError, EXIT } from './cli-error.ts';

/**
 * From this many files, worker threads pay for themselves. Each starts in tens of milliseconds
 * but reads its first few hundred files two to five times slower than a warm thread, while V8
 * compiles the YAML parser again for it; on the 2-CPU benchmark machine, where two threads run at
 * about 1.4 times the speed of one, two threads first beat one at 1,000 to 1,250 files.
 */
const THREADS_FROM_FILES = 1000;
/** Most threads used unless told: each costs its warm-up, which more files per thread repay. */
const MOST_THREADS = 8;

/**
 * The thread count set by $LARDER_CHECK_THREADS, or undefined when it is unset or empty.
 * @throws CliError (exit 2) when it is not a whole number of 1 or more
 */
export function threadsSetting(
  value: string | undefined = process.env.LARDER_CHECK_THREADS,
): number | undefined {
  if (value === undefined || value.trim() === '') return undefined;
  const threads = /^\d+$/.test(value.trim()) ? Number(value.trim()) : 0;
  if (threads < 1) {
    throw new CliError(
      `LARDER_CHECK_THREADS takes a whole number of threads, 1 or more (1 reads every file on the main thread), not "${value}"`,
      EXIT.usage,
    );
  }
  return threads;
}

/**
 * Threads to read `fileCount` files on, the main one included: the setting when there is one,
 * else one per CPU (at most MOST_THREADS) for THREADS_FROM_FILES files or more, else one.
 */
export function checkThreads(fileCount: number, setting: number | undefined): number {
  if (setting !== undefined) return setting;
  if (fileCount < THREADS_FROM_FILES) return 1;
  return Math.min(availableParallelism(), MOST_THREADS);
}
