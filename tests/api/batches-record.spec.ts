import assert from 'node:assert/strict';
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import {
  clockFrom,
  startTestServer,
  type ApiClient,
  type TestServer,
} from '../helpers/test-server.ts';

// The server's today near the fixed start days below (a start lies within a year of today).
const SERVER_CLOCK = clockFrom('2024-03-01');

/** How many batches the log holds now (the demo seed included). */
async function batchCount(server: TestServer): Promise<number> {
  const response = await server.as('rosa').get('/api/batches?limit=1');
  assert.equal(response.status, 200, response.text);
  return response.json.total as number;
}

/** How many audit entries of one action there are. */
async function auditCount(server: TestServer, action: string): Promise<number> {
  const response = await server.as('rosa').get(`/api/audit?action=${action}&limit=500`);
  assert.equal(response.status, 200, response.text);
  return (response.json.events as unknown[]).length;
}

const BELLY = {
  formula: 'quillmoor-belly',
  batch: { meat: '4.26kg', thickness: '4cm', start: '2024-02-29' },
} as const;

describe('recording a batch', () => {
  it('should record a cure calculated on the server and read it back by its lot code', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    const response = await server.as('tobin').post('/api/batches', BELLY);
    assert.equal(response.status, 201, response.text);
    const batch = response.json.batch;
    // Start date 2024-02-29, quillmoor-belly → QB, the first of that day.
    assert.equal(batch.lotCode, '240229-QB-01');
    assert.match(batch.lotCode, /^\d{6}-[A-Z]{2,4}-\d{2}$/);
    assert.equal(response.headers.get('location'), '/api/batches/240229-QB-01');
    // source: USDA FSIS Directive 7620.3 ch. 3, dry-cure formula: 0.25 % × 6.25 % × 10^6
    assert.equal(batch.nitritePpm, '156.25');
    const check = batch.result.checks.find((c: { id: string }) => c.id === 'nitrite-max');
    assert.equal(check.exact, '156.25');
    assert.equal(check.status, 'pass');
    assert.equal(batch.checksPassed, true);
    // The formula's own hold rule: 2 days per cm × 4 cm = 8 days after 2024-02-29.
    assert.equal(batch.readyOn, '2024-03-08');
    assert.equal(batch.startedOn, '2024-02-29');
    assert.equal(batch.status, 'in-progress');
    assert.equal(batch.kind, 'cure');
    assert.equal(batch.units, 'metric');
    assert.deepEqual(batch.inputs, BELLY.batch);
    assert.equal(batch.operator.displayName, 'Tobin Marrowfeld (cook)');
    assert.equal(batch.signedOff, null);
    const yaml = readFileSync(path.join(server.formulasDir, 'quillmoor-belly.yaml'), 'utf8');
    assert.deepEqual(batch.formula, {
      id: 'quillmoor-belly',
      revision: createHash('sha256').update(yaml, 'utf8').digest('hex'),
      title: 'Quillmoor belly, dry equilibrium cure',
    });

    const read = await server.as('imke').get('/api/batches/240229-qb-01');
    assert.equal(read.status, 200, read.text);
    assert.equal(read.json.batch.lotCode, '240229-QB-01');
    assert.deepEqual(read.json.batch.result, batch.result);
    assert.equal(read.json.batch.events.length, 1);
    assert.deepEqual(
      { ...read.json.batch.events[0], at: undefined },
      {
        type: 'recorded',
        at: undefined,
        by: batch.operator,
        from: null,
        to: 'in-progress',
        reason: null,
      },
    );
    const audit = await server.as('rosa').get('/api/audit?action=batch-record');
    assert.equal(audit.json.events[0].subject, '240229-QB-01');
    assert.equal(audit.json.events[0].actorName, 'tobin');
  });

  it('should number a second batch of the same formula and day 02, and another formula 01', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    const tobin = server.as('tobin');
    assert.equal((await tobin.post('/api/batches', BELLY)).json.batch.lotCode, '240229-QB-01');
    assert.equal((await tobin.post('/api/batches', BELLY)).json.batch.lotCode, '240229-QB-02');
    const links = await tobin.post('/api/batches', {
      formula: 'hot-link-cure',
      batch: { meat: '12kg', start: '2024-02-29' },
      status: 'planned',
      notes: '  Pork shoulder from the Monday delivery.  ',
    });
    assert.equal(links.status, 201, links.text);
    assert.equal(links.json.batch.lotCode, '240229-HLC-01');
    assert.equal(links.json.batch.status, 'planned');
    assert.equal(links.json.batch.notes, 'Pork shoulder from the Monday delivery.');
  });

  it('should record doughs, blends and mixes without a nitrite figure', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    const bun = await server.as('rosa').post('/api/batches', {
      formula: 'pit-bun',
      batch: { pieces: '48', start: '2024-02-29' },
      units: 'us',
    });
    assert.equal(bun.status, 201, bun.text);
    assert.equal(bun.json.batch.lotCode, '240229-PB-01');
    assert.equal(bun.json.batch.kind, 'dough');
    assert.equal(bun.json.batch.nitritePpm, null);
    assert.equal(bun.json.batch.readyOn, null);
    assert.equal(bun.json.batch.units, 'us');
    assert.equal(bun.json.batch.result.units, 'us');
  });

  it('should record a blend with trimmings on hand and a fat test, as the CLI takes them', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    const grind = await server.as('rosa').post('/api/batches', {
      formula: 'chuck-grind',
      batch: { total: '20 kg', fatTest: 'lean=18, fat=50', start: '2024-02-29' },
      units: 'metric',
    });
    assert.equal(grind.status, 201, grind.text);
    // source: Pearson square (meat-evaluation training material, issuer not identified) with
    // the lean measured at 18 %: 20 kg × 30/32 = 18.75 kg of lean
    const lines = grind.json.batch.result.groups[0].lines;
    assert.equal(lines[0].grams, '18750');
    assert.match(lines[0].name, /18 % fat, measured/);
    const both = await server.as('rosa').post('/api/calc', {
      formula: 'chuck-grind',
      batch: { onHand: 'lean=12 kg, fat=2 kg' },
    });
    // derived from the mass and fat balances: with every trimming fixed, none is left to balance
    assert.equal(both.status, 400, both.text);
    assert.match(both.json.error.message, /every trimming is fixed/);
  });

  it('should refuse a cure over its critical limit with 422 and record nothing', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    const before = await batchCount(server);
    const auditsBefore = await auditCount(server, 'batch-record');
    // 5 kg pumped to 5.6 kg is a 12 % pump: 0.192 % × 6.25 % × 10^6 × 12/10 = 144 ppm, over the
    // 120 ppm ceiling for pumped bacon. source: 9 CFR 424.22(b)
    const response = await server.as('tobin').post('/api/batches', {
      formula: 'maple-pump-belly',
      batch: { meat: '5kg', pumpedWeight: '5.6kg' },
    });
    assert.equal(response.status, 422, response.text);
    assert.equal(response.json.error.code, 'critical-limit');
    assert.match(response.json.error.message, /144\.0 ppm is over the 120 ppm limit/);
    assert.equal(response.json.error.details.length, 1);
    assert.equal(response.json.error.details[0].check, 'nitrite-max');
    assert.equal(response.json.error.details[0].value, '144');
    assert.match(response.json.error.details[0].sentence, /critical limit exceeded/);
    assert.equal(await batchCount(server), before);
    assert.equal(await auditCount(server, 'batch-record'), auditsBefore);
  });

  it('should refuse pumped bacon short of its erythorbate with 422, though no ceiling is exceeded', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    const before = await batchCount(server);
    // 5 kg pumped to 5.47 kg is a 9.4 % pump: the brine's 0.055 % erythorbate (550 ppm at 10 %)
    // gives 550 × 9.4/10 = 517 ppm, short of the 550 ppm pumped bacon must carry.
    // source: 9 CFR 424.22(b); FSIS 7620.3 ch. 3 (pumped formula)
    const response = await server.as('tobin').post('/api/batches', {
      formula: 'maple-pump-belly',
      batch: { meat: '5kg', pumpedWeight: '5.47kg' },
    });
    assert.equal(response.status, 422, response.text);
    assert.equal(response.json.error.code, 'critical-limit');
    assert.equal(response.json.error.details.length, 1);
    assert.equal(response.json.error.details[0].check, 'accelerator-required');
    assert.equal(response.json.error.details[0].value, '517');
    assert.match(response.json.error.details[0].sentence, /critical limit not met/);
    assert.equal(await batchCount(server), before);
  });

  it('should give 20 concurrent records 20 distinct lot codes, all stored', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    const before = await batchCount(server);
    const tobin = await server.signIn('tobin');
    const responses = await Promise.all(
      Array.from({ length: 20 }, (_, i) =>
        tobin.post('/api/batches', {
          formula: 'quillmoor-belly',
          batch: { meat: `${4000 + i * 10} g`, thickness: '4cm', start: '2024-02-29' },
        }),
      ),
    );
    const created = responses.filter((r) => r.status === 201);
    assert.equal(created.length, 20, responses.map((r) => `${r.status} ${r.text}`).join('\n'));
    const lots = created.map((r) => r.json.batch.lotCode as string);
    assert.equal(new Set(lots).size, 20);
    assert.deepEqual(
      [...lots].sort(),
      Array.from({ length: 20 }, (_, i) => `240229-QB-${String(i + 1).padStart(2, '0')}`),
    );
    assert.equal(await batchCount(server), before + created.length);
    const listed = await server.as('imke').get('/api/batches?lot=240229-qb&limit=200');
    assert.equal(listed.json.total, 20);
  });
});

describe('bad requests to record a batch', () => {
  it('should answer every bad body with a 4xx and write nothing', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    const tobin = server.as('tobin');
    const before = await batchCount(server);
    const cases: [string, unknown, number, string, Record<string, string>?][] = [
      ['bad JSON', '{"formula": "quillmoor-belly", "batch": {', 400, 'bad-json'],
      ['no formula', { batch: { meat: '4kg' } }, 400, 'bad-request'],
      ['no batch', { formula: 'quillmoor-belly' }, 400, 'bad-request'],
      [
        'a number for a weight',
        { formula: 'quillmoor-belly', batch: { meat: 4.26 } },
        400,
        'bad-request',
      ],
      ['an array for a body', [BELLY], 400, 'bad-request'],
      ['an unknown field', { ...BELLY, colour: 'red' }, 400, 'bad-request'],
      [
        'an unknown batch option',
        { formula: 'quillmoor-belly', batch: { meats: '4kg' } },
        400,
        'bad-request',
      ],
      // Done is for an assembly alone, made on its day; a cure is recorded before it cures.
      ['a status it cannot start in', { ...BELLY, status: 'done' }, 400, 'bad-status'],
      ['units that do not exist', { ...BELLY, units: 'imperial' }, 400, 'bad-request'],
      ['a formula id that is not one', { ...BELLY, formula: '../etc/passwd' }, 400, 'bad-request'],
      ['a formula that does not exist', { ...BELLY, formula: 'no-such-formula' }, 404, 'not-found'],
      [
        'an option that does not apply',
        { formula: 'house-sauce', batch: { thickness: '4cm', total: '2kg' } },
        400,
        'bad-batch',
      ],
      [
        'a weight without a unit',
        { formula: 'quillmoor-belly', batch: { meat: '4.26' } },
        400,
        'bad-batch',
      ],
      ['a huge body', { ...BELLY, notes: 'x'.repeat(600_000) }, 413, 'too-large'],
      [
        'text, not JSON',
        'formula=quillmoor-belly',
        415,
        'unsupported-media-type',
        { 'content-type': 'text/plain' },
      ],
    ];
    for (const [what, body, status, code, headers] of cases) {
      const response = await tobin.post('/api/batches', body, headers);
      assert.equal(response.status, status, `${what}: ${response.text}`);
      assert.equal(response.json?.error?.code, code, `${what}: ${response.text}`);
      assert.equal(typeof response.json.error.message, 'string');
      assert.ok(Array.isArray(response.json.error.details));
    }
    assert.equal(await batchCount(server), before);
  });
});

describe('who may do what with batches', () => {
  it('should answer 401 to anonymous requests on every batch route', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    const anonymous: ApiClient = server.as('anonymous');
    const lot = (await server.as('tobin').post('/api/batches', BELLY)).json.batch.lotCode as string;
    const attempts = [
      anonymous.get('/api/batches'),
      anonymous.get('/api/batches.csv'),
      anonymous.get(`/api/batches/${lot}`),
      anonymous.post('/api/batches', BELLY),
      anonymous.post(`/api/batches/${lot}/status`, { to: 'done' }),
      anonymous.post(`/api/batches/${lot}/sign-off`, {}),
    ];
    for (const response of await Promise.all(attempts)) {
      assert.equal(response.status, 401, response.text);
      assert.equal(response.json.error.code, 'unauthenticated');
    }
    assert.equal(
      (await server.as('rosa').get(`/api/batches/${lot}`)).json.batch.status,
      'in-progress',
    );
  });

  it('should let every role read, admins and cooks record, and refuse reviewers with 403', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    for (const user of ['rosa', 'tobin', 'imke'] as const) {
      assert.equal((await server.as(user).get('/api/batches')).status, 200, user);
      assert.equal((await server.as(user).get('/api/batches.csv')).status, 200, user);
    }
    assert.equal((await server.as('rosa').post('/api/batches', BELLY)).status, 201);
    const before = await batchCount(server);
    const refused = await server.as('imke').post('/api/batches', BELLY);
    assert.equal(refused.status, 403, refused.text);
    assert.equal(refused.json.error.code, 'forbidden');
    assert.equal(await batchCount(server), before);
  });

  it('should refuse a cookie-signed record without the CSRF token', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    const tobin = await server.signIn('tobin');
    const before = await batchCount(server);
    const forged = await tobin.post('/api/batches', BELLY, { 'x-csrf-token': 'forged' });
    assert.equal(forged.status, 403);
    assert.equal(forged.json.error.code, 'csrf');
    assert.equal(await batchCount(server), before);
  });
});
