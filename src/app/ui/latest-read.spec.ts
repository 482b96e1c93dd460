import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { ApiError } from '../core/api/api-error.ts';
import { LatestRead } from './latest-read.ts';

/** A read whose answers the test hands out by hand, in any order. */
function byHand() {
  const waiting = new Map<string, { resolve: (v: string) => void; reject: (e: unknown) => void }>();
  const read = (key: string) =>
    new Promise<string>((resolve, reject) => void waiting.set(key, { resolve, reject }));
  return { read, answer: (key: string) => waiting.get(key)! };
}

describe('LatestRead', () => {
  it('should show the answer to the latest ask, never an earlier one that arrives after it', async () => {
    const { read, answer } = byHand();
    const latest = new LatestRead(read);
    const first = latest.load('261201-QB-01');
    const second = latest.load('261203-QB-01');
    answer('261203-QB-01').resolve('the cost of 261203-QB-01');
    await second;
    answer('261201-QB-01').resolve('the cost of 261201-QB-01');
    await first;
    assert.equal(latest.value(), 'the cost of 261203-QB-01');
    assert.equal(latest.loading(), false);
  });

  it('should forget the value shown while the next is read, and say why a read failed', async () => {
    const { read, answer } = byHand();
    const latest = new LatestRead(read);
    const first = latest.load('a');
    answer('a').resolve('A');
    await first;
    const again = latest.load('b');
    assert.equal(latest.value(), null);
    assert.equal(latest.loading(), true);
    answer('b').reject(new ApiError(404, 'not-found', 'no batch 261203-ZZ-99', []));
    await again;
    assert.equal(latest.error(), 'no batch 261203-ZZ-99');
    assert.equal(latest.loading(), false);
  });

  it('should read the last key again on Try again', async () => {
    const asked: string[] = [];
    const latest = new LatestRead(async (key: string) => {
      asked.push(key);
      return key;
    });
    await latest.load('b');
    latest.retry();
    assert.deepEqual(asked, ['b', 'b']);
  });
});
