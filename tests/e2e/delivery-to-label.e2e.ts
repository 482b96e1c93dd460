// The whole way from the delivery door to the label, as a kitchen lives it: a delivery of pork
// belly is received, a bacon batch is made from it, the supplier's lot is recalled and the recall
// finds that batch, and the batch's label is printed and read back.
import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import { describe, it } from 'node:test';
import { pdfText } from '../helpers/pdf-text.ts';
import { clearStock } from '../helpers/pull-list-fixture.ts';
import { collectConsoleErrors, startConsole } from './browser.ts';

const TODAY = new Date().toISOString().slice(0, 10);
const inDays = (days: number): string =>
  new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

describe('from the delivery door to the label', () => {
  it('should receive a delivery, make a batch from it, recall the supplier lot to that batch and print its label', async (t) => {
    const session = await startConsole(t);
    const { server } = session;
    // A kitchen that has received nothing yet, so the batch can draw only on this delivery.
    await clearStock(server.context.db);
    const page = await session.page('tobin');
    const errors = collectConsoleErrors(page);

    // 1. The delivery at the door: 12.5 kg of belly at 3 °C, within its limit.
    // source: FDA Food Code 2022, §3-202.11(A): received at 5 °C (41 °F) or below
    await page.getByRole('link', { name: 'Deliveries' }).click();
    await page.waitForURL(/\/deliveries$/);
    const form = page.getByTestId('receive-form');
    await form.getByTestId('receive-item').click();
    await page.getByRole('option', { name: 'pork belly', exact: true }).click();
    await form.getByLabel('Supplier', { exact: true }).fill('Orchard Lane Pork');
    await form.getByLabel("Supplier's lot").fill('OL-4471');
    await form.getByLabel('Establishment number').fill('EST. 7720');
    await form.getByLabel('Use by').fill(inDays(10));
    await form.getByLabel('Quantity').fill('12.5');
    await form.getByLabel('Temperature at the door').fill('3');
    assert.equal(await form.getByLabel("Supplier's lot").inputValue(), 'OL-4471');
    await page.getByTestId('receive-submit').click();
    const saved = page.getByTestId('receive-saved');
    await saved.getByText(/Taken in: R\d{6}-\d{2}/).waitFor();
    const received = /R\d{6}-\d{2}/.exec(await saved.innerText())![0];

    // 2. A bacon batch of 10 kg green belly, made from it: the cook uses the lots suggested.
    const recorded = await server.as('tobin').post('/api/batches', {
      formula: 'quillmoor-belly',
      batch: { meat: '10 kg', thickness: '4 cm', start: TODAY },
    });
    assert.equal(recorded.status, 201, recorded.text);
    const lot = recorded.json.batch.lotCode as string;
    const title = recorded.json.batch.formula.title as string;
    await page.goto(`${server.url}/batches/${lot}#made-from`, { waitUntil: 'networkidle' });
    const madeFrom = page.getByTestId('made-from');
    // by hand: the belly needs its 10 kg green weight, all of it from the one lot on hand
    assert.match(await madeFrom.getByTestId('lots-of-pork-belly').innerText(), /Needs 10 kg/);
    await madeFrom.getByTestId('use-these-lots').click();
    const used = madeFrom.getByTestId('lots-used');
    await used.waitFor();
    assert.match(await used.innerText(), new RegExp(`${received}[\\s\\S]*OL-4471`));

    // 3. The supplier recalls lot OL-4471: the recall finds the batch, which opens from it.
    await page.getByRole('link', { name: 'Trace' }).click();
    await page.waitForURL(/\/trace$/);
    await page.getByRole('radio', { name: 'Supplier lot' }).click();
    await page.getByTestId('trace-supplier-lot').fill('OL-4471');
    await page.getByTestId('trace-supplier').fill('Orchard Lane Pork');
    await page.getByTestId('trace-go').click();
    const found = page.getByTestId('trace-forward').getByRole('link', { name: `${title} ${lot}` });
    await found.waitFor();
    await found.click();
    await page.waitForURL(new RegExp(`/batches/${lot}$`));

    // 4. Its label: 340 g packs, printed at 4 × 6 in and read back.
    await page.getByTestId('label-net').fill('340 g');
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByTestId('label-print').click(),
    ]);
    const text = await pdfText(readFileSync(await download.path()));
    assert.ok(text.all.includes(lot), text.all);
    // The catalogue names the belly "pork" on a label; the heaviest ingredient comes first.
    // source: 9 CFR 317.2(f)(1), ingredients in descending order of predominance (from memory)
    assert.match(text.all, /Ingredients: pork,/);
    // Cold-smoked bacon is sold raw: the safe handling instructions. source: 9 CFR 317.2(l)
    assert.match(text.all, /Safe Handling Instructions/);
    assert.deepEqual(errors, []);
  });
});
