import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { RecallReport, TraceAnswer, TracedReceipt } from '../../shared/api/trace-record.ts';
import { startTestServer } from '../helpers/test-server.ts';

describe("the demo kitchen's packs and burgers", () => {
  it('should trace a demo pack back to its belly batch and the belly’s lot, and recall that lot to the pack', async (t) => {
    const server = await startTestServer(t);
    const tobin = server.as('tobin');
    const packs = await tobin.get('/api/batches?formula=bacon-pack&limit=50');
    assert.ok(packs.json.total > 0, 'the demo has packs of sliced bacon');
    const burgers = await tobin.get('/api/batches?formula=smokehouse-burger&limit=50');
    assert.ok(burgers.json.total > 0, 'the demo has burgers');
    for (const batch of [...packs.json.items, ...burgers.json.items])
      assert.deepEqual([batch.kind, batch.status], ['assembly', 'done'], batch.lotCode);

    // pack ← smoked belly batch ← the belly lot (and the cure's lots beside it): three levels.
    const [pack] = packs.json.items;
    const back = (await tobin.get(`/api/trace/back/${pack.lotCode}`)).json as TraceAnswer;
    const [belly] = back.roots[0].children;
    assert.equal(belly.lot.kind === 'batch' && belly.lot.formula.id, 'quillmoor-belly');
    const received = belly.children.map((node) => node.lot as TracedReceipt);
    const meat = received.find((lot) => lot.item === 'pork-belly');
    assert.ok(meat, 'the belly batch was made from a belly lot');
    assert.ok(
      received.some((lot) => lot.item === 'curing-salt-1'),
      'and from a lot of curing salt',
    );
    assert.equal(belly.children[0].level, 2);

    // The supplier recalls that belly lot: the recall reaches the pack, two levels down.
    const recall = await tobin.get(
      `/api/trace/recall?supplierLot=${encodeURIComponent(meat.supplierLot)}&supplier=${encodeURIComponent(meat.supplier)}`,
    );
    assert.equal(recall.status, 200, recall.text);
    const report = recall.json as RecallReport;
    const found = report.batches.find((b) => b.lotCode === pack.lotCode);
    assert.equal(found?.level, 2);
  });
});
