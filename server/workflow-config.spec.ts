import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { ConfigError, loadConfig } from './config.ts';

describe('the workflow settings', () => {
  it('should keep every rule on when nothing is set', () => {
    assert.deepEqual(loadConfig({}).workflow, {
      separateSignOff: true,
      lockSignedOff: true,
      cureBeforeDone: true,
    });
  });

  it('should turn each rule off on its own', () => {
    const workflow = (name: string, value: string) => loadConfig({ [name]: value }).workflow;
    assert.equal(workflow('LARDER_SEPARATE_SIGN_OFF', 'off').separateSignOff, false);
    assert.equal(workflow('LARDER_SEPARATE_SIGN_OFF', 'off').lockSignedOff, true);
    assert.equal(workflow('LARDER_LOCK_SIGNED_OFF', 'off').lockSignedOff, false);
    assert.equal(workflow('LARDER_CURE_BEFORE_DONE', 'off').cureBeforeDone, false);
    assert.equal(workflow('LARDER_CURE_BEFORE_DONE', 'on').cureBeforeDone, true);
    assert.equal(workflow('LARDER_CURE_BEFORE_DONE', '').cureBeforeDone, true);
  });

  it('should refuse to start on anything but on or off, naming the setting', () => {
    for (const value of ['no', 'false', '0', 'OFF', ' off'])
      assert.throws(
        () => loadConfig({ LARDER_LOCK_SIGNED_OFF: value }),
        (error: unknown) =>
          error instanceof ConfigError &&
          error.message === `LARDER_LOCK_SIGNED_OFF must be on or off, not "${value}"`,
        value,
      );
  });
});
