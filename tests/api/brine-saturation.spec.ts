import assert from 'node:assert/strict';
import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { addDays } from '../../shared/index.ts';
import { assertErrorEnvelope, batchCounts } from '../helpers/api-calls.ts';
import { startTestServer, type ApiResponse } from '../helpers/test-server.ts';

// The demo brisket brine (formulas/brisket-brine.yaml) on 10 kg with 1 g of water: about 280 g
// of salt in 1 g of water, far past what water can dissolve: 26.395 % salt, 100 °SAL at 60 °F.
// source: "The Salometer and How to Use It", meat-processing equipment manual, section 14
const THIN = { formula: 'brisket-brine', batch: { meat: '10kg', water: '0.001kg' } };
const REFUSAL =
  /^with 1 g of water, the brine would be \d+\.\d % salt: more than water can dissolve \(26\.395 %, 100 °SAL at 60 °F\); use more water$/;

function assertRefusedBrine(response: ApiResponse, what: string): void {
  assertErrorEnvelope(response, what);
  assert.equal(response.status, 400, response.text);
  assert.equal(response.json.error.code, 'bad-batch');
  assert.match(response.json.error.message, REFUSAL);
  assert.deepEqual(response.json.error.details, [{ option: 'water' }]);
}

describe('a brine stronger than water can dissolve', () => {
  it('should be refused by the calculation and by recording, with nothing recorded', async (t) => {
    const server = await startTestServer(t);
    const before = await batchCounts(server);
    assertRefusedBrine(await server.as('tobin').post('/api/calc', THIN), 'calc');
    assertRefusedBrine(await server.as('tobin').post('/api/batches', THIN), 'record');
    const preview = await server
      .as('tobin')
      .post('/api/formulas/brisket-brine/preview', { batch: THIN.batch });
    assertRefusedBrine(preview, 'preview');
    assert.deepEqual(await batchCounts(server), before);

    // Enough water (the formula's own 60 % of the meat) makes a batch.
    const plenty = await server
      .as('tobin')
      .post('/api/calc', { formula: 'brisket-brine', batch: { meat: '10kg', water: '6kg' } });
    assert.equal(plenty.status, 200, plenty.text);
  });

  it('should make a formula whose own water cannot dissolve its salt invalid, and refuse plans that need it', async (t) => {
    const server = await startTestServer(t);
    const file = path.join(server.formulasDir, 'brisket-brine.yaml');
    writeFileSync(file, readFileSync(file, 'utf8').replace('water_pct: 60', 'water_pct: 5'));
    const before = await batchCounts(server);

    const calc = await server
      .as('tobin')
      .post('/api/calc', { formula: 'brisket-brine', batch: { meat: '10kg' } });
    assert.equal(calc.status, 422, calc.text);
    assert.equal(calc.json.error.code, 'invalid-formula');
    assert.ok(
      calc.json.error.details.some((p: { message: string }) =>
        /the brine would be .* more than water can dissolve.*raise water_pct/.test(p.message),
      ),
      calc.text,
    );

    const service = addDays(new Date().toISOString().slice(0, 10), 30);
    const request = { assembly: 'corned-beef-sandwich', count: 20, for: service };
    for (const route of ['/api/plans', '/api/plans/record']) {
      const plan = await server.as('tobin').post(route, request);
      assertErrorEnvelope(plan, route);
      // The assembly's part names a formula whose file has errors: the assembly is invalid too.
      assert.equal(plan.status, 422, plan.text);
      assert.equal(plan.json.error.code, 'invalid-formula');
      assert.ok(
        plan.json.error.details.some((p: { message: string }) =>
          /no formula "brisket-brine" among the formulas \(or its file has errors\)/.test(
            p.message,
          ),
        ),
        plan.text,
      );
    }
    assert.deepEqual(await batchCounts(server), before);
  });
});
