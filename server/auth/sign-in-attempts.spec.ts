import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { RetryLaterError } from '../http/retry-later.ts';
import { SignInAttempts } from './sign-in-attempts.ts';

// The window attempts are counted in. source: server/auth/sign-in-attempts.ts
const WINDOW_MS = 15 * 60 * 1000;

/** The refusal begin() or admit() throws, or undefined when the address may try. */
function refusal(attempt: () => unknown): RetryLaterError | undefined {
  try {
    attempt();
    return undefined;
  } catch (error) {
    assert.ok(error instanceof RetryLaterError);
    assert.equal(error.status, 429);
    assert.equal(error.code, 'too-many-attempts');
    return error;
  }
}

describe('SignInAttempts', () => {
  it('should count attempts whose passwords are still being checked', () => {
    const attempts = new SignInAttempts(3);
    for (let i = 0; i < 3; i++) attempts.begin('10.0.0.1');
    const refused = refusal(() => attempts.begin('10.0.0.1'));
    // The checks running will answer in a moment: no need to wait out the window.
    assert.equal(refused?.retryAfterSeconds, 1);
    assert.ok(refusal(() => attempts.admit('10.0.0.1')));
    assert.equal(
      refusal(() => attempts.begin('10.0.0.2')),
      undefined,
      'another address',
    );
  });

  it('should give back an attempt that did not fail, and keep a failed one', () => {
    const attempts = new SignInAttempts(2);
    for (let i = 0; i < 10; i++) attempts.begin('10.0.0.1').end(false);
    attempts.begin('10.0.0.1').end(true);
    attempts.begin('10.0.0.1').end(true);
    const refused = refusal(() => attempts.begin('10.0.0.1'));
    assert.equal(refused?.retryAfterSeconds, WINDOW_MS / 1000);
    assert.match(refused?.message ?? '', /wait 15 minutes/);
  });

  it('should count an attempt ended twice once', () => {
    const attempts = new SignInAttempts(2);
    const attempt = attempts.begin('10.0.0.1');
    attempt.end(true);
    attempt.end(true);
    assert.equal(
      refusal(() => attempts.begin('10.0.0.1')),
      undefined,
    );
  });

  it('should forget failures when the window ends, and not before', () => {
    let now = 1_000_000;
    const attempts = new SignInAttempts(1, () => now);
    attempts.begin('10.0.0.1').end(true);
    now += WINDOW_MS - 1_000;
    assert.equal(refusal(() => attempts.admit('10.0.0.1'))?.retryAfterSeconds, 1);
    now += 1_000;
    assert.equal(
      refusal(() => attempts.admit('10.0.0.1')),
      undefined,
    );
  });

  it('should go on counting an attempt still being checked when the window ends', () => {
    let now = 1_000_000;
    const attempts = new SignInAttempts(2, () => now);
    attempts.begin('10.0.0.1').end(true);
    const slow = attempts.begin('10.0.0.1');
    now += WINDOW_MS;
    // The old failure is forgotten; the check still running holds one place of the new window.
    attempts.begin('10.0.0.1');
    assert.ok(refusal(() => attempts.begin('10.0.0.1')));
    slow.end(true);
    assert.ok(
      refusal(() => attempts.begin('10.0.0.1')),
      'its failure counts in the new window',
    );
  });
});
