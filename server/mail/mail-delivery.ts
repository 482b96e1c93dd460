import type { Mailer } from './mailer.ts';
import type { OutboxRepository } from './outbox-repository.ts';

/** How many messages one pass reads from the queue at a time. */
const BATCH = 50;

/**
 * Hands the outbox's pending messages to the transport, one run at a time in this process.
 * Anything that puts messages in the outbox calls kick() after its transaction commits; the
 * reminder scheduler kicks on every run, which is also when failed messages are tried again.
 */
export class MailDelivery {
  private running: Promise<void> | null = null;
  private again = false;
  private recovered = false;
  private stopped = false;

  constructor(
    private readonly outbox: OutboxRepository,
    private readonly mailer: Mailer,
    private readonly report: (error: unknown) => void = logError,
  ) {}

  /** Starts a run now, or another one right after the current run. Never rejects. */
  kick(): void {
    if (this.stopped) return;
    if (this.running) {
      this.again = true;
      return;
    }
    this.running = this.loop().finally(() => {
      this.running = null;
    });
  }

  /** Resolves when no run is going on: what tests wait for before reading the outbox. */
  async idle(): Promise<void> {
    while (this.running) await this.running;
  }

  /** Lets the current run finish and starts no more. */
  async stop(): Promise<void> {
    this.stopped = true;
    await this.idle();
    this.mailer.close();
  }

  private async loop(): Promise<void> {
    do {
      this.again = false;
      try {
        await this.runOnce();
      } catch (error) {
        this.report(error);
      }
    } while (this.again && !this.stopped);
  }

  private async runOnce(): Promise<void> {
    if (!this.recovered) {
      // Only this process sends, and it has sent nothing yet: a message left "sending" was
      // interrupted by a crash or a kill.
      await this.outbox.recover();
      this.recovered = true;
    }
    const tried = new Set<number>();
    for (;;) {
      const ids = (await this.outbox.due(BATCH + tried.size)).filter((id) => !tried.has(id));
      if (ids.length === 0 || this.stopped) return;
      for (const id of ids) {
        tried.add(id);
        const message = await this.outbox.claim(id);
        if (!message) continue;
        await this.outbox.finish(id, await this.mailer.send(message));
        if (this.stopped) return;
      }
    }
  }
}

function logError(error: unknown): void {
  // Only the stack: a database error's own fields carry the SQL with its values.
  console.error(error instanceof Error ? (error.stack ?? error.message) : error); // eslint-disable-line no-console -- the server log is the place for a delivery failure
}
