import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { QueryTypes } from 'sequelize';
import { clockFrom, startTestServer, type TestServer } from '../helpers/test-server.ts';

// A fixed day years before the demo's, which is seeded around the real today: none of this
// test's lot codes can meet one of the demo's.
const CLOCK = clockFrom('2020-12-03');

/** A burger-grind batch started on a day, moved to a status; its lot code. */
async function grind(server: TestServer, start: string, to?: string): Promise<string> {
  const tobin = server.as('tobin');
  const response = await tobin.post('/api/batches', {
    formula: 'chuck-grind',
    batch: { want: '5 kg', start },
  });
  assert.equal(response.status, 201, response.text);
  const lot = response.json.batch.lotCode as string;
  if (to) {
    const moved = await tobin.post(`/api/batches/${lot}/status`, {
      to,
      reason: 'grinder plate cracked',
    });
    assert.equal(moved.status, 200, moved.text);
  }
  return lot;
}

describe('an assembly drawing on batches', () => {
  it('should suggest the finished grind batch first and record the burgers as made from it', async (t) => {
    const server = await startTestServer(t, {}, { now: CLOCK });
    const { db } = server.context;
    const underWay = await grind(server, '2020-12-01');
    const done = await grind(server, '2020-12-02', 'done');
    const thrown = await grind(server, '2020-11-30', 'discarded');
    const tobin = server.as('tobin');
    // Ten burgers, recorded as any batch is: made today.
    const recorded = await tobin.post('/api/batches', {
      formula: 'smokehouse-burger',
      batch: { count: '10' },
    });
    assert.equal(recorded.status, 201, recorded.text);
    const burgers = recorded.json.batch.lotCode as string;
    assert.equal(burgers, '201203-SB-01');
    const read = await tobin.get(`/api/batches/${burgers}/lots`);
    assert.equal(read.status, 200, read.text);
    const part = read.json.suggested.find((s: { item: string }) => s.item === 'chuck-grind');
    assert.equal(part.source, 'batch');
    // done before under way (the demo's own grind batches among them); the discarded batch is
    // never offered
    const offered: string[] = part.onHand.map((b: { lotCode: string }) => b.lotCode);
    assert.ok(offered.indexOf(done) >= 0 && offered.indexOf(done) < offered.indexOf(underWay));
    assert.ok(!offered.includes(thrown));
    // 10 burgers × 2 portions × 4 oz (113.3980925 g; source: NIST Handbook 44 (2024), Appendix C,
    // avoirdupois ounce = 28.349523125 g) = 2 267.96185 g, all from the first batch offered.
    assert.equal(part.need, '2267.96185');
    assert.deepEqual(
      part.takes.map((take: { lotCode: string; amount: string }) => [take.lotCode, take.amount]),
      [[offered[0], '2267.96185']],
    );
    const discarded = await tobin.post(`/api/batches/${burgers}/lots`, {
      picks: [{ part: 'chuck-grind', batch: thrown, amount: '2 kg' }],
    });
    assert.equal(discarded.status, 422, discarded.text);
    assert.equal(discarded.json.error.code, 'discarded-source');
    const itself = await tobin.post(`/api/batches/${burgers}/lots`, {
      picks: [{ part: 'smokehouse-burger', batch: burgers, amount: '2 kg' }],
    });
    assert.equal(itself.json.error.code, 'not-a-part');
    const made = await tobin.post(`/api/batches/${burgers}/lots`, {
      picks: [{ part: 'chuck-grind', batch: done, amount: '2.27 kg' }],
    });
    assert.equal(made.status, 201, made.text);
    assert.deepEqual(
      made.json.uses.map((u: { lotCode: string; amount: string; itemName: string }) => [
        u.lotCode,
        u.amount,
        u.itemName,
      ]),
      [[done, '2270', 'Smokehouse burger grind 80/20']],
    );
    // The burgers' own use (the demo's packs and burgers have theirs too).
    const [row] = await db.sequelize.query<{ source: string; receipt_id: number | null }>(
      `SELECT s.lot_code AS source, u.receipt_id FROM lot_uses u
       JOIN batches s ON s.id = u.source_batch_id
       JOIN batches b ON b.id = u.batch_id WHERE b.lot_code = ?`,
      { replacements: [burgers], type: QueryTypes.SELECT },
    );
    assert.deepEqual(row, { source: done, receipt_id: null });
    // A grind recorded (wrongly, by hand) as made from these burgers would close a loop.
    await db.sequelize.query(
      `INSERT INTO lot_uses (batch_id, source_batch_id, item, amount, used_on)
       SELECT g.id, b.id, 'smokehouse-burger', '1', '2020-12-03'
       FROM batches g, batches b WHERE g.lot_code = ? AND b.lot_code = ?`,
      { replacements: [underWay, burgers] },
    );
    const loop = await tobin.post(`/api/batches/${burgers}/lots`, {
      replace: true,
      picks: [{ part: 'chuck-grind', batch: underWay, amount: '1 kg' }],
    });
    assert.equal(loop.status, 422, loop.text);
    assert.equal(loop.json.error.code, 'cycle');
  });
});
