import { createHmac, randomBytes } from 'node:crypto';

/**
 * How long a verified HTTP Basic password is remembered. Short, so that a leaked process memory
 * or a forgotten script holds little; long enough that a script's burst of requests pays for one
 * scrypt hash. common practice, no source
 */
export const REMEMBER_MS = 60_000;
/** Most credentials remembered at once; the oldest go first. */
const MAX_ENTRIES = 1000;

/**
 * Passwords recently proved right by scrypt, so that HTTP Basic (which sends the password with
 * every request) does not pay a deliberately slow hash per request.
 *
 * An entry is an HMAC, under a random key of this process, of the person's id, their stored
 * password hash and the password: it holds no password, and the stored hash carries a fresh salt
 * whenever the password is set, so a changed password never matches an old entry. The caller
 * still reads the person on every request and refuses an inactive one. Also shares one running
 * hash among identical attempts that arrive together.
 */
export class VerifiedCredentials {
  private readonly secret = randomBytes(32);
  private readonly until = new Map<string, number>();
  private readonly running = new Map<string, Promise<boolean>>();

  constructor(
    private readonly rememberMs = REMEMBER_MS,
    private readonly now: () => number = Date.now,
  ) {}

  /**
   * Whether the password is right for this stored hash: at once when it was proved within the
   * last rememberMs, else by `verify` (remembered when it says yes).
   */
  async check(
    personId: number,
    storedHash: string,
    password: string,
    verify: () => Promise<boolean>,
  ): Promise<boolean> {
    const key = createHmac('sha256', this.secret)
      .update(`${personId}\0${storedHash}\0`)
      .update(password, 'utf8')
      .digest('base64');
    const until = this.until.get(key);
    if (until !== undefined) {
      if (until > this.now()) return true;
      this.until.delete(key);
    }
    let pending = this.running.get(key);
    if (!pending) {
      pending = verify().finally(() => this.running.delete(key));
      this.running.set(key, pending);
    }
    const ok = await pending;
    if (ok) this.remember(key);
    return ok;
  }

  private remember(key: string): void {
    this.until.delete(key);
    if (this.until.size >= MAX_ENTRIES) {
      const now = this.now();
      for (const [old, until] of this.until) if (until <= now) this.until.delete(old);
      // Still full: drop the oldest (a Map iterates in insertion order).
      if (this.until.size >= MAX_ENTRIES) this.until.delete(this.until.keys().next().value!);
    }
    this.until.set(key, this.now() + this.rememberMs);
  }
}
