import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { VerifiedCredentials } from './verified-credentials.ts';

/** A verifier that says yes to one password and counts how often it was asked. */
function verifier(right: string): {
  calls: number;
  verify: (password: string) => () => Promise<boolean>;
} {
  const state = {
    calls: 0,
    verify: (password: string) => async () => {
      state.calls++;
      return password === right;
    },
  };
  return state;
}

describe('VerifiedCredentials', () => {
  it('should hash a right password once and then answer from memory', async () => {
    const remembered = new VerifiedCredentials();
    const scrypt = verifier('right-password');
    for (let i = 0; i < 3; i++)
      assert.equal(
        await remembered.check(7, 'hash-a', 'right-password', scrypt.verify('right-password')),
        true,
      );
    assert.equal(scrypt.calls, 1);
  });

  it('should hash a wrong password every time and never remember it', async () => {
    const remembered = new VerifiedCredentials();
    const scrypt = verifier('right-password');
    for (let i = 0; i < 3; i++)
      assert.equal(
        await remembered.check(7, 'hash-a', 'wrong-password', scrypt.verify('wrong-password')),
        false,
      );
    assert.equal(scrypt.calls, 3);
  });

  it('should not let a remembered password through once the stored hash has changed', async () => {
    const remembered = new VerifiedCredentials();
    assert.equal(await remembered.check(7, 'hash-a', 'old-password', async () => true), true);
    // The password was set again (a fresh salt, so a new stored hash): the old one is checked anew.
    const scrypt = verifier('new-password');
    assert.equal(
      await remembered.check(7, 'hash-b', 'old-password', scrypt.verify('old-password')),
      false,
    );
    assert.equal(scrypt.calls, 1);
  });

  it('should keep one person’s password apart from another’s', async () => {
    const remembered = new VerifiedCredentials();
    assert.equal(await remembered.check(7, 'hash-a', 'shared-password', async () => true), true);
    const scrypt = verifier('other-password');
    assert.equal(
      await remembered.check(8, 'hash-a', 'shared-password', scrypt.verify('shared-password')),
      false,
    );
    assert.equal(scrypt.calls, 1);
  });

  it('should forget a password after the time it is remembered', async () => {
    let now = 1_000_000;
    const remembered = new VerifiedCredentials(60_000, () => now);
    const scrypt = verifier('right-password');
    await remembered.check(7, 'hash-a', 'right-password', scrypt.verify('right-password'));
    now += 59_999;
    await remembered.check(7, 'hash-a', 'right-password', scrypt.verify('right-password'));
    assert.equal(scrypt.calls, 1);
    now += 1;
    await remembered.check(7, 'hash-a', 'right-password', scrypt.verify('right-password'));
    assert.equal(scrypt.calls, 2);
  });

  it('should run one hash for identical attempts that arrive together', async () => {
    const remembered = new VerifiedCredentials();
    const scrypt = verifier('right-password');
    const answers = await Promise.all(
      Array.from({ length: 20 }, () =>
        remembered.check(7, 'hash-a', 'right-password', scrypt.verify('right-password')),
      ),
    );
    assert.deepEqual(
      answers,
      Array.from({ length: 20 }, () => true),
    );
    assert.equal(scrypt.calls, 1);
  });

  it('should pass on a failing hash to every attempt waiting for it, and remember nothing', async () => {
    const remembered = new VerifiedCredentials();
    const failing = async (): Promise<boolean> => {
      throw new Error('scrypt failed');
    };
    await assert.rejects(remembered.check(7, 'hash-a', 'right-password', failing), /scrypt failed/);
    const scrypt = verifier('right-password');
    assert.equal(
      await remembered.check(7, 'hash-a', 'right-password', scrypt.verify('right-password')),
      true,
    );
    assert.equal(scrypt.calls, 1);
  });

  it('should stay within its size, dropping the oldest first', async () => {
    const remembered = new VerifiedCredentials();
    for (let id = 1; id <= 1001; id++) await remembered.check(id, 'hash', 'pw', async () => true);
    const scrypt = verifier('pw');
    // Person 1 was the oldest and made room for person 1001; person 2 is still remembered.
    await remembered.check(2, 'hash', 'pw', scrypt.verify('pw'));
    assert.equal(scrypt.calls, 0);
    await remembered.check(1, 'hash', 'pw', scrypt.verify('pw'));
    assert.equal(scrypt.calls, 1);
  });
});
