import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { QueryTypes } from 'sequelize';
import { addDays } from '../../shared/index.ts';
import { BELLY } from '../helpers/api-calls.ts';
import { recordBatch } from '../helpers/batch-calls.ts';
import { parseCsv } from '../helpers/csv.ts';
import { pdfText } from '../helpers/pdf-text.ts';
import { addReadings, addRow, idOf } from '../helpers/process-rows.ts';
import { PASSWORDS, startTestServer, type TestServer } from '../helpers/test-server.ts';

const TODAY = BELLY.batch.start;
/** Local midnight of today, as the report's period counts days in the kitchen's time zone. */
const LOCAL_MIDNIGHT = new Date(
  Number(TODAY.slice(0, 4)),
  Number(TODAY.slice(5, 7)) - 1,
  Number(TODAY.slice(8, 10)),
).getTime();
const localAt = (minute: number): string =>
  new Date(LOCAL_MIDNIGHT + minute * 60_000).toISOString();

const CAUSE = 'Blast chiller door left open, "about 20 min", by the morning shift';

/** A batch with a logger's day, a hand reading and its correction, a closed deviation, a release. */
async function withRecords(server: TestServer): Promise<string> {
  const lot = await recordBatch(server.as('tobin'), BELLY);
  const batchId = await idOf(server, 'batches', lot);
  const tobin = await idOf(server, 'people', 'tobin');
  const imke = await idOf(server, 'people', 'imke');
  await addReadings(
    server,
    Array.from({ length: 1440 }, (_, minute) => ({
      batchId,
      control: 'chill',
      at: localAt(minute),
      value: minute === 300 ? '1.5' : '3.2',
      source: 'logger' as const,
    })),
  );
  const [hand] = await addReadings(server, [
    { batchId, control: 'smoker', at: localAt(600), value: '71', source: 'console', by: tobin },
  ]);
  await addReadings(server, [
    {
      batchId,
      control: 'smoker',
      at: localAt(600),
      value: '71.5',
      enteredAs: '160.7 °F',
      source: 'command',
      by: tobin,
      corrects: hand,
      reason: 'read the wrong probe',
    },
  ]);
  const deviation = await addRow(server, 'deviations', {
    batch_id: batchId,
    control: 'chill',
    kind: 'deadline',
    what: 'Chilling: not 26.7 °C by 15:02',
    opened_at: localAt(902),
    dedupe_key: `batch ${batchId}/chill/stage-1`,
  });
  await addRow(server, 'corrective_actions', {
    deviation_id: deviation,
    cause: CAUSE,
    restored: 'Door closed; chiller back to -2 °C',
    prevention: 'Door alarm fitted',
    disposition: 'rechilled',
    disposition_grams: '4100',
    recorded_by: tobin,
    recorded_at: localAt(930),
  });
  await addRow(server, 'verifications', {
    batch_id: batchId,
    note: 'Records reviewed',
    recorded_by: imke,
    recorded_at: localAt(1000),
  });
  await addRow(server, 'refusals', {
    at: localAt(500),
    person_id: tobin,
    formula_id: 'quillmoor-belly',
    inputs: JSON.stringify({ meat: '4kg', cure: '40g' }),
    failed: JSON.stringify([{ sentence: 'Ingoing nitrite 250 ppm is over the 200 ppm ceiling.' }]),
  });
  const walkIn = await addRow(server, 'equipment', {
    name: 'Test walk-in',
    kind: 'cooler',
    control: 'cold-holding',
    created_at: localAt(0),
  });
  await addReadings(server, [
    {
      equipmentId: walkIn,
      control: 'log',
      at: localAt(480),
      value: '3.5',
      source: 'console',
      by: tobin,
    },
  ]);
  await addRow(server, 'calibrations', {
    equipment_id: walkIn,
    checked_at: localAt(470),
    reading: '0.2',
    outcome: 'ok',
    note: 'Ice point',
    recorded_by: imke,
    recorded_at: localAt(470),
  });
  return lot;
}

async function fetchRaw(server: TestServer, user: 'rosa' | 'tobin' | 'imke', route: string) {
  const auth = Buffer.from(`${user}:${PASSWORDS[user]}`).toString('base64');
  const response = await fetch(server.url + route, { headers: { authorization: `Basic ${auth}` } });
  return {
    status: response.status,
    type: response.headers.get('content-type'),
    disposition: response.headers.get('content-disposition'),
    bytes: new Uint8Array(await response.arrayBuffer()),
  };
}

describe('the HACCP records report', () => {
  it('should give a reviewer the PDF naming the kitchen, the period, the batch and its records', async (t) => {
    const server = await startTestServer(t);
    const lot = await withRecords(server);
    const pdf = await fetchRaw(server, 'imke', `/api/reports/haccp.pdf?from=${TODAY}&to=${TODAY}`);
    assert.equal(pdf.status, 200);
    assert.equal(pdf.type, 'application/pdf');
    assert.match(pdf.disposition ?? '', new RegExp(`haccp-records-${TODAY}-to-${TODAY}\\.pdf`));
    assert.equal(Buffer.from(pdf.bytes.slice(0, 5)).toString(), '%PDF-');
    const { all, pages } = await pdfText(pdf.bytes);
    assert.match(all, /Quillmoor Smokehouse/);
    assert.match(all, /produced by Imke Tressaly \(food safety\)/);
    // Headings are set in capitals.
    assert.ok(all.includes(`LOT ${lot}`), all.slice(0, 3000));
    assert.match(all, /Logger: 1,440 readings/);
    assert.match(all, /corrects entry \d+: read the wrong probe/);
    assert.match(all, /Chilling: not 26\.7 °C by 15:02/);
    assert.ok(all.includes(`Cause: ${CAUSE}`));
    assert.match(all, /Verified and released by Imke Tressaly/);
    assert.match(all, /Ingoing nitrite 250 ppm is over the 200 ppm ceiling\./);
    assert.match(all, /Test walk-in \(cooler\)/);
    assert.match(pages[0], new RegExp(`page 1 of ${pages.length}`));
    // The footer names the period in the same words as the page, never as YYYY-MM-DD.
    assert.match(
      pages[0],
      /HACCP records \d{1,2} [A-Z][a-z]{2} \d{4} to \d{1,2} [A-Z][a-z]{2} \d{4}/,
    );
    assert.doesNotMatch(all, /\d{4}-\d{2}-\d{2}/);
  });

  it('should give the CSV one record per entry with its type, fields quoted as RFC 4180 says', async (t) => {
    const server = await startTestServer(t);
    const lot = await withRecords(server);
    const csv = await fetchRaw(server, 'rosa', `/api/reports/haccp.csv?from=${TODAY}&to=${TODAY}`);
    assert.equal(csv.status, 200);
    assert.equal(csv.type, 'text/csv; charset=utf-8');
    const [header, ...rows] = parseCsv(new TextDecoder().decode(csv.bytes));
    const column = (name: string): number => header.indexOf(name);
    const ours = rows.filter((r) => r[column('lot_code')] === lot);
    const types = ours.map((r) => r[column('type')]);
    assert.deepEqual([...new Set(types)].sort(), [
      'batch',
      'control',
      'corrective-action',
      'deviation',
      'logger-summary',
      'reading',
      'verification',
    ]);
    const summary = ours.find((r) => r[column('type')] === 'logger-summary');
    assert.deepEqual(
      ['count', 'min', 'max'].map((c) => summary?.[column(c)]),
      ['1440', '1.5', '3.2'],
    );
    // Both hand entries stay: the corrected one names its correction, the correction its reason.
    assert.equal(types.filter((type) => type === 'reading').length, 2);
    const action = ours.find((r) => r[column('type')] === 'corrective-action');
    assert.equal(action?.[column('cause')], CAUSE);
    assert.deepEqual(
      rows
        .filter((r) => r[0] === 'refusal' || r[column('equipment')] === 'Test walk-in')
        .map((r) => r[0]),
      ['refusal', 'equipment-reading', 'calibration'],
    );
    assert.equal(rows[0][column('type')], 'report');
  });

  it('should give the PDF of more than 200 batches, every page numbered "of" the whole', async (t) => {
    const server = await startTestServer(t);
    const first = await recordBatch(server.as('tobin'), BELLY);
    const firstId = await idOf(server, 'batches', first);
    // 249 more copies of it written straight into the table, as a busy month has them, each
    // with a hand reading: through the API, 250 batches would take most of a minute.
    const columns = `formula_id, formula_revision, formula_title, kind, status, operator_id, started_on,
      ready_on, recorded_at, updated_at, units, inputs, result, checks_passed, nitrite_ppm, notes, planned_by`;
    const lots = [first];
    for (let i = 2; i <= 250; i++) {
      const lot = `${first}-${String(i).padStart(3, '0')}`;
      await server.context.db.sequelize.query(
        `INSERT INTO batches (lot_code, ${columns}) SELECT ?, ${columns} FROM batches WHERE id = ?`,
        { replacements: [lot, firstId], type: QueryTypes.INSERT },
      );
      lots.push(lot);
    }
    const ids = await server.context.db.sequelize.query<{ id: number }>(
      'SELECT id FROM batches ORDER BY id',
      { type: QueryTypes.SELECT },
    );
    await addReadings(
      server,
      ids.map(({ id }, i) => ({
        batchId: id,
        control: 'smoker',
        at: localAt(600 + i),
        value: '71',
        source: 'console' as const,
      })),
    );
    const pdf = await fetchRaw(server, 'imke', `/api/reports/haccp.pdf?from=${TODAY}&to=${TODAY}`);
    assert.equal(pdf.status, 200);
    const { all, pages } = await pdfText(pdf.bytes);
    assert.ok(pages.length > 1, `${pages.length} pages`);
    // The demo kitchen's own batches come with the test server: ours are 250 of them.
    const count = Number(/(\d+) batch\(es\)/.exec(pages[0])?.[1]);
    assert.ok(count >= 250, `${count} batches`);
    // Headings are set in capitals.
    assert.ok(all.includes(`LOT ${first} `), all.slice(0, 2000));
    assert.ok(all.includes(`LOT ${lots[249]}`), all.slice(-3000));
    pages.forEach((page, i) => assert.match(page, new RegExp(`page ${i + 1} of ${pages.length}`)));
    pages.forEach((page) => assert.match(page, /Quillmoor Smokehouse/));
  });

  it('should leave out a batch outside the period and refuse a period that is not one', async (t) => {
    const server = await startTestServer(t);
    const lot = await withRecords(server);
    const yesterday = addDays(TODAY, -1);
    const report = await server
      .as('imke')
      .get(`/api/reports/haccp?from=${yesterday}&to=${yesterday}`);
    assert.equal(report.status, 200, report.text);
    assert.ok(!report.json.batches.some((b: { lotCode: string }) => b.lotCode === lot));
    const backwards = await server
      .as('imke')
      .get(`/api/reports/haccp.pdf?from=${TODAY}&to=${yesterday}`);
    assert.equal(backwards.status, 400);
    assert.equal(backwards.json.error.code, 'bad-period');
    const notADay = await server.as('imke').get('/api/reports/haccp.csv?from=2026-02-30');
    assert.equal(notADay.status, 400);
  });

  it('should be produced by admins and reviewers only, each time written in the audit log', async (t) => {
    const server = await startTestServer(t);
    await withRecords(server);
    const cook = await server.as('tobin').get(`/api/reports/haccp.pdf?from=${TODAY}&to=${TODAY}`);
    assert.equal(cook.status, 403);
    assert.equal((await server.as('rosa').get('/api/reports/haccp')).status, 200);
    const audited = await server.context.db.sequelize.query<{ actor_name: string; detail: string }>(
      "SELECT actor_name, detail FROM audit_events WHERE action = 'report-produce' ORDER BY id",
      { type: QueryTypes.SELECT },
    );
    assert.deepEqual(
      audited.map((a) => [a.actor_name, JSON.parse(a.detail).format]),
      [['rosa', 'json']],
    );
  });
});
