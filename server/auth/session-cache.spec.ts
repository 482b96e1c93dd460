import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { SessionCache } from './session-cache.ts';

/** A cache over a fake database whose mark and rows the test sets, counting its reads. */
function setUp() {
  const database = { mark: 'one' as string | undefined, rows: new Map<string, { role: string }>() };
  let reads = 0;
  const cache = new SessionCache(
    () => database.mark,
    async (sid) => {
      reads++;
      const row = database.rows.get(sid);
      return row && { ...row };
    },
  );
  return { database, cache, reads: () => reads };
}

describe('sessions kept while nothing is committed', () => {
  it('should read once, then answer from what it kept until the mark changes', async () => {
    const { database, cache, reads } = setUp();
    database.rows.set('a', { role: 'cook' });
    assert.deepEqual(await cache.read('a'), { role: 'cook' });
    assert.deepEqual(cache.read('a'), { role: 'cook' }, 'kept: answered at once');
    assert.equal(reads(), 1);

    database.rows.set('a', { role: 'reviewer' });
    database.mark = 'two';
    assert.deepEqual(await cache.read('a'), { role: 'reviewer' }, 'a commit: read again');
    assert.equal(reads(), 2);
  });

  it('should keep a session not found too, until the mark changes', async () => {
    const { database, cache, reads } = setUp();
    assert.equal(await cache.read('gone'), undefined);
    assert.equal(cache.read('gone'), undefined);
    assert.equal(reads(), 1);
    database.rows.set('gone', { role: 'cook' });
    database.mark = 'two';
    assert.deepEqual(await cache.read('gone'), { role: 'cook' });
  });

  it('should not keep a read that began before a newer mark was seen', async () => {
    const { database, cache, reads } = setUp();
    database.rows.set('a', { role: 'cook' });
    const pending = cache.read('a');
    // A commit lands while that read is under way, and another request sees the new mark.
    database.mark = 'two';
    await cache.read('b');
    await pending;
    assert.ok(cache.read('a') instanceof Promise, 'read again, not kept from before the commit');
    assert.equal(reads(), 3);
  });

  it('should keep nothing when the database gives no mark', async () => {
    const { database, cache, reads } = setUp();
    database.mark = undefined;
    database.rows.set('a', { role: 'cook' });
    await cache.read('a');
    assert.ok(cache.read('a') instanceof Promise);
    await cache.read('a');
    assert.equal(reads(), 3);
    assert.equal(cache.size, 0);
  });

  it('should freeze what it keeps, so no route can change it for the next request', async () => {
    const { database, cache } = setUp();
    database.rows.set('a', { role: 'cook' });
    const row = (await cache.read('a')) as { role: string };
    assert.throws(() => {
      row.role = 'admin';
    }, TypeError);
  });
});
