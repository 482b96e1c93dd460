import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { BUN } from '../helpers/batch-calls.ts';
import { startTestServer, type TestServer } from '../helpers/test-server.ts';

/** Records a burst at once from one server; the answers in order. */
function burst(server: TestServer, count: number) {
  const tobin = server.as('tobin');
  return Promise.all(Array.from({ length: count }, () => tobin.post('/api/batches', BUN)));
}

describe('two servers recording on one database', () => {
  it('should give every batch of a burst from each its own lot code, numbered without a gap', async (t) => {
    const first = await startTestServer(t);
    const { databaseUrl, databaseFile } = first.context.config;
    // The second server keeps its records where the first does: the same PostgreSQL database
    // (npm run test:pg), or the same SQLite file.
    const second = await startTestServer(
      t,
      databaseUrl ? { LARDER_DB_URL: databaseUrl } : { LARDER_DB: databaseFile },
    );
    const answers = (await Promise.all([burst(first, 12), burst(second, 12)])).flat();
    for (const answer of answers) assert.equal(answer.status, 201, answer.text);
    const lots = answers.map((answer) => answer.json.batch.lotCode as string);
    assert.equal(new Set(lots).size, 24, `lot codes given twice: ${lots.sort().join(' ')}`);
    // One prefix (the buns' start day), and the 24 sequence numbers one run without a hole.
    const prefixes = new Set(lots.map((lot) => lot.replace(/\d+$/, '')));
    assert.equal(prefixes.size, 1);
    const numbers = lots.map((lot) => Number(/\d+$/.exec(lot)?.[0])).sort((a, b) => a - b);
    assert.equal(numbers.at(-1)! - numbers[0], 23, `a gap in ${numbers.join(' ')}`);
  });
});
