import { deepFreeze } from './deep-freeze.ts';

/** How many sessions a process keeps before it starts over. */
const MAX_KEPT = 10_000;

/**
 * What the database said of a session, kept while nothing at all has been committed to the
 * database since it was read (the database's commit mark): any sign-out, deactivation, role or
 * site change or new password, by any process or program, is a commit, so it takes effect on the
 * very next request. The mark is read before the database is asked, so a commit that lands
 * during the read makes the answer stale at once rather than kept. With no mark (PostgreSQL,
 * SQLite in memory) nothing is kept and every request asks the database.
 *
 * Kept values are frozen, deeply: a route that tried to change one would fail at once rather
 * than change what the next request is told.
 */
export class SessionCache<T extends object> {
  private readonly kept = new Map<string, T | undefined>();
  /** The mark the kept values were read under; a new one empties the cache. */
  private mark: string | undefined;

  constructor(
    private readonly commitMark: () => string | undefined,
    private readonly load: (sid: string) => Promise<T | undefined>,
    private readonly max = MAX_KEPT,
  ) {}

  /** The session's value: kept when the database has not changed since, else read (and kept). */
  read(sid: string): T | undefined | Promise<T | undefined> {
    const mark = this.commitMark();
    if (mark === undefined) {
      this.forget();
      return this.load(sid);
    }
    if (mark !== this.mark) {
      this.kept.clear();
      this.mark = mark;
    }
    if (this.kept.has(sid)) return this.kept.get(sid);
    return this.load(sid).then((value) => {
      // Kept only when no newer mark has been seen meanwhile; a commit not yet seen changes the
      // mark, and the next request reads again.
      if (this.mark === mark) {
        if (this.kept.size >= this.max) this.kept.clear();
        this.kept.set(sid, value && deepFreeze(value));
      }
      return value;
    });
  }

  /** How many sessions are kept now. */
  get size(): number {
    return this.kept.size;
  }

  private forget(): void {
    this.kept.clear();
    this.mark = undefined;
  }
}
