import { RetryLaterError } from '../http/retry-later.ts';

/**
 * Who a password hash is for. `sign-in`: someone proving who they are, who may be turned away
 * when too many wait. `account`: a password set or confirmed by someone signed in already, by an
 * invitation's holder or on the command line; it goes ahead of every sign-in and is never turned
 * away.
 */
export type HashLane = 'sign-in' | 'account';

/**
 * At most `running` password hashes at once, the rest in line. scrypt runs on libuv's thread
 * pool, which sqlite3 and file reads share: a flood of sign-ins, each one a hash, must leave it
 * room for the database, or every other request waits behind the guesses.
 */
export class PasswordHashQueue {
  private hashing = 0;
  private readonly waiting: Record<HashLane, (() => void)[]> = { account: [], 'sign-in': [] };
  private started = 0;

  /**
   * @param running hashes that may run at once
   * @param signInsWaiting sign-in hashes that may wait; one more is refused with 503
   */
  constructor(
    private readonly running: number,
    private readonly signInsWaiting: number,
  ) {}

  /** How many hashes have started, for tests and benchmarks that count the passwords checked. */
  get hashesStarted(): number {
    return this.started;
  }

  /**
   * Runs a hash when its turn comes.
   * @throws RetryLaterError 503 sign-in-busy when a sign-in's hash would wait behind too many
   */
  async run<T>(lane: HashLane, hash: () => Promise<T>): Promise<T> {
    if (this.hashing < this.running) this.hashing++;
    else {
      if (lane === 'sign-in' && this.waiting['sign-in'].length >= this.signInsWaiting)
        throw new RetryLaterError(
          503,
          'sign-in-busy',
          'too many sign-ins are being checked just now; try again in a moment',
          1,
        );
      // A finishing hash hands its place straight on (see next), so nothing can jump the line.
      await new Promise<void>((resolve) => this.waiting[lane].push(resolve));
    }
    this.started++;
    try {
      return await hash();
    } finally {
      this.next();
    }
  }

  private next(): void {
    const turn = this.waiting.account.shift() ?? this.waiting['sign-in'].shift();
    if (turn) turn();
    else this.hashing--;
  }
}

/**
 * The one queue of this process's password hashes. Two at once leave two of libuv's four threads
 * to the database (source: Node.js documentation, UV_THREADPOOL_SIZE, default 4); eight sign-ins
 * in line wait well under a second at tens of milliseconds a hash (common practice, no source).
 */
export const passwordHashes = new PasswordHashQueue(2, 8);
