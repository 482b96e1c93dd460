import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { QueryTypes } from 'sequelize';
import type { RecallReport, TraceAnswer } from '../../shared/api/trace-record.ts';
import { parseCsv } from '../helpers/csv.ts';
import { pdfText } from '../helpers/pdf-text.ts';
import { PASSWORDS, clockFrom, startTestServer, type TestServer } from '../helpers/test-server.ts';
import { insertSmokehouseLots } from '../helpers/trace-fixture.ts';

// The kitchen drawn in tests/helpers/trace-fixture.ts: Hollin Farm's lot HF-4471 came in twice
// (R201201-91, R201203-91) and went into both smoked bellies, the sliced bacon made from them and
// the burger assembly made from that, planned for service on 8 Dec 2020.

/** A server whose today is 7 Dec 2020, the day before the burger's service, with the drawn lots. */
async function kitchen(t: Parameters<typeof startTestServer>[0]): Promise<TestServer> {
  // A fixed day years before the demo's, which is seeded around the real today: none of this
  // test's lot codes can meet one of the demo's.
  const server = await startTestServer(t, {}, { now: clockFrom('2020-12-07') });
  await insertSmokehouseLots(server.context.db);
  return server;
}

async function fetchFile(server: TestServer, route: string) {
  const auth = Buffer.from(`tobin:${PASSWORDS.tobin}`).toString('base64');
  const response = await fetch(server.url + route, { headers: { authorization: `Basic ${auth}` } });
  return {
    status: response.status,
    type: response.headers.get('content-type'),
    disposition: response.headers.get('content-disposition') ?? '',
    bytes: new Uint8Array(await response.arrayBuffer()),
  };
}

const HOLLIN = '/api/trace/recall?supplierLot=HF-4471&supplier=Hollin%20Farm';

describe('trace and recall over the API', () => {
  it('should trace a batch back and a received lot forward for a cook', async (t) => {
    const server = await kitchen(t);
    const back = await server.as('tobin').get('/api/trace/back/201205-sl-01');
    assert.equal(back.status, 200, back.text);
    const answer = back.json as TraceAnswer;
    assert.equal(answer.direction, 'back');
    assert.deepEqual(
      answer.roots[0].children.map((c) => c.lot.lotCode),
      ['201201-SB-01', '201203-SB-02'],
    );
    const forward = await server.as('tobin').get('/api/trace/forward/R201205-91');
    assert.equal(forward.status, 200, forward.text);
    assert.deepEqual(
      (forward.json as TraceAnswer).roots[0].children.map((c) => [
        c.lot.lotCode,
        c.use?.amount,
        c.use?.measure,
      ]),
      [['201206-BA-01', '120', 'each']],
    );
    const bySupplier = await server.as('imke').get('/api/trace/forward?supplierLot=TR-302');
    assert.equal((bySupplier.json as TraceAnswer).batches, 2, 'the grind and the burger');
  });

  it('should give the recall report of a supplier lot with every batch, totals and what is on hand', async (t) => {
    const server = await kitchen(t);
    const response = await server.as('tobin').get(HOLLIN);
    assert.equal(response.status, 200, response.text);
    const report = response.json as RecallReport;
    assert.equal(report.kitchen, 'Quillmoor Smokehouse');
    assert.equal(report.producedBy, 'Tobin Marrowfeld (cook)');
    assert.deepEqual(
      report.recalled.map((l) => l.lotCode),
      ['R201201-91', 'R201203-91'],
    );
    // Nearest first, then by start day: as drawn.
    assert.deepEqual(
      report.batches.map((b) => [
        b.level,
        b.lotCode,
        b.status,
        b.uses.map((u) => `${u.from} ${u.amount}`).join(' + '),
      ]),
      [
        [1, '201201-SB-01', 'done', 'R201201-91 6000'],
        [1, '201203-SB-02', 'curing', 'R201201-91 4000 + R201203-91 2000'],
        [2, '201205-SL-01', 'done', '201201-SB-01 5000 + 201203-SB-02 3000'],
        [3, '201206-BA-01', 'planned', '201205-SL-01 1200'],
      ],
    );
    // Received 12 000 g + 2000 g; used straight from them 6000 + 4000 + 2000 g.
    assert.deepEqual(report.totals.received, [{ amount: '14000', measure: 'g' }]);
    assert.deepEqual(report.totals.used, [{ amount: '12000', measure: 'g' }]);
    assert.deepEqual(report.totals.byStatus, { done: 2, curing: 1, planned: 1 });
    // 2000 g of the first delivery is left; the curing belly and the burger for 8 Dec are still here.
    assert.deepEqual(report.onHand, {
      lots: [{ lotCode: 'R201201-91', remaining: '2000', measure: 'g' }],
      batches: ['201203-SB-02', '201206-BA-01'],
    });
    assert.match(report.caution, /recall plan/);
    const [audit] = await server.context.db.sequelize.query<{
      actor_name: string;
      subject: string;
    }>("SELECT actor_name, subject FROM audit_events WHERE action = 'recall-produce'", {
      type: QueryTypes.SELECT,
    });
    assert.deepEqual(audit, {
      actor_name: 'tobin',
      subject: 'supplier lot HF-4471 from Hollin Farm',
    });
  });

  it('should write the recall report as a PDF a person can read and as CSV', async (t) => {
    const server = await kitchen(t);
    const pdf = await fetchFile(server, HOLLIN.replace('/recall?', '/recall.pdf?'));
    assert.equal(pdf.status, 200);
    assert.equal(pdf.type, 'application/pdf');
    assert.match(pdf.disposition, /recall-supplier-lot-hf-4471-from-hollin-farm\.pdf/);
    const { all, title } = await pdfText(pdf.bytes);
    assert.equal(title, 'Recall report, Quillmoor Smokehouse');
    for (const words of [
      'Recall: supplier lot HF-4471 from Hollin Farm',
      'produced by',
      '201206-BA-01',
      'service 8 Dec 2020',
      'R201201-91: 4000 g on 3 Dec 2020',
      'Received lot R201201-91: 2000 g left',
      "kitchen's own recall plan",
    ])
      assert.ok(all.includes(words), `${words} in ${all}`);
    const csv = await fetchFile(server, HOLLIN.replace('/recall?', '/recall.csv?'));
    assert.equal(csv.type, 'text/csv; charset=utf-8');
    const rows = parseCsv(Buffer.from(csv.bytes).toString('utf8'));
    assert.equal(rows[0][0], 'record');
    const batchRows = rows.filter((row) => row[0] === 'batch');
    assert.equal(batchRows.length, 6, 'one record per use: 1 + 2 + 2 + 1');
    assert.deepEqual(
      batchRows.find((row) => row[2] === '201206-BA-01'),
      [
        'batch',
        '3',
        '201206-BA-01',
        'Burger assembly',
        '',
        '',
        '',
        'planned',
        '2020-12-06',
        '2020-12-06',
        '2020-12-08',
        '201205-SL-01',
        '1200',
        'g',
        '2020-12-06',
        '',
        'yes',
      ],
    );
  });

  it('should answer a lot nobody has with 404 and a search that names nothing or both with 400', async (t) => {
    const server = await kitchen(t);
    const cook = server.as('tobin');
    assert.equal((await cook.get('/api/trace/back/R991231-01')).status, 404);
    assert.equal((await cook.get('/api/trace/recall?supplierLot=9999')).status, 404);
    assert.equal((await cook.get('/api/trace/recall')).status, 400);
    assert.equal(
      (await cook.get('/api/trace/recall?lot=R201201-91&supplierLot=HF-4471')).status,
      400,
    );
    assert.equal((await cook.get('/api/trace/recall?lot=R201201-91&color=red')).status, 400);
  });
});
