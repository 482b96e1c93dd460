import assert from 'node:assert/strict';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, it, type TestContext } from 'node:test';
import { openDatabase, type Database } from '../db/database.ts';
import { RetryLaterError } from '../http/retry-later.ts';
import { SignInAttempts } from './sign-in-attempts.ts';

// The window attempts are counted in. source: server/auth/sign-in-attempts.ts
const WINDOW_MS = 15 * 60 * 1000;

/** A database file of its own for the test, closed and removed when it ends. */
async function database(t: TestContext, dir = mkdtempSync(path.join(tmpdir(), 'larder-sign-in-'))) {
  const db = await openDatabase(path.join(dir, 'larderbook.sqlite'));
  t.after(async () => {
    await db.close();
    rmSync(dir, { recursive: true, force: true });
  });
  return db;
}

/** The refusal begin() or admit() throws, or undefined when the address may try. */
async function refusal(attempt: () => Promise<unknown>): Promise<RetryLaterError | undefined> {
  try {
    await attempt();
    return undefined;
  } catch (error) {
    assert.ok(error instanceof RetryLaterError);
    assert.equal(error.status, 429);
    assert.equal(error.code, 'too-many-attempts');
    return error;
  }
}

describe('SignInAttempts', () => {
  it('should count attempts whose passwords are still being checked', async (t) => {
    const attempts = new SignInAttempts(await database(t), 3);
    for (let i = 0; i < 3; i++) await attempts.begin('10.0.0.1');
    const refused = await refusal(() => attempts.begin('10.0.0.1'));
    // The checks running will answer in a moment: no need to wait out the window.
    assert.equal(refused?.retryAfterSeconds, 1);
    assert.ok(await refusal(() => attempts.admit('10.0.0.1')));
    assert.equal(await refusal(() => attempts.begin('10.0.0.2')), undefined, 'another address');
  });

  it('should give back an attempt that did not fail, and keep a failed one', async (t) => {
    const attempts = new SignInAttempts(await database(t), 2);
    for (let i = 0; i < 10; i++) await (await attempts.begin('10.0.0.1')).end(false);
    await (await attempts.begin('10.0.0.1')).end(true);
    await (await attempts.begin('10.0.0.1')).end(true);
    const refused = await refusal(() => attempts.begin('10.0.0.1'));
    assert.equal(refused?.retryAfterSeconds, WINDOW_MS / 1000);
    assert.match(refused?.message ?? '', /wait 15 minutes/);
  });

  it('should count an attempt ended twice once', async (t) => {
    const attempts = new SignInAttempts(await database(t), 2);
    const attempt = await attempts.begin('10.0.0.1');
    await attempt.end(true);
    await attempt.end(true);
    assert.equal(await refusal(() => attempts.begin('10.0.0.1')), undefined);
  });

  it('should forget failures when the window ends, and not before', async (t) => {
    let now = 1_000_000;
    const attempts = new SignInAttempts(await database(t), 1, () => now);
    await (await attempts.begin('10.0.0.1')).end(true);
    now += WINDOW_MS - 1_000;
    assert.equal((await refusal(() => attempts.admit('10.0.0.1')))?.retryAfterSeconds, 1);
    now += 1_000;
    assert.equal(await refusal(() => attempts.admit('10.0.0.1')), undefined);
  });

  it('should go on counting an attempt still being checked when the window ends', async (t) => {
    let now = 1_000_000;
    const attempts = new SignInAttempts(await database(t), 2, () => now);
    await (await attempts.begin('10.0.0.1')).end(true);
    const slow = await attempts.begin('10.0.0.1');
    now += WINDOW_MS;
    // The old failure is forgotten; the check still running holds one place of the new window.
    await attempts.begin('10.0.0.1');
    assert.ok(await refusal(() => attempts.begin('10.0.0.1')));
    await slow.end(true);
    assert.ok(
      await refusal(() => attempts.begin('10.0.0.1')),
      'its failure counts in the new window',
    );
  });

  it('should note only the first refusal of a window as the first', async (t) => {
    const attempts = new SignInAttempts(await database(t), 1);
    await (await attempts.begin('10.0.0.1')).end(true);
    const first = await refusal(() => attempts.admit('10.0.0.1'));
    const second = await refusal(() => attempts.begin('10.0.0.1'));
    assert.deepEqual(
      [first, second].map((e) => (e as { first?: boolean }).first),
      [true, false],
    );
  });

  it('should hold an address to one limit across two connections to one database file', async (t) => {
    const dir = mkdtempSync(path.join(tmpdir(), 'larder-sign-in-'));
    const one: Database = await database(t, dir);
    const other: Database = await openDatabase(path.join(dir, 'larderbook.sqlite'));
    t.after(() => other.close());
    const here = new SignInAttempts(one, 4);
    const there = new SignInAttempts(other, 4);
    // Both processes begin at once: between them, four places and no more.
    const begun = await Promise.allSettled(
      Array.from({ length: 10 }, (_, i) => (i % 2 ? here : there).begin('10.0.0.1')),
    );
    assert.equal(begun.filter((b) => b.status === 'fulfilled').length, 4);
    for (const b of begun) if (b.status === 'fulfilled') await b.value.end(true);
    assert.ok(await refusal(() => here.admit('10.0.0.1')));
    assert.ok(await refusal(() => there.admit('10.0.0.1')));
  });
});
