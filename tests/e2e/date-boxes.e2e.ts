import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { Locator } from 'playwright-core';
import {
  collectConsoleErrors,
  dialogSettled,
  startConsole,
  type ConsoleSession,
} from './browser.ts';
import { shoot, shootAtWidths } from './screens.ts';

/** A day ahead of today on this machine, YYYY-MM-DD. */
const inDays = (days: number): string =>
  new Date(Date.now() + days * 86_400_000).toLocaleDateString('en-CA');

/** Types a day into a date box as YYYY-MM-DD and leaves it, as a cook tabbing on would. */
async function typeDay(box: Locator, day: string): Promise<void> {
  await box.fill(day);
  await box.press('Tab');
}

/** Plans a batch of the demo's belly for today, as Rosa; its lot code. */
async function plannedBelly({ server }: ConsoleSession): Promise<string> {
  const planned = await server.as('rosa').post('/api/batches', {
    formula: 'quillmoor-belly',
    batch: { meat: '4.26kg', thickness: '4cm', start: inDays(0) },
    status: 'planned',
  });
  assert.equal(planned.status, 201, planned.text);
  return planned.json.batch.lotCode as string;
}

describe('date boxes in the console', () => {
  it('should show a typed day in words, month first never, and send that day', async (t) => {
    const session = await startConsole(t);
    const { server } = session;
    const page = await session.page('rosa');
    const errors = collectConsoleErrors(page);

    // Deliveries: the pack day reads "2 Mar 2026" in its box, and the delivery records 2 March.
    await page.goto(`${server.url}/deliveries`, { waitUntil: 'networkidle' });
    const form = page.getByTestId('receive-form');
    await form.getByTestId('receive-item').click();
    await page.getByRole('option', { name: 'pork belly', exact: true }).click();
    await form.getByLabel('Supplier', { exact: true }).fill('Date Box Pork');
    await form.getByLabel("Supplier's lot").fill('DB-302');
    await form.getByLabel('Establishment number').fill('EST. 3021');
    const packed = form.getByRole('textbox', { name: 'Packed or killed on' });
    await typeDay(packed, '2026-03-02');
    assert.equal(await packed.inputValue(), '2 Mar 2026');
    const useBy = form.getByRole('textbox', { name: 'Use by' });
    await typeDay(useBy, inDays(10));
    assert.match(await useBy.inputValue(), /^\d{1,2} [A-Z][a-z]{2} \d{4}$/);
    await form.getByLabel('Quantity').fill('6');
    // source: FDA Food Code 2022, §3-202.11(A): received at 5 °C (41 °F) or below
    await form.getByLabel('Temperature at the door').fill('3');
    await page.getByRole('button', { name: 'Choose the use-by day' }).waitFor();
    await shootAtWidths(session, page, 'date-boxes-deliveries');
    await page.getByTestId('receive-submit').click();
    const saved = page.getByTestId('receive-saved');
    await saved.getByText(/Taken in: R\d{6}-\d{2}/).waitFor();
    const lot = /R\d{6}-\d{2}/.exec(await saved.innerText())![0];
    const recorded = (await server.as('rosa').get(`/api/receipts/${lot}`)).json.receipt;
    assert.equal(recorded.packedOn, '2026-03-02');
    assert.equal(recorded.useBy, inDays(10));

    // The HACCP report: both days in words, and the downloads ask for that period.
    await page.goto(`${server.url}/reports`, { waitUntil: 'networkidle' });
    const from = page.getByTestId('report-from');
    const to = page.getByTestId('report-to');
    await typeDay(from, '2026-03-02');
    await typeDay(to, '2026-03-09');
    assert.equal(await from.inputValue(), '2 Mar 2026');
    assert.equal(await to.inputValue(), '9 Mar 2026');
    const pdf = new URL((await page.getByTestId('report-pdf').getAttribute('href'))!, server.url);
    assert.equal(pdf.searchParams.get('from'), '2026-03-02');
    assert.equal(pdf.searchParams.get('to'), '2026-03-09');
    await shootAtWidths(session, page, 'date-boxes-report');

    // The audit log: from tomorrow on, nothing yet; the box says the day in words.
    await page.goto(`${server.url}/people/audit`, { waitUntil: 'networkidle' });
    const since = page.getByTestId('audit-from-filter');
    await typeDay(since, '2026-03-02');
    assert.equal(await since.inputValue(), '2 Mar 2026');
    await shootAtWidths(session, page, 'date-boxes-audit');

    // A planned batch's start dialog: the start day in words, and the warning names that day.
    const plannedLot = await plannedBelly(session);
    await page.goto(`${server.url}/batches/${plannedLot}`, { waitUntil: 'networkidle' });
    await page.getByTestId('start-batch').click();
    const dialog = page.getByTestId('start-dialog');
    await dialog.waitFor();
    await dialogSettled(page);
    const start = dialog.getByTestId('start-day');
    await typeDay(start, '2026-03-02');
    assert.equal(await start.inputValue(), '2 Mar 2026');
    assert.match(await dialog.getByTestId('start-moved').innerText(), /starting on 2 Mar 2026/);
    for (const width of [1280, 820, 390]) {
      await page.setViewportSize({ width, height: width === 390 ? 844 : 1000 });
      await shoot(session, page, `date-boxes-start-${width}`);
    }
    assert.deepEqual(errors, []);
  });

  it('should keep a lot code on one line in a heading on a phone', async (t) => {
    const session = await startConsole(t);
    const { server } = session;
    const lot = await plannedBelly(session);
    const page = await session.page('rosa');
    const errors = collectConsoleErrors(page);
    await page.setViewportSize({ width: 390, height: 844 });
    /** How many lines the lot code takes in the heading that names it. */
    const linesOf = async (heading: Locator): Promise<number> =>
      heading.evaluate((element, code) => {
        const range = document.createRange();
        const text = [...element.querySelectorAll('*'), element]
          .flatMap((node) => [...node.childNodes])
          .find((node) => node.nodeType === Node.TEXT_NODE && node.textContent?.includes(code))!;
        const at = text.textContent!.indexOf(code);
        range.setStart(text, at);
        range.setEnd(text, at + code.length);
        return new Set([...range.getClientRects()].map((rect) => Math.round(rect.top))).size;
      }, lot);

    await page.goto(`${server.url}/trace?lot=${lot}`, { waitUntil: 'networkidle' });
    const recall = page.getByRole('heading', { name: `Recall report of lot ${lot}` });
    await recall.waitFor();
    assert.equal(await linesOf(recall), 1, 'the recall heading keeps the lot code whole');
    await shoot(session, page, 'lot-code-trace-390');

    await page.goto(`${server.url}/batches/${lot}`, { waitUntil: 'networkidle' });
    const title = page.getByTestId('batch-lot');
    assert.equal((await title.innerText()).trim(), `Lot ${lot}`);
    assert.equal(await linesOf(title), 1);
    assert.deepEqual(errors, []);
  });
});
