import cluster from 'node:cluster';

/** The setting the primary gives each worker process: its place, 1 to N. */
export const WORKER_INDEX = 'LARDER_WORKER_INDEX';

/** What this server process does besides serving requests. */
export interface ProcessRole {
  /** Writes the demo formulas and people: the one process, or the primary before any worker serves. */
  readonly seeds: boolean;
  /**
   * Runs the once-only jobs (reminders, the deadline scan, process alerts, equipment due): the
   * one process, or worker 1 of N. Each job also decides every message and deviation once in the
   * database, so a second server on the same file never repeats one either.
   */
  readonly runsJobs: boolean;
  /** Prints the start banner: the one process; with N, the primary once every worker listens. */
  readonly printsBanner: boolean;
}

/**
 * This process's part: the only one (N = 1), the primary that seeds and forks (N > 1), or a
 * worker, of which only the first runs the jobs.
 */
export function processRole(processes: number): 'primary' | ProcessRole {
  if (cluster.isPrimary)
    return processes > 1 ? 'primary' : { seeds: true, runsJobs: true, printsBanner: true };
  return { seeds: false, runsJobs: process.env[WORKER_INDEX] === '1', printsBanner: false };
}
