import { RetryLaterError } from '../http/retry-later.ts';

/** The window sign-in attempts are counted in: 15 minutes. common practice, no source */
const WINDOW_MS = 15 * 60 * 1000;

/** One sign-in attempt, counted from before its password is hashed until it ends. */
export interface SignInAttempt {
  /**
   * Ends the attempt. A failed one stays counted until the window ends; one that succeeded, or
   * whose password was never checked, is given back. Only the first call counts.
   */
  end(failed: boolean): void;
}

interface Counts {
  /** Failed attempts in this window. */
  failed: number;
  /** Attempts whose password is being checked now. */
  checking: number;
  resetAt: number;
  /** Whether a refusal in this window has been reported (the audit log notes the first only). */
  refused: boolean;
}

/**
 * The refusal of an address past its limit of failed attempts; `first` on the first refusal of
 * the window, which the audit log notes (each later one would only fill the log for the guesser).
 */
export class TooManySignIns extends RetryLaterError {
  constructor(
    message: string,
    retryAfterSeconds: number,
    readonly first: boolean,
  ) {
    super(429, 'too-many-attempts', message, retryAfterSeconds);
  }
}

/**
 * Sign-in attempts per address, by form and by HTTP Basic together. An attempt counts from before
 * its password is hashed, so a burst of guesses sent at once is held to the limit as surely as
 * one sent in turn; it stays counted only if it fails, so people signing in correctly never use
 * up the allowance. Past the limit the address is refused, the right password too, until its
 * window ends, and nothing is hashed for it.
 */
export class SignInAttempts {
  private readonly byAddress = new Map<string, Counts>();

  constructor(
    private readonly limit: number,
    private readonly now: () => number = Date.now,
  ) {}

  /**
   * Refuses an address whose failed attempts and attempts being checked reach the limit.
   * @throws RetryLaterError 429 too-many-attempts, with the seconds to wait
   */
  admit(address: string): void {
    const counts = this.current(address);
    if (!counts || counts.failed + counts.checking < this.limit) return;
    if (counts.failed < this.limit)
      // Checks still running fill the allowance: their answers will say in a moment.
      throw new RetryLaterError(
        429,
        'too-many-attempts',
        'too many sign-in attempts are being checked from this address; try again in a moment',
        1,
      );
    const seconds = Math.ceil((counts.resetAt - this.now()) / 1000);
    const minutes = Math.ceil(seconds / 60);
    const first = !counts.refused;
    counts.refused = true;
    throw new TooManySignIns(
      `too many failed sign-in attempts; wait ${minutes === 1 ? 'a minute' : `${minutes} minutes`} and try again`,
      seconds,
      first,
    );
  }

  /**
   * Counts an attempt from the address before its password is checked.
   * @throws RetryLaterError 429 too-many-attempts when the address may not try now
   */
  begin(address: string): SignInAttempt {
    this.admit(address);
    const counts = this.current(address) ?? this.open(address);
    counts.checking += 1;
    let ended = false;
    return {
      end: (failed) => {
        if (ended) return;
        ended = true;
        counts.checking -= 1;
        if (failed) counts.failed += 1;
        else if (
          counts.failed === 0 &&
          counts.checking === 0 &&
          this.byAddress.get(address) === counts
        )
          this.byAddress.delete(address);
      },
    };
  }

  /** The address's counts in its current window; undefined when it has none. */
  private current(address: string): Counts | undefined {
    const counts = this.byAddress.get(address);
    if (!counts || counts.resetAt > this.now()) return counts;
    // The window has ended: its failures are forgotten, attempts still running go on counting.
    if (counts.checking === 0) {
      this.byAddress.delete(address);
      return undefined;
    }
    counts.failed = 0;
    counts.refused = false;
    counts.resetAt = this.now() + WINDOW_MS;
    return counts;
  }

  private open(address: string): Counts {
    const now = this.now();
    // Forget ended windows, so the map holds only addresses trying now.
    for (const [key, counts] of this.byAddress)
      if (counts.resetAt <= now && counts.checking === 0) this.byAddress.delete(key);
    const counts = { failed: 0, checking: 0, resetAt: now + WINDOW_MS, refused: false };
    this.byAddress.set(address, counts);
    return counts;
  }
}
