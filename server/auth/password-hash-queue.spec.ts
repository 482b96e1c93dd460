import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { RetryLaterError } from '../http/retry-later.ts';
import { PasswordHashQueue } from './password-hash-queue.ts';

/** A hash that ends when the test says, and a log of when hashes start. */
function hashes() {
  const started: string[] = [];
  const finish = new Map<string, (ok: boolean) => void>();
  let running = 0;
  let most = 0;
  const hash = (name: string) => () => {
    started.push(name);
    running += 1;
    most = Math.max(most, running);
    return new Promise<boolean>((resolve, reject) =>
      finish.set(name, (ok) => {
        running -= 1;
        if (ok) resolve(true);
        else reject(new Error(`${name} failed`));
      }),
    );
  };
  return { started, finish, hash, most: () => most };
}

/** Lets the queue's promises settle. */
const settle = () => new Promise((resolve) => setImmediate(resolve));

describe('PasswordHashQueue', () => {
  it('should run at most the given number of hashes at once, the rest in order', async () => {
    const queue = new PasswordHashQueue(2, 8);
    const h = hashes();
    const done = ['a', 'b', 'c', 'd', 'e'].map((name) => queue.run('sign-in', h.hash(name)));
    await settle();
    assert.deepEqual(h.started, ['a', 'b']);
    h.finish.get('b')?.(true);
    await settle();
    assert.deepEqual(h.started, ['a', 'b', 'c']);
    for (const name of ['a', 'c', 'd', 'e']) {
      await settle();
      h.finish.get(name)?.(true);
    }
    await Promise.all(done);
    assert.equal(h.most(), 2);
    assert.equal(queue.hashesStarted, 5);
  });

  it('should let a password being set go ahead of every sign-in waiting', async () => {
    const queue = new PasswordHashQueue(1, 8);
    const h = hashes();
    const done = [
      queue.run('sign-in', h.hash('first')),
      queue.run('sign-in', h.hash('guess-1')),
      queue.run('sign-in', h.hash('guess-2')),
      queue.run('account', h.hash('new-password')),
    ];
    for (const name of ['first', 'new-password', 'guess-1', 'guess-2']) {
      await settle();
      h.finish.get(name)?.(true);
    }
    await Promise.all(done);
    assert.deepEqual(h.started, ['first', 'new-password', 'guess-1', 'guess-2']);
  });

  it('should turn away a sign-in beyond the line with 503 sign-in-busy, and never a password being set', async () => {
    const queue = new PasswordHashQueue(1, 2);
    const h = hashes();
    const accepted = ['a', 'b', 'c'].map((name) => queue.run('sign-in', h.hash(name)));
    const refused = await queue.run('sign-in', h.hash('d')).catch((error: unknown) => error);
    assert.ok(refused instanceof RetryLaterError);
    assert.equal(refused.status, 503);
    assert.equal(refused.code, 'sign-in-busy');
    assert.equal(refused.retryAfterSeconds, 1);
    const setting = ['x', 'y', 'z'].map((name) => queue.run('account', h.hash(name)));
    for (const name of ['a', 'x', 'y', 'z', 'b', 'c']) {
      await settle();
      h.finish.get(name)?.(true);
    }
    await Promise.all([...accepted, ...setting]);
    assert.deepEqual(h.started, ['a', 'x', 'y', 'z', 'b', 'c']);
    assert.equal(queue.hashesStarted, 6, 'the refused one never started');
  });

  it('should pass a failed hash’s place on', async () => {
    const queue = new PasswordHashQueue(1, 8);
    const h = hashes();
    const failing = queue.run('sign-in', h.hash('a'));
    const next = queue.run('sign-in', h.hash('b'));
    await settle();
    h.finish.get('a')?.(false);
    await assert.rejects(failing, /a failed/);
    await settle();
    h.finish.get('b')?.(true);
    assert.equal(await next, true);
  });
});
