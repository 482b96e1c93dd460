import assert from 'node:assert/strict';
import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { QueryTypes } from 'sequelize';
import { Decimal } from '../../shared/decimal.ts';
import { clockFrom, startTestServer, type TestServer } from '../helpers/test-server.ts';

// The server's today: the batches below are planned for the next days.
const SERVER_CLOCK = clockFrom('2024-03-01');

const CURING_SALT = 'curing salt no. 1 (6.25 % nitrite)';

/** A batch recorded as planned by the cook, Tobin; its lot code. */
async function planned(server: TestServer, formula: string, batch: object): Promise<string> {
  const response = await server
    .as('tobin')
    .post('/api/batches', { formula, batch, status: 'planned' });
  assert.equal(response.status, 201, response.text);
  return response.json.batch.lotCode as string;
}

/** The grams of a line of a batch's sheet. */
function lineGrams(
  batch: { result: { groups: { lines: { name: string; grams: string }[] }[] } },
  name: string,
): string {
  const line = batch.result.groups.flatMap((g) => g.lines).find((l) => l.name === name);
  assert.ok(line, `no line ${name}`);
  return line.grams;
}

async function rows<T extends object>(
  server: TestServer,
  sql: string,
  values: unknown[] = [],
): Promise<T[]> {
  return server.context.db.sequelize.query<T>(sql, {
    replacements: values,
    type: QueryTypes.SELECT,
  });
}

describe('starting a planned batch on what is really there', () => {
  it('should calculate the batch again on the green weight really there, keeping the plan, who planned it and who started it', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    const lot = await planned(server, 'quillmoor-belly', {
      meat: '4.26 kg',
      thickness: '4 cm',
      start: '2024-03-02',
    });
    const plan = (await server.as('rosa').get(`/api/batches/${lot}`)).json.batch;
    // source: FSIS Directive 7620.3, Processing Inspectors' Calculations Handbook, ch. 3 (dry
    // cure: each ingredient is a percentage of green weight): 4260 g × 0.25 % = 10.65 g
    assert.equal(lineGrams(plan, CURING_SALT), '10.65');

    const response = await server.as('rosa').post(`/api/batches/${lot}/start`, {
      batch: { meat: '5.112 kg', thickness: '4 cm', start: '2024-03-02' },
    });
    assert.equal(response.status, 200, response.text);
    const { batch, warnings } = response.json;
    assert.deepEqual(warnings, []);
    assert.equal(batch.lotCode, lot);
    assert.equal(batch.status, 'in-progress');
    // source: the same dry-cure arithmetic, 5112 g × 0.25 % = 12.78 g: the planned 10.65 g × 1.2,
    // the ratio of the green weights (5112 / 4260 = 1.2)
    assert.equal(lineGrams(batch, CURING_SALT), '12.78');
    assert.equal(
      new Decimal(lineGrams(batch, CURING_SALT)).div(lineGrams(plan, CURING_SALT)).toString(),
      new Decimal('5112').div('4260').toString(),
    );
    // source: 9 CFR 424.21(c) "¼ oz to 100 lb" is 156.25 ppm, whatever the green weight
    assert.equal(batch.nitritePpm, '156.25');
    assert.equal(batch.inputs.meat, '5.112 kg');

    const [stored] = await rows<{
      planned_by: number;
      started_by: number;
      started_at: string;
      planned_calculation: string;
      operator_id: number;
    }>(
      server,
      'SELECT planned_by, started_by, started_at, planned_calculation, operator_id FROM batches WHERE lot_code = ?',
      [lot],
    );
    const [tobin] = await rows<{ id: number }>(
      server,
      "SELECT id FROM people WHERE username = 'tobin'",
    );
    const [rosa] = await rows<{ id: number }>(
      server,
      "SELECT id FROM people WHERE username = 'rosa'",
    );
    assert.equal(stored.planned_by, tobin.id);
    assert.equal(stored.started_by, rosa.id);
    assert.equal(stored.operator_id, tobin.id);
    assert.ok(stored.started_at);
    const kept = JSON.parse(stored.planned_calculation);
    assert.equal(kept.inputs.meat, '4.26 kg');
    assert.equal(lineGrams(kept, CURING_SALT), '10.65');

    const events = (await server.as('imke').get(`/api/batches/${lot}`)).json.batch.events;
    assert.deepEqual(
      events.map((e: { type: string; from: string | null; to: string }) => [e.type, e.from, e.to]),
      [
        ['recorded', null, 'planned'],
        ['status', 'planned', 'in-progress'],
      ],
    );
    assert.match(events[1].reason, /meat 4\.26 kg → 5\.112 kg/);
    const record = (await server.as('imke').get(`/api/batches/${lot}/process`)).json;
    assert.equal(record.plannedBy.displayName, 'Tobin Marrowfeld (cook)');
    assert.equal(record.startedBy.id, rosa.id);
    assert.equal(record.planned.inputs.meat, '4.26 kg');
    assert.equal(record.planned.nitritePpm, '156.25');
    const audit = await server.as('rosa').get('/api/audit?action=batch-start');
    assert.equal(audit.json.events.length, 1);
    assert.equal(audit.json.events[0].subject, lot);
  });

  it('should warn when a batch starts on another day than planned, and move its ready day', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    const lot = await planned(server, 'quillmoor-belly', {
      meat: '4.26 kg',
      thickness: '4 cm',
      start: '2024-03-02',
    });
    const response = await server.as('tobin').post(`/api/batches/${lot}/start`, {
      batch: { meat: '4.26 kg', thickness: '4 cm', start: '2024-03-04' },
    });
    assert.equal(response.status, 200, response.text);
    // The formula's own hold rule: 2 days per cm × 4 cm = 8 days after 2024-03-04.
    assert.equal(response.json.batch.readyOn, '2024-03-12');
    assert.equal(response.json.batch.startedOn, '2024-03-04');
    assert.deepEqual(response.json.warnings, [
      'Started on 4 Mar 2024, 2 days later than planned (2 Mar 2024). It is now ready on 12 Mar 2024.',
    ]);
  });

  it('should start on the revision it was planned with, telling the cook when the formula has changed since', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    const lot = await planned(server, 'quillmoor-belly', { meat: '4.26 kg', thickness: '4 cm' });
    const plannedRevision = (await server.as('tobin').get(`/api/batches/${lot}`)).json.batch.formula
      .revision;
    // The curing salt raised from 0.25 % to 0.3 % in the file after the plan.
    const file = path.join(server.formulasDir, 'quillmoor-belly.yaml');
    writeFileSync(file, readFileSync(file, 'utf8').replace('pct: 0.25,', 'pct: 0.3,'));
    server.context.formulas.changed();
    const response = await server.as('tobin').post(`/api/batches/${lot}/start`, {
      batch: { meat: '4.26 kg', thickness: '4 cm' },
    });
    assert.equal(response.status, 200, response.text);
    assert.equal(response.json.batch.formula.revision, plannedRevision);
    // source: 9 CFR 424.21(c), ¼ oz per 100 lb: 0.25 % of a 6.25 % curing salt is 156.25 ppm
    // (the planned revision), where 0.3 % would be 187.5 ppm
    assert.equal(response.json.batch.nitritePpm, '156.25');
    assert.match(response.json.warnings[0], /formula has changed since this batch was planned/);
  });

  it('should start only a planned batch', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    const lot = await planned(server, 'quillmoor-belly', { meat: '4 kg', thickness: '4 cm' });
    const start = { batch: { meat: '4 kg', thickness: '4 cm' } };
    assert.equal((await server.as('tobin').post(`/api/batches/${lot}/start`, start)).status, 200);
    const again = await server.as('tobin').post(`/api/batches/${lot}/start`, start);
    assert.equal(again.status, 409, again.text);
    assert.equal(again.json.error.code, 'not-planned');
  });

  it('should refuse a start over a critical limit, record the refusal and leave the batch planned', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    const lot = await planned(server, 'maple-pump-belly', { meat: '5 kg', start: '2024-03-02' });
    // 5 kg pumped to 5.6 kg is a 12 % pump: 0.192 % × 6.25 % × 10^6 × 12/10 = 144 ppm, over the
    // 120 ppm ceiling for pumped bacon. source: 9 CFR 424.22(b); FSIS Directive 7620.3 ch. 3
    // (pumped formula)
    const response = await server.as('tobin').post(`/api/batches/${lot}/start`, {
      batch: { meat: '5 kg', pumpedWeight: '5.6 kg', start: '2024-03-02' },
    });
    assert.equal(response.status, 422, response.text);
    assert.equal(response.json.error.code, 'critical-limit');
    const batch = (await server.as('tobin').get(`/api/batches/${lot}`)).json.batch;
    assert.equal(batch.status, 'planned');
    assert.equal(batch.inputs.pumpedWeight, undefined);

    const listed = await server.as('imke').get('/api/refusals?from=2024-03-01&to=2024-03-01');
    assert.equal(listed.status, 200, listed.text);
    assert.equal(listed.json.refusals.length, 1);
    const [refusal] = listed.json.refusals;
    assert.equal(refusal.lotCode, lot);
    assert.equal(refusal.formula, 'maple-pump-belly');
    assert.equal(refusal.by.displayName, 'Tobin Marrowfeld (cook)');
    assert.equal(refusal.inputs.pumpedWeight, '5.6 kg');
    assert.equal(refusal.failed.length, 1);
    assert.match(
      refusal.failed[0],
      /critical limit exceeded: .*144\.0 ppm is over the 120 ppm limit/,
    );
    const audit = await server.as('rosa').get('/api/audit?action=calculation-refused');
    assert.equal(audit.json.events.length, 1);
    assert.equal(audit.json.events[0].subject, lot);
  });
});

describe('refused calculations', () => {
  it('should keep a refused record as a refusal, the answer still 422, and list it by day', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    // source: 9 CFR 424.22(b), 120 ppm for pumped bacon; 5 kg pumped to 5.6 kg is 144 ppm
    // (FSIS Directive 7620.3 ch. 3, pumped formula, 12 % pump)
    const response = await server.as('tobin').post('/api/batches', {
      formula: 'maple-pump-belly',
      batch: { meat: '5kg', pumpedWeight: '5.6kg' },
    });
    assert.equal(response.status, 422, response.text);
    const listed = await server.as('rosa').get('/api/refusals?from=2024-03-01');
    assert.equal(listed.json.refusals.length, 1);
    assert.equal(listed.json.refusals[0].lotCode, null);
    assert.match(listed.json.refusals[0].revision, /^[0-9a-f]{64}$/);
    assert.equal(listed.json.refusals[0].inputs.start, '2024-03-01');
    const before = await server.as('rosa').get('/api/refusals?to=2024-02-29');
    assert.equal(before.json.refusals.length, 0);
    const bad = await server.as('rosa').get('/api/refusals?from=yesterday');
    assert.equal(bad.status, 400, bad.text);
  });
});
