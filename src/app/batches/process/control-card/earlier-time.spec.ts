import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { earlierTime } from './earlier-time.ts';

describe('earlierTime', () => {
  it('should take a time already past as today and one still to come as yesterday', () => {
    const now = new Date(2026, 2, 2, 0, 30);
    assert.deepEqual(earlierTime('00:10', now), new Date(2026, 2, 2, 0, 10));
    assert.deepEqual(earlierTime('23:50', now), new Date(2026, 2, 1, 23, 50));
  });

  it('should not read a time that is no time of day', () => {
    assert.equal(earlierTime('25:00', new Date()), null);
    assert.equal(earlierTime('noon', new Date()), null);
  });
});
