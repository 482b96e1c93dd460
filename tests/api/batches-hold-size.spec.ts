import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { startTestServer } from '../helpers/test-server.ts';

const TODAY = new Date().toISOString().slice(0, 10);

describe('recording a cure whose hold goes by a size', () => {
  it('should refuse a belly without its thickness, naming the size in words, and record nothing', async (t) => {
    const server = await startTestServer(t);
    const tobin = server.as('tobin');
    const before = (await tobin.get('/api/batches?limit=1')).json.total as number;
    // formulas/quillmoor-belly.yaml holds 2 days per cm, at least 7: a floor under what the
    // thickness gives, not a hold without it (formula.schema.json: "Never fewer days than this").
    const bare = await tobin.post('/api/batches', {
      formula: 'quillmoor-belly',
      batch: { meat: '4.26kg', start: TODAY },
    });
    assert.equal(bare.status, 400, bare.text);
    assert.equal(bare.json.error.code, 'hold-size-needed');
    assert.equal(
      bare.json.error.message,
      "this cure's hold goes by the thickness of the thickest piece: give it, so the batch has a ready date",
    );
    assert.deepEqual(bare.json.error.details, [{ option: 'thickness', field: 'thickness' }]);
    assert.doesNotMatch(bare.json.error.message, /--/);
    assert.equal((await tobin.get('/api/batches?limit=1')).json.total, before);
  });

  it('should refuse a ham without its heaviest piece, and record a planned one without', async (t) => {
    const server = await startTestServer(t);
    const tobin = server.as('tobin');
    // formulas/ham-pump.yaml holds 1 day per kg of the heaviest piece, plus 1, at least 3.
    const ham = {
      formula: 'ham-pump',
      batch: { meat: '6kg', pumpedWeight: '6.7kg', start: TODAY },
    };
    const bare = await tobin.post('/api/batches', ham);
    assert.equal(bare.status, 400, bare.text);
    assert.equal(bare.json.error.details[0].field, 'largestPiece');
    assert.match(bare.json.error.message, /the weight of the heaviest piece/);
    // Planned: the piece is weighed when the batch is started.
    const planned = await tobin.post('/api/batches', { ...ham, status: 'planned' });
    assert.equal(planned.status, 201, planned.text);
    const sized = await tobin.post('/api/batches', {
      ...ham,
      batch: { ...ham.batch, largestPiece: '3kg' },
    });
    assert.equal(sized.status, 201, sized.text);
    // 1 day per kg × 3 kg + 1 = 4 days (the formula's own rule).
    assert.equal(sized.json.batch.result.schedule.days, 4);
  });

  it('should record a cure held for fixed days without any size', async (t) => {
    const server = await startTestServer(t);
    // formulas/maple-pump-belly.yaml holds 2 days, whatever the size.
    const response = await server.as('tobin').post('/api/batches', {
      formula: 'maple-pump-belly',
      batch: { meat: '5kg', pumpedWeight: '5.5kg', start: TODAY },
    });
    assert.equal(response.status, 201, response.text);
    assert.equal(response.json.batch.result.holdNeeds, undefined);
  });
});
