import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { TraceAnswer, TraceNode } from '../../shared/api/trace-record.ts';
import { clockFrom, startTestServer, type ApiClient } from '../helpers/test-server.ts';

// Three levels, every record made through the product's own routes, the way a cook makes them:
//
//   pack 201203-BP-01 (Sliced bacon, 200 g pack, 20 packs)
//   └── belly 201203-QB-01 (Quillmoor belly), 4 000 g of it
//       ├── R… pork belly, Fenwick Hollow Pork lot FH-TRACE-1, 4 000 g
//       └── R… curing salt, Tallis & Crane lot TC-TRACE-2, 10 g
//
// and forward from the belly's supplier lot: FH-TRACE-1 → the belly → the pack.

// A fixed day years before the demo's, which is seeded around the real today: none of this
// test's lot codes can meet one of the demo's.
const TODAY = '2020-12-03';

/** A delivery received at the door; its lot code. */
async function receive(
  cook: ApiClient,
  body: Record<string, string>,
): Promise<{ lot: string; supplierLot: string }> {
  const answer = await cook.post('/api/receipts', body);
  assert.equal(answer.status, 201, answer.text);
  return { lot: answer.json.receipt.lotCode, supplierLot: body.supplierLot };
}

/** A batch recorded; its lot code. */
async function record(cook: ApiClient, body: object): Promise<string> {
  const answer = await cook.post('/api/batches', body);
  assert.equal(answer.status, 201, answer.text);
  return answer.json.batch.lotCode;
}

/** The lots a batch was made from, picked by the cook. */
async function madeFrom(cook: ApiClient, lot: string, picks: object[]): Promise<void> {
  const answer = await cook.post(`/api/batches/${lot}/lots`, { picks });
  assert.equal(answer.status, 201, answer.text);
}

/** A tree as [lot code, use amount, children] for comparing with the drawing. */
type Drawn = [string, string | undefined, Drawn[]];
const drawn = (node: TraceNode): Drawn => [
  node.lot.lotCode,
  node.use?.amount,
  node.children.map(drawn),
];

describe('a sliced bacon pack traced through three levels', () => {
  it('should trace the pack back to the belly lot and the cure, and the belly lot forward to the pack', async (t) => {
    const server = await startTestServer(t, {}, { now: clockFrom(TODAY) });
    const tobin = server.as('tobin');
    const bellies = await receive(tobin, {
      item: 'pork-belly',
      supplier: 'Fenwick Hollow Pork',
      supplierLot: 'FH-TRACE-1',
      establishment: 'EST. 38214',
      quantity: '10',
      unit: 'kg',
      // source: FDA Food Code 2022, §3-202.11(A): 5 °C (41 °F) or below; 3 °C is within it
      temperature: '3 °C',
    });
    const cure = await receive(tobin, {
      item: 'curing-salt-1',
      supplier: 'Tallis & Crane Provisions',
      supplierLot: 'TC-TRACE-2',
      quantity: '1',
      unit: 'kg',
    });
    const belly = await record(tobin, {
      formula: 'quillmoor-belly',
      batch: { meat: '4 kg', thickness: '4 cm' },
    });
    await madeFrom(tobin, belly, [
      { item: 'pork-belly', lot: bellies.lot, amount: '4 kg' },
      { item: 'curing-salt-1', lot: cure.lot, amount: '10 g' },
    ]);
    const pack = await record(tobin, { formula: 'bacon-pack', batch: { count: '20' } });
    // 20 packs × 8 slices × 25 g = 4 000 g of the sliced belly.
    await madeFrom(tobin, pack, [{ part: 'quillmoor-belly', batch: belly, amount: '4 kg' }]);

    const back = await tobin.get(`/api/trace/back/${pack}`);
    assert.equal(back.status, 200, back.text);
    const answer = back.json as TraceAnswer;
    assert.deepEqual(answer.roots.map(drawn), [
      [
        '201203-BP-01',
        undefined,
        [
          [
            '201203-QB-01',
            '4000',
            [
              [bellies.lot, '4000', []],
              [cure.lot, '10', []],
            ],
          ],
        ],
      ],
    ]);
    assert.equal(answer.incomplete, false);
    const belliesNode = answer.roots[0].children[0].children[0];
    assert.equal(belliesNode.level, 2);
    assert.deepEqual(
      belliesNode.lot.kind === 'receipt' && [belliesNode.lot.supplier, belliesNode.lot.supplierLot],
      ['Fenwick Hollow Pork', 'FH-TRACE-1'],
    );

    const forward = await tobin.get('/api/trace/forward?supplierLot=FH-TRACE-1');
    assert.equal(forward.status, 200, forward.text);
    assert.deepEqual((forward.json as TraceAnswer).roots.map(drawn), [
      [bellies.lot, undefined, [['201203-QB-01', '4000', [['201203-BP-01', '4000', []]]]]],
    ]);
    const recall = await server.as('imke').get('/api/trace/recall?supplierLot=FH-TRACE-1');
    assert.equal(recall.status, 200, recall.text);
    assert.deepEqual(
      recall.json.batches.map((b: { lotCode: string; level: number }) => [b.lotCode, b.level]),
      [
        ['201203-QB-01', 1],
        ['201203-BP-01', 2],
      ],
    );
  });

  it('should reach the day of service from a plan: the packs are recorded for it', async (t) => {
    const server = await startTestServer(t, {}, { now: clockFrom(TODAY) });
    const tobin = server.as('tobin');
    const service = '2020-12-20';
    const plan = await tobin.post('/api/plans/record', {
      assembly: 'bacon-pack',
      count: 40,
      for: service,
    });
    assert.equal(plan.status, 201, plan.text);
    const lots = plan.json.batches.map((b: { formula: { id: string }; lotCode: string }) => [
      b.formula.id,
      b.lotCode,
    ]);
    // The belly, 8 days' hold at 4 cm and 2 lead days before the 20th; the packs on the day.
    assert.deepEqual(lots, [
      ['quillmoor-belly', '201210-QB-01'],
      ['bacon-pack', '201220-BP-01'],
    ]);
    const bellies = await receive(tobin, {
      item: 'pork-belly',
      supplier: 'Fenwick Hollow Pork',
      supplierLot: 'FH-TRACE-3',
      establishment: 'EST. 38214',
      quantity: '12',
      unit: 'kg',
      // source: FDA Food Code 2022, §3-202.11(A): 5 °C (41 °F) or below; 2 °C is within it
      temperature: '2 °C',
    });
    const started = await tobin.post('/api/batches/201210-QB-01/start', {
      batch: { meat: '10.6 kg', thickness: '4 cm' },
    });
    assert.equal(started.status, 200, started.text);
    await madeFrom(tobin, '201210-QB-01', [
      { item: 'pork-belly', lot: bellies.lot, amount: '10.6 kg' },
    ]);
    const packed = await tobin.post('/api/batches/201220-BP-01/start', {
      batch: { count: '40', start: service },
    });
    assert.equal(packed.status, 200, packed.text);
    // 40 packs × 8 slices × 25 g = 8 000 g of the sliced belly.
    await madeFrom(tobin, '201220-BP-01', [
      { part: 'quillmoor-belly', batch: '201210-QB-01', amount: '8 kg' },
    ]);
    const forward = await tobin.get('/api/trace/forward?supplierLot=FH-TRACE-3');
    const [root] = (forward.json as TraceAnswer).roots;
    const [belly] = root.children;
    const [packs] = belly.children;
    assert.deepEqual(
      [packs.lot.lotCode, packs.lot.kind === 'batch' && packs.lot.serviceDay],
      ['201220-BP-01', service],
    );
  });
});
