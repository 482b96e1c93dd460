import { randomUUID } from 'node:crypto';
import { QueryTypes, type Transaction } from 'sequelize';
import type { Database } from '../db/database.ts';
import { readRow } from '../db/read-row.ts';
import { postgresFault } from '../db/postgres-faults.ts';
import { sqliteCode } from '../http/error-handler.ts';
import { RetryLaterError } from '../http/retry-later.ts';

/** The window sign-in attempts are counted in: 15 minutes. common practice, no source */
const WINDOW_MS = 15 * 60 * 1000;
/**
 * A password check begun this long ago was cut off by a process that ended mid-way (a hash takes
 * well under a second): it no longer counts. Far longer than the window, so a slow check still
 * counts when its window ends. common practice, no source
 */
const CHECK_FORGOTTEN_MS = 60 * 60 * 1000;

/** One sign-in attempt, counted from before its password is hashed until it ends. */
export interface SignInAttempt {
  /**
   * Ends the attempt. A failed one stays counted until the window ends; one that succeeded, or
   * whose password was never checked, is given back. Only the first call counts.
   */
  end(failed: boolean): Promise<void>;
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

/** An address's window and its checks going on, as read. */
interface Counts {
  failed: number;
  checking: number;
  resetAt: number;
  refused: boolean;
}

/** What an address may do now: try, wait for its checks going on, or wait out its window. */
type Verdict =
  | { readonly kind: 'admitted' }
  | { readonly kind: 'checking' }
  | { readonly kind: 'refused'; readonly seconds: number; readonly first: boolean };

// BIGINT and COUNT come back as strings from some drivers: Number() whatever the database.
const COUNTS_SQL = `SELECT w.failed AS failed, w.reset_at AS reset_at, w.refused AS refused,
    (SELECT COUNT(*) FROM sign_in_checks c WHERE c.address = w.address AND c.began_at > ?) AS checking
  FROM sign_in_windows w WHERE w.address = ?`;

interface CountsRow {
  failed: number | string;
  reset_at: number | string;
  refused: number | string;
  checking: number | string;
}

const countsOf = (row: CountsRow | undefined): Counts | undefined =>
  row && {
    failed: Number(row.failed),
    checking: Number(row.checking),
    resetAt: Number(row.reset_at),
    refused: Number(row.refused) === 1,
  };

/**
 * Sign-in attempts per address, by form and by HTTP Basic together, counted in the database so
 * that every server process on it holds the address to one limit. An attempt counts from before
 * its password is hashed, so a burst of guesses sent at once is held to the limit as surely as
 * one sent in turn; it stays counted only if it fails, so people signing in correctly never use
 * up the allowance. Past the limit the address is refused, the right password too, until its
 * window ends, and nothing is hashed for it. Each change is one write transaction, so two
 * processes never both take the last place.
 */
export class SignInAttempts {
  constructor(
    private readonly db: Database,
    private readonly limit: number,
    private readonly now: () => number = Date.now,
  ) {}

  /**
   * Failures counted in this process while the database takes no writes (a read-only file after
   * a restore): reading must go on, and the address is still held to the limit, here alone.
   */
  private readonly unsaved = new Map<string, { failed: number; resetAt: number }>();

  /**
   * Refuses an address whose failed attempts and attempts being checked reach the limit. An
   * address with no failures (nearly every request signed with HTTP Basic) costs one read.
   * @throws RetryLaterError 429 too-many-attempts, with the seconds to wait
   */
  async admit(address: string): Promise<void> {
    const now = this.now();
    const counts = countsOf(
      await readRow<CountsRow>(this.db.sequelize, COUNTS_SQL, [now - CHECK_FORGOTTEN_MS, address]),
    );
    if (!counts || (counts.resetAt > now && counts.failed + counts.checking < this.limit)) return;
    // A window ended or a refusal to note: decided again under the write lock.
    try {
      raise(await this.db.write((t) => this.judge(t, address)));
    } catch (error) {
      // A read-only database keeps its windows as they are: this process counts (beginUnsaved).
      if (!isReadOnly(error)) throw error;
    }
  }

  /**
   * Counts an attempt from the address before its password is checked.
   * @throws RetryLaterError 429 too-many-attempts when the address may not try now
   */
  async begin(address: string): Promise<SignInAttempt> {
    try {
      return await this.beginSaved(address);
    } catch (error) {
      if (!isReadOnly(error)) throw error;
      return this.beginUnsaved(address);
    }
  }

  /** Counts an attempt in this process, the database being read-only. */
  private beginUnsaved(address: string): SignInAttempt {
    const now = this.now();
    let entry = this.unsaved.get(address);
    if (!entry || entry.resetAt <= now) {
      entry = { failed: 0, resetAt: now + WINDOW_MS };
      this.unsaved.set(address, entry);
    }
    if (entry.failed >= this.limit)
      raise({ kind: 'refused', seconds: Math.ceil((entry.resetAt - now) / 1000), first: false });
    const counted = entry;
    return {
      end: async (failed) => {
        if (failed) counted.failed += 1;
      },
    };
  }

  private async beginSaved(address: string): Promise<SignInAttempt> {
    const id = randomUUID();
    raise(
      await this.db.write(async (t) => {
        const verdict = await this.judge(t, address);
        if (verdict.kind !== 'admitted') return verdict;
        const now = this.now();
        if (!(await this.counts(t, address))) await this.open(t, address, now, 0);
        await this.run(t, 'INSERT INTO sign_in_checks (id, address, began_at) VALUES (?, ?, ?)', [
          id,
          address,
          now,
        ]);
        return verdict;
      }),
    );
    let ended = false;
    return {
      end: async (failed) => {
        if (ended) return;
        ended = true;
        await this.db.write((t) => this.finish(t, id, address, failed));
      },
    };
  }

  /** What the address may do now; ends its window when due and notes its first refusal. */
  private async judge(t: Transaction, address: string): Promise<Verdict> {
    const counts = await this.counts(t, address);
    if (!counts) return { kind: 'admitted' };
    const now = this.now();
    if (counts.resetAt <= now) {
      // The window has ended: its failures are forgotten, attempts still running go on counting.
      if (counts.checking === 0) {
        await this.run(t, 'DELETE FROM sign_in_windows WHERE address = ?', [address]);
        return { kind: 'admitted' };
      }
      await this.run(
        t,
        'UPDATE sign_in_windows SET failed = 0, refused = 0, reset_at = ? WHERE address = ?',
        [now + WINDOW_MS, address],
      );
      Object.assign(counts, { failed: 0, refused: false, resetAt: now + WINDOW_MS });
    }
    if (counts.failed + counts.checking < this.limit) return { kind: 'admitted' };
    // Checks still running fill the allowance: their answers will say in a moment.
    if (counts.failed < this.limit) return { kind: 'checking' };
    if (!counts.refused)
      await this.run(t, 'UPDATE sign_in_windows SET refused = 1 WHERE address = ?', [address]);
    return {
      kind: 'refused',
      seconds: Math.ceil((counts.resetAt - now) / 1000),
      first: !counts.refused,
    };
  }

  /** Ends a check: a failure counts in the address's window, a success gives its place back. */
  private async finish(
    t: Transaction,
    id: string,
    address: string,
    failed: boolean,
  ): Promise<void> {
    await this.run(t, 'DELETE FROM sign_in_checks WHERE id = ?', [id]);
    const counts = await this.counts(t, address);
    if (failed) {
      if (counts)
        await this.run(t, 'UPDATE sign_in_windows SET failed = failed + 1 WHERE address = ?', [
          address,
        ]);
      else await this.open(t, address, this.now(), 1);
    } else if (counts && counts.failed === 0 && counts.checking === 0)
      await this.run(t, 'DELETE FROM sign_in_windows WHERE address = ?', [address]);
  }

  /** Opens a window for the address, forgetting ended windows and checks long cut off. */
  private async open(t: Transaction, address: string, now: number, failed: number): Promise<void> {
    await this.run(t, 'DELETE FROM sign_in_checks WHERE began_at <= ?', [now - CHECK_FORGOTTEN_MS]);
    await this.run(
      t,
      'DELETE FROM sign_in_windows WHERE reset_at <= ? AND address NOT IN (SELECT address FROM sign_in_checks)',
      [now],
    );
    await this.run(
      t,
      'INSERT INTO sign_in_windows (address, failed, reset_at, refused) VALUES (?, ?, ?, 0)',
      [address, failed, now + WINDOW_MS],
    );
  }

  private async counts(t: Transaction, address: string): Promise<Counts | undefined> {
    const [row] = await this.db.sequelize.query<CountsRow>(COUNTS_SQL, {
      replacements: [this.now() - CHECK_FORGOTTEN_MS, address],
      type: QueryTypes.SELECT,
      transaction: t,
    });
    return countsOf(row);
  }

  private async run(t: Transaction, sql: string, values: (string | number)[]): Promise<void> {
    await this.db.sequelize.query(sql, { replacements: values, transaction: t });
  }
}

/** Throws the refusal a verdict holds; an admitted one passes. */
function raise(verdict: Verdict): void {
  if (verdict.kind === 'checking')
    throw new RetryLaterError(
      429,
      'too-many-attempts',
      'too many sign-in attempts are being checked from this address; try again in a moment',
      1,
    );
  if (verdict.kind === 'refused') {
    const minutes = Math.ceil(verdict.seconds / 60);
    throw new TooManySignIns(
      `too many failed sign-in attempts; wait ${minutes === 1 ? 'a minute' : `${minutes} minutes`} and try again`,
      verdict.seconds,
      verdict.first,
    );
  }
}

/** Whether a write failed because the database takes no writes at all (not busy: read-only). */
function isReadOnly(error: unknown): boolean {
  return !!sqliteCode(error)?.startsWith('SQLITE_READONLY') || postgresFault(error) === 'read-only';
}
