import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import { describe, it } from 'node:test';
import { pdfText } from '../helpers/pdf-text.ts';
import { collectConsoleErrors, startConsole } from './browser.ts';

describe('the HACCP report in the console', () => {
  it('should let an admin pick a period and download the PDF, which names a batch of it', async (t) => {
    const session = await startConsole(t);
    // A batch of the demo kitchen started today: the report of today names it.
    const today = new Date().toISOString().slice(0, 10);
    const recorded = await session.server.as('tobin').post('/api/batches', {
      formula: 'quillmoor-belly',
      batch: { meat: '4.26kg', thickness: '4cm', start: today },
    });
    assert.equal(recorded.status, 201, recorded.text);
    const lot = recorded.json.batch.lotCode as string;
    const page = await session.page('rosa');
    const errors = collectConsoleErrors(page);
    await page.getByRole('link', { name: 'HACCP report' }).click();
    await page.waitForURL(/\/reports$/);
    await page.getByTestId('report-from').fill(today);
    await page.getByTestId('report-to').fill(today);
    await session.screenshot(page, 'haccp-report');
    // The date boxes read a day typed as YYYY-MM-DD.
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByTestId('report-pdf').click(),
    ]);
    const bytes = readFileSync(await download.path());
    assert.equal(bytes.subarray(0, 4).toString(), '%PDF');
    const { all } = await pdfText(bytes);
    assert.ok(all.includes(`LOT ${lot}`), all.slice(0, 500));
    assert.deepEqual(errors, []);
  });
});
