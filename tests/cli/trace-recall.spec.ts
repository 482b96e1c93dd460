import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import type { RecallReport } from '../../shared/api/trace-record.ts';
import { parseCsv } from '../helpers/csv.ts';
import { pdfText } from '../helpers/pdf-text.ts';
import { assertCleanFailure, assertExit, runLarder, stdoutJson } from '../helpers/run-larder.ts';
import { makeTempDir } from '../helpers/temp-files.ts';
import { PASSWORDS, startTestServer, type TestServer } from '../helpers/test-server.ts';
import { insertSmokehouseLots } from '../helpers/trace-fixture.ts';

// The kitchen drawn in tests/helpers/trace-fixture.ts, read by the command on the server and on
// the server's own database file.

function as(server: TestServer, where: 'server' | 'local') {
  return {
    LARDER_USER: 'tobin',
    LARDER_PASSWORD: PASSWORDS.tobin,
    ...(where === 'server'
      ? { LARDER_SERVER: server.url }
      : { LARDER_DATA: path.join(server.dir, 'data'), LARDER_SERVER: undefined }),
  };
}

async function kitchen(t: Parameters<typeof startTestServer>[0]): Promise<TestServer> {
  const server = await startTestServer(t);
  await insertSmokehouseLots(server.context.db);
  return server;
}

describe('larder trace and larder recall', () => {
  for (const where of ['server', 'local'] as const) {
    it(`should draw a lot's tree back and forward, on the ${where === 'server' ? "server's records" : "machine's own records"}`, async (t) => {
      const server = await kitchen(t);
      const run = await runLarder(['trace', '201205-sl-01'], { env: as(server, where) });
      assertExit(run, 0);
      const lines = run.stdout.split('\n');
      const back = lines.slice(lines.indexOf('Made from:') + 1, lines.indexOf('Made from:') + 9);
      // As drawn: the sliced bacon from two smoked bellies, each from its belly and salt lots.
      assert.deepEqual(
        back.map((line) => line.replace(/ · .*$/, '')),
        [
          'Sliced bacon 201205-SL-01',
          '├─ Smoked belly 201201-SB-01: 5000 g on 5 Dec 2020',
          '│  ├─ Pork belly R201201-91: 6000 g on 1 Dec 2020',
          '│  └─ Curing salt R201201-92: 15.0 g on 1 Dec 2020',
          '└─ Smoked belly 201203-SB-02: 3000 g on 5 Dec 2020',
          '   ├─ Pork belly R201201-91: 4000 g on 3 Dec 2020',
          '   ├─ Pork belly R201203-91: 2000 g on 3 Dec 2020',
          '   └─ Curing salt R201201-92: 15.0 g on 3 Dec 2020',
        ],
      );
      assert.match(
        run.stdout,
        /Went into:\nSliced bacon 201205-SL-01 · done.*\n└─ Burger assembly 201206-BA-01: 1200 g on 6 Dec 2020 · planned · .* · for service 8 Dec 2020/,
      );
      assert.match(
        run.stdout,
        /Pork belly R201201-91: 6000 g on 1 Dec 2020 · Hollin Farm lot HF-4471 · est\. M1234/,
      );
    });
  }

  it('should print the recall of a supplier lot, and write its PDF and CSV', async (t) => {
    const server = await kitchen(t);
    const env = as(server, 'server');
    const json = await runLarder(['recall', '--supplier-lot', 'HF-4471', '--json'], { env });
    assertExit(json, 0);
    assert.deepEqual(
      stdoutJson<RecallReport>(json).batches.map((b) => b.lotCode),
      ['201201-SB-01', '201203-SB-02', '201205-SL-01', '201206-BA-01'],
    );
    const summary = await runLarder(
      ['recall', '--supplier-lot', 'HF-4471', '--supplier', 'Hollin Farm'],
      { env },
    );
    assertExit(summary, 0);
    assert.match(
      summary.stdout,
      /Recall of supplier lot HF-4471 from Hollin Farm, Quillmoor Smokehouse: produced by Tobin/,
    );
    assert.match(
      summary.stdout,
      /4 affected batch\(es\)\. Received 14.000 kg; used straight from the recalled lots 12.000 kg\./,
    );
    assert.match(summary.stdout, /Still on hand: R201201-91 \(2000 g left\), 201203-SB-02/);
    const dir = makeTempDir(t);
    const pdf = path.join(dir, 'recall.pdf');
    assertExit(
      await runLarder(['recall', '--lot', 'R201202-92', '--pdf', pdf], {
        env: as(server, 'local'),
      }),
      0,
    );
    const { all } = await pdfText(readFileSync(pdf));
    assert.ok(all.includes('Recall: lot R201202-92'), all);
    assert.ok(all.includes('201206-BA-01'), all);
    const csv = path.join(dir, 'recall.csv');
    assertExit(await runLarder(['recall', '--lot', 'R201202-92', '--csv', csv], { env }), 0);
    const rows = parseCsv(readFileSync(csv, 'utf8'));
    assert.deepEqual(
      rows.slice(1).map((row) => [row[0], row[2]]),
      [
        ['recalled lot', 'R201202-92'],
        ['batch', '201204-BG-01'],
        ['batch', '201206-BA-01'],
      ],
    );
  });

  it('should refuse a search that names nothing, and a lot nobody has, without a stack trace', async (t) => {
    const server = await kitchen(t);
    const env = as(server, 'server');
    assertCleanFailure(await runLarder(['recall'], { env }), 2, /give --supplier-lot/);
    assertCleanFailure(
      await runLarder(['trace', 'R991231-01'], { env }),
      2,
      /no received lot or batch with lot code R991231-01/,
    );
    assertCleanFailure(
      await runLarder(['recall', '--supplier-lot', 'nope'], { env: as(server, 'local') }),
      2,
      /no delivery of supplier lot nope/,
    );
  });
});
