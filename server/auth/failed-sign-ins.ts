/** The window sign-in attempts are counted in, as for the sign-in form: 15 minutes. */
const WINDOW_MS = 15 * 60 * 1000;

/**
 * Failed HTTP Basic sign-ins per address. Past the limit, the address is refused until its window
 * ends, before any password is checked, so guessing cannot go on through Basic where the form's
 * limit stops it. Only failures count: a script signing every request correctly is never held up.
 */
export class FailedSignIns {
  private readonly byAddress = new Map<string, { count: number; resetAt: number }>();

  constructor(
    private readonly limit: number,
    private readonly now: () => number = Date.now,
  ) {}

  /** Milliseconds until the address may try again; 0 when it may try now. */
  waitFor(address: string): number {
    const entry = this.byAddress.get(address);
    if (!entry) return 0;
    const left = entry.resetAt - this.now();
    if (left <= 0) {
      this.byAddress.delete(address);
      return 0;
    }
    return entry.count >= this.limit ? left : 0;
  }

  /** Counts one failed attempt from the address. */
  failed(address: string): void {
    const now = this.now();
    // Forget windows that have ended, so the map holds only addresses failing now.
    for (const [key, entry] of this.byAddress) if (entry.resetAt <= now) this.byAddress.delete(key);
    const entry = this.byAddress.get(address);
    if (entry) entry.count += 1;
    else this.byAddress.set(address, { count: 1, resetAt: now + WINDOW_MS });
  }
}
