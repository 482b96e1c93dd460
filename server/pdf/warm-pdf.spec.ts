import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { pdfText } from '../../tests/helpers/pdf-text.ts';
import { renderRecallReportPdf } from './recall-report-pdf.ts';
import { startWarmUp, warmUpReport } from './warm-pdf.ts';

describe('preparing the PDF code when the server starts', () => {
  it('should start the warm-up a while later, not while its caller is still running', async () => {
    let runs = 0;
    const started = performance.now();
    const done = startWarmUp(
      async () => {
        runs++;
      },
      () => assert.fail('nothing to log'),
      50,
    );
    assert.equal(runs, 0, 'the caller (the server starting) is not held up');
    await done;
    assert.equal(runs, 1);
    assert.ok(performance.now() - started >= 45, 'it waited');
  });

  it('should only log a warm-up that fails, never reject', async () => {
    const logged: string[] = [];
    await startWarmUp(
      () => Promise.reject(new Error('no fonts here')),
      (message) => logged.push(message),
      0,
    );
    assert.equal(logged.length, 1);
    assert.match(logged[0], /no fonts here/);
    assert.match(logged[0], /the first PDF will take longer/);
  });

  it('should draw a report of two pages or more, in the Latin and the Latin Extended fonts', async () => {
    const report = warmUpReport();
    assert.equal(report.batches.length, 40);
    const { pages, all } = await pdfText(await renderRecallReportPdf(report));
    assert.ok(pages.length >= 2, `${pages.length} page(s)`);
    // pdf.js reads each font's run apart: "Kie", "ł", "basa".
    assert.match(all, /Kie ?ł ?basa/, 'the Latin Extended letter is drawn, not spelled out');
    assert.ok(all.includes('261208-SL-20'), 'the last batch is in the report');
  });
});
