/**
 * A job run at start and then every few minutes: runs never overlap in one process, a failed run
 * is reported and the next one tries again. The reminder and equipment-due schedulers are ones.
 */
export abstract class PeriodicRun<T> {
  private timer: NodeJS.Timeout | null = null;
  private last: Promise<unknown> = Promise.resolve();

  /**
   * @param intervalMs time between runs
   * @param report where a failed run is reported; the server log by default
   */
  constructor(
    private readonly intervalMs: number,
    private readonly report: (error: unknown) => void = logError,
  ) {}

  /** One run of the job. */
  protected abstract run(): Promise<T>;

  /** Runs now, then every interval, until stop(). */
  start(): void {
    if (this.timer) return;
    void this.tick();
    this.timer = setInterval(() => void this.tick(), this.intervalMs);
    // The HTTP server keeps the process alive; the timer alone should not.
    this.timer.unref();
  }

  /** Stops the timer and waits for a run going on. */
  async stop(): Promise<void> {
    if (this.timer) clearInterval(this.timer);
    this.timer = null;
    await this.last.catch(() => undefined);
  }

  /** One run, after any run going on has finished. */
  runOnce(): Promise<T> {
    const run = this.last.catch(() => undefined).then(() => this.run());
    this.last = run;
    return run;
  }

  private async tick(): Promise<void> {
    try {
      await this.runOnce();
    } catch (error) {
      this.report(error);
    }
  }
}

function logError(error: unknown): void {
  // Only the stack: a database error's own fields carry the SQL with its values.
  console.error(error instanceof Error ? (error.stack ?? error.message) : error); // eslint-disable-line no-console -- the server log is the place for a failed run
}
