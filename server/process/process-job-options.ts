/**
 * How a periodic job of the process record runs (the deadline scan, the process alerts): its
 * clock, how often, where a failed run goes. Tests move its clock and run it by hand.
 */
export interface ProcessJobOptions {
  /** The clock; the context's by default. */
  readonly now?: () => Date;
  /** Time between runs; the job's own default (every minute) otherwise. */
  readonly intervalMs?: number;
  /** Where a failed run is reported; the server log by default. */
  readonly report?: (error: unknown) => void;
}
