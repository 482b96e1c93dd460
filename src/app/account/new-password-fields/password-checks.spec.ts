import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { newPasswordChecks } from './password-checks.ts';

const check = (value: Record<string, string>) => newPasswordChecks({ value });

describe('newPasswordChecks', () => {
  it('should pass a new password typed the same twice', () => {
    assert.equal(check({ password: 'hickory-bench-42', repeat: 'hickory-bench-42' }), null);
  });

  it('should find two new passwords that differ', () => {
    assert.deepEqual(check({ password: 'hickory-bench-42', repeat: 'hickory-bench-43' }), {
      mismatch: true,
    });
  });

  it('should leave a repeat not yet typed to its own required check', () => {
    assert.equal(check({ password: 'hickory-bench-42', repeat: '' }), null);
  });

  it('should find a new password that is the current one, when the form has a current one', () => {
    assert.deepEqual(check({ current: 'same-old-pw', password: 'same-old-pw', repeat: '' }), {
      unchanged: true,
    });
    assert.deepEqual(
      check({ current: 'same-old-pw', password: 'same-old-pw', repeat: 'same-old-px' }),
      { mismatch: true, unchanged: true },
    );
    assert.equal(check({ current: '', password: '', repeat: '' }), null);
  });
});
