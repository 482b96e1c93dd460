import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { QueryTypes } from 'sequelize';
import { Decimal } from '../../shared/decimal.ts';
import { clockFrom, startTestServer, type TestServer } from '../helpers/test-server.ts';

// The server's today near the fixed start days below (a start lies within a year of today).
const SERVER_CLOCK = clockFrom('2024-03-01');

const CURING_SALT = 'curing salt no. 1 (6.25 % nitrite)';

/** A batch recorded by the cook, under way; its lot code. */
async function recorded(server: TestServer, formula: string, batch: object): Promise<string> {
  const response = await server.as('tobin').post('/api/batches', { formula, batch });
  assert.equal(response.status, 201, response.text);
  return response.json.batch.lotCode as string;
}

async function deviationsOf(
  server: TestServer,
  lot: string,
): Promise<{ kind: string; what: string }[]> {
  return server.context.db.sequelize.query(
    `SELECT d.kind, d.what FROM deviations d JOIN batches b ON b.id = d.batch_id
     WHERE b.lot_code = ? ORDER BY d.id`,
    { replacements: [lot], type: QueryTypes.SELECT },
  );
}

describe('weights as weighed', () => {
  it('should open a nitrite deviation when the curing salt weighed pushes a dry cure over its limit', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    const lot = await recorded(server, 'quillmoor-belly', {
      meat: '4.26 kg',
      thickness: '4 cm',
      start: '2024-02-29',
    });
    const response = await server.as('tobin').post(`/api/batches/${lot}/weighings`, {
      lines: [
        { name: 'fine sea salt', weight: '95.9 g' },
        { name: CURING_SALT, weight: '14.2 g' },
      ],
    });
    assert.equal(response.status, 201, response.text);
    // source: FSIS Directive 7620.3, Processing Inspectors' Calculations Handbook, ch. 3, the
    // dry-cure formula: ppm = nitrite × 1 000 000 / green weight; 14.2 g × 6.25 % = 0.8875 g of
    // sodium nitrite on 4260 g is 208.33 ppm, over the 200 ppm for dry-cured bacon, 9 CFR 424.22(b)
    assert.equal(
      response.json.actualNitritePpm,
      new Decimal('14.2').times('0.0625').times('1000000').div('4260').toString(),
    );
    assert.equal(response.json.deviation.kind, 'nitrite');
    assert.match(response.json.deviation.what, /208\.3 ppm is over 200 ppm/);
    assert.match(
      response.json.messages[0],
      /208\.3 ppm is over 200 ppm .*held until a corrective action/,
    );
    assert.deepEqual(
      response.json.weighings.map((w: { name: string; plannedGrams: string; grams: string }) => [
        w.name,
        w.plannedGrams,
        w.grams,
      ]),
      [
        // source: the same dry-cure formula, 4260 g × 2.25 % = 95.85 g and × 0.25 % = 10.65 g
        ['fine sea salt', '95.85', '95.9'],
        [CURING_SALT, '10.65', '14.2'],
      ],
    );
    assert.deepEqual(
      (await deviationsOf(server, lot)).map((d) => d.kind),
      ['nitrite'],
    );
    const audit = await server.as('rosa').get('/api/audit?action=weighing-add');
    assert.equal(audit.json.events[0].subject, lot);
    const record = await server.as('imke').get(`/api/batches/${lot}/process`);
    assert.equal(record.status, 200, record.text);
    assert.equal(record.json.actualNitritePpm, response.json.actualNitritePpm);
    assert.equal(record.json.weighings.length, 2);
    assert.equal(record.json.onHold, true);
  });

  it("should open a deviation when an under-pumped belly falls below the cured cooling option's nitrite", async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    const lot = await recorded(server, 'maple-pump-belly', { meat: '5 kg', start: '2024-02-29' });
    await server
      .as('tobin')
      .post(`/api/batches/${lot}/weighings`, { stage: { name: 'green', weight: '5 kg' } });
    const pumped = await server
      .as('tobin')
      .post(`/api/batches/${lot}/weighings`, { stage: { name: 'pumped', weight: '5.4 kg' } });
    assert.equal(pumped.status, 201, pumped.text);
    // 120 ppm at the formula's 10 % pump, × 8/10 at an 8 % pump = 96 ppm (FSIS Directive 7620.3
    // ch. 3, pumped formula), under the 100 ppm ingoing sodium nitrite the cured-product cooling
    // option of FSIS Appendix B relies on (1999 Appendix B, cured products)
    assert.equal(pumped.json.actualNitritePpm, '96');
    const words = pumped.json.deviations.map((d: { what: string }) => d.what) as string[];
    // The erythorbate falls short with it: 550 ppm at 10 % × 8/10 = 440 ppm, under the 550 ppm
    // pumped bacon requires (9 CFR 424.22(b))
    assert.equal(words.length, 2);
    assert.match(words[0], /erythorbate 440\.0 ppm is under the 550 ppm/);
    assert.match(
      words[1],
      /at least 100 ppm ingoing sodium nitrite; the weights as weighed give 96\.0 ppm/,
    );
  });

  it('should record a pumped weight over its target as a pump deviation, keeping the batch', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    const lot = await recorded(server, 'maple-pump-belly', { meat: '5 kg', start: '2024-02-29' });
    const green = await server
      .as('tobin')
      .post(`/api/batches/${lot}/weighings`, { stage: { name: 'green', weight: '5 kg' } });
    assert.equal(green.status, 201, green.text);
    const pumped = await server
      .as('tobin')
      .post(`/api/batches/${lot}/weighings`, { stage: { name: 'pumped', weight: '5.56 kg' } });
    assert.equal(pumped.status, 201, pumped.text);
    // Percent pump = (pumped − green) ÷ green × 100 (from memory: the standard trade definition,
    // as FSIS Directive 7620.3 ch. 3 uses it): (5560 − 5000) ÷ 5000 = 11.2 %, over the formula's
    // 10 % target (5500 g)
    const pump = pumped.json.deviations.find((d: { kind: string }) => d.kind === 'pump');
    assert.equal(pump.what, 'Pumped to 11.2 %, target 10 %: drain and re-weigh, or divert.');
    assert.equal(pumped.json.weighings[0].grams, '5560');
    // The pick-up carries the brine's nitrite in: 0.192 % × 6.25 % × 10^6 = 120 ppm at the 10 %
    // pump, × 11.2/10 = 134.4 ppm, over the 120 ppm for pumped bacon. source: FSIS Directive
    // 7620.3 ch. 3 (pumped formula); 9 CFR 424.22(b)
    assert.equal(pumped.json.actualNitritePpm, '134.4');
    assert.deepEqual(
      pumped.json.deviations.map((d: { kind: string }) => d.kind),
      ['nitrite', 'pump'],
    );
    const batch = await server.as('tobin').get(`/api/batches/${lot}`);
    assert.equal(batch.json.batch.status, 'in-progress');
    // Weighing on after it judges the batch again; the pump's deviation stays one.
    const cured = await server
      .as('tobin')
      .post(`/api/batches/${lot}/weighings`, { stage: { name: 'cured', weight: '5.4 kg' } });
    assert.equal(cured.status, 201, cured.text);
    assert.deepEqual(cured.json.deviations, []);
    assert.match(cured.json.messages[1], /^Pumped to 11\.2 %.*already open/);
    const record = await server.as('imke').get(`/api/batches/${lot}/process`);
    assert.deepEqual(
      record.json.actualYields.map(
        (y: { stage: string; from: string; percent: string; planned: string }) => [
          y.stage,
          y.from,
          y.percent,
          y.planned,
        ],
      ),
      [
        // source: yield = weight after ÷ weight before × 100, USDA ARS, USDA Table of Cooking
        // Yields for Meat and Poultry (2012/2014): 5560 ÷ 5000 = 111.2 % against 100 % + the 10 %
        // pump; 5400 ÷ 5000 = 108 % against the formula's cure yield of 108 %
        ['pumped', 'green', '111.2', '110'],
        ['cured', 'green', '108', '108'],
      ],
    );
    assert.deepEqual(
      (await deviationsOf(server, lot)).map((d) => d.kind),
      ['nitrite', 'pump'],
    );
  });

  it('should keep the original weighing when it is corrected', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    const lot = await recorded(server, 'maple-pump-belly', { meat: '5 kg', start: '2024-02-29' });
    const first = await server
      .as('tobin')
      .post(`/api/batches/${lot}/weighings`, { stage: { name: 'green', weight: '5.2 kg' } });
    const id = first.json.weighings[0].id as number;
    const again = await server
      .as('tobin')
      .post(`/api/batches/${lot}/weighings`, { stage: { name: 'green', weight: '5 kg' } });
    assert.equal(again.status, 409, again.text);
    assert.equal(again.json.error.code, 'already-weighed');
    const corrected = await server.as('imke').post(`/api/weighings/${id}/correction`, {
      weight: '5 kg',
      reason: 'Tare left off the tray.',
    });
    assert.equal(corrected.status, 201, corrected.text);
    const [correction] = corrected.json.weighings;
    assert.equal(correction.corrects, id);
    assert.equal(correction.grams, '5000');
    assert.equal(correction.reason, 'Tare left off the tray.');
    const stored = await server.context.db.sequelize.query<{
      id: number;
      grams: string;
      corrects_id: number | null;
    }>(
      `SELECT w.id, w.grams, w.corrects_id FROM weighings w JOIN batches b ON b.id = w.batch_id
       WHERE b.lot_code = ? ORDER BY w.id`,
      { replacements: [lot], type: QueryTypes.SELECT },
    );
    assert.deepEqual(
      stored.map((w) => [w.grams, w.corrects_id]),
      [
        ['5200', null],
        ['5000', id],
      ],
    );
    const twice = await server
      .as('imke')
      .post(`/api/weighings/${id}/correction`, { weight: '5.1 kg', reason: 'Again.' });
    assert.equal(twice.status, 409, twice.text);
    assert.equal(twice.json.error.code, 'already-corrected');
    const record = await server.as('imke').get(`/api/batches/${lot}/process`);
    assert.deepEqual(
      record.json.weighings.map((w: { id: number; correctedBy: number | null }) => [
        w.id,
        w.correctedBy,
      ]),
      [
        [id, correction.id],
        [correction.id, null],
      ],
    );
  });

  it('should refuse a line not on the sheet and a stage the formula has not, naming the field', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    const lot = await recorded(server, 'quillmoor-belly', {
      meat: '4.26 kg',
      thickness: '4 cm',
      start: '2024-02-29',
    });
    const line = await server
      .as('tobin')
      .post(`/api/batches/${lot}/weighings`, { lines: [{ name: 'maple sugar', weight: '50 g' }] });
    assert.equal(line.status, 422, line.text);
    assert.equal(line.json.error.details[0].field, 'lines.0.name');
    // A dry cure is rubbed on, never injected: it has no pumped weight.
    const stage = await server
      .as('tobin')
      .post(`/api/batches/${lot}/weighings`, { stage: { name: 'pumped', weight: '5 kg' } });
    assert.equal(stage.status, 422, stage.text);
    assert.equal(stage.json.error.details[0].field, 'stage.name');
    const weight = await server
      .as('tobin')
      .post(`/api/batches/${lot}/weighings`, { stage: { name: 'green', weight: '4.2' } });
    assert.equal(weight.status, 422, weight.text);
    assert.equal(weight.json.error.details[0].field, 'stage.weight');
    const count = await server.context.db.sequelize.query<{ n: number }>(
      'SELECT COUNT(*) AS n FROM weighings w JOIN batches b ON b.id = w.batch_id WHERE b.lot_code = ?',
      { replacements: [lot], type: QueryTypes.SELECT },
    );
    assert.equal(count[0].n, 0);
  });

  it('should refuse weighing a planned batch until it is started', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    const response = await server.as('tobin').post('/api/batches', {
      formula: 'quillmoor-belly',
      batch: { meat: '4 kg', thickness: '4 cm', start: '2024-03-03' },
      status: 'planned',
    });
    const lot = response.json.batch.lotCode as string;
    const weighed = await server
      .as('tobin')
      .post(`/api/batches/${lot}/weighings`, { stage: { name: 'green', weight: '4 kg' } });
    assert.equal(weighed.status, 409, weighed.text);
    assert.equal(weighed.json.error.code, 'not-started');
  });
});
