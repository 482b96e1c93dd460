import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import { describe, it } from 'node:test';
import { QueryTypes } from 'sequelize';
import { pdfText } from '../helpers/pdf-text.ts';
import type { TestServer } from '../helpers/test-server.ts';
import { insertReceipt, insertUse } from '../helpers/trace-fixture.ts';
import { collectConsoleErrors, startConsole } from './browser.ts';
import { shootAtWidths } from './screens.ts';

const TODAY = new Date().toISOString().slice(0, 10);
/** Received lots of today, numbered high so that no delivery of the demo takes their codes. */
const LOT = (n: number) => `R${TODAY.slice(2).replace(/-/g, '')}-${90 + n}`;

/** Records a batch of a demo formula through the API; its lot code and row id. */
async function record(server: TestServer, formula: string, batch: Record<string, string>) {
  const recorded = await server.as('tobin').post('/api/batches', {
    formula,
    batch: { ...batch, start: TODAY },
  });
  assert.equal(recorded.status, 201, recorded.text);
  const lot = recorded.json.batch.lotCode as string;
  /** How a trace names the batch: its formula's title and its lot code. */
  const name = `${recorded.json.batch.formula.title as string} ${lot}`;
  const [{ id }] = await server.context.db.sequelize.query<{ id: number }>(
    'SELECT id FROM batches WHERE lot_code = ?',
    { replacements: [lot], type: QueryTypes.SELECT },
  );
  return { lot, id, name };
}

// Today's kitchen, real batches with lots put in by SQL (tests/helpers/trace-fixture.ts):
//   belly batch  ← pork belly lot 1 (Hollin Farm lot HF-4471)
//   grind batch  ← beef trim lots 2 and 3 (Brackenmoor Meats)
//   hot links    ← grind batch
describe('trace and recall in the console', () => {
  it('should trace a supplier lot to its batch, open that batch, download the recall, and trace a batch back', async (t) => {
    const session = await startConsole(t);
    const { server } = session;
    const { db } = server.context;
    const belly = await record(server, 'quillmoor-belly', { meat: '4.26kg', thickness: '4cm' });
    const grind = await record(server, 'chuck-grind', { total: '10 kg' });
    const links = await record(server, 'hot-link-cure', {
      meat: '5 kg',
      thickness: '4 cm',
      largestPiece: '2.5 kg',
    });
    const lot = (
      n: number,
      item: string,
      itemName: string,
      supplier: string,
      supplierLot: string,
    ) =>
      insertReceipt(db, {
        lot: LOT(n),
        item,
        itemName,
        supplier,
        supplierLot,
        establishment: 'M1234',
        receivedOn: TODAY,
        amount: '20000',
        remaining: '15740',
      });
    const porkBelly = await lot(1, 'pork-belly', 'Pork belly', 'Hollin Farm', 'HF-4471');
    const trim1 = await lot(2, 'beef-trim', 'Beef trim', 'Brackenmoor Meats', 'BM-301');
    const trim2 = await lot(3, 'beef-trim', 'Beef trim', 'Brackenmoor Meats', 'BM-302');
    await insertUse(db, {
      batch: belly.id,
      receipt: porkBelly,
      item: 'pork-belly',
      amount: '4260',
      usedOn: TODAY,
    });
    await insertUse(db, {
      batch: grind.id,
      receipt: trim1,
      item: 'beef-trim',
      amount: '6000',
      usedOn: TODAY,
    });
    await insertUse(db, {
      batch: grind.id,
      receipt: trim2,
      item: 'beef-trim',
      amount: '4000',
      usedOn: TODAY,
    });
    await insertUse(db, {
      batch: links.id,
      source: grind.id,
      item: 'chuck-grind',
      amount: '5000',
      usedOn: TODAY,
    });

    const page = await session.page('tobin');
    const errors = collectConsoleErrors(page);
    await page.getByRole('link', { name: 'Trace' }).click();
    await page.waitForURL(/\/trace$/);
    await page.getByRole('radio', { name: 'Supplier lot' }).click();
    await page.getByTestId('trace-supplier-lot').fill('HF-4471');
    await page.getByTestId('trace-supplier').fill('Hollin Farm');
    await page.getByTestId('trace-go').click();
    await page.waitForURL(/supplierLot=HF-4471/);
    const forward = page.getByTestId('trace-forward');
    await forward.getByRole('link', { name: belly.name }).waitFor();
    assert.match(
      await forward.innerText(),
      new RegExp(`Pork belly ${LOT(1)}[\\s\\S]*Hollin Farm lot HF-4471 · est\\. M1234`),
    );
    assert.match(await forward.innerText(), /4260 g on /);
    await shootAtWidths(session, page, 'trace-recall');

    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByTestId('recall-pdf').click(),
    ]);
    const { all } = await pdfText(readFileSync(await download.path()));
    assert.ok(all.includes('Recall: supplier lot HF-4471 from Hollin Farm'), all.slice(0, 400));
    assert.ok(all.includes(belly.lot), all);

    await forward.getByRole('link', { name: belly.name }).click();
    await page.waitForURL(new RegExp(`/batches/${belly.lot}$`));
    await page
      .getByRole('heading', { name: new RegExp(belly.lot) })
      .first()
      .waitFor();

    // Back from the hot links: the grind, and the two trim lots behind it; a link to the grind.
    await page.goto(`${server.url}/trace?lot=${links.lot.toLowerCase()}`, {
      waitUntil: 'networkidle',
    });
    // Typed in lower case, named as its label has it.
    assert.match(
      await page.getByTestId('trace-answer').innerText(),
      new RegExp(`Recall report of lot ${links.lot}`),
    );
    const back = page.getByTestId('trace-back');
    await back.getByRole('link', { name: grind.name }).waitFor();
    const backText = await back.innerText();
    assert.match(backText, new RegExp(`Beef trim ${LOT(2)}[\\s\\S]*Beef trim ${LOT(3)}`));
    assert.match(backText, /6000 g on [\s\S]*4000 g on /);
    assert.match(
      await page.getByTestId('trace-forward').innerText(),
      /No batch has used it yet|Hot link/,
    );
    await shootAtWidths(session, page, 'trace-back');

    // A lot nobody has: said in words, not a blank page.
    await page.goto(`${server.url}/trace?lot=R991231-01`, { waitUntil: 'networkidle' });
    assert.match(
      await page.getByRole('alert').innerText(),
      /no received lot or batch with lot code R991231-01/,
    );
    assert.deepEqual(
      errors.filter((e) => !/404/.test(e)),
      [],
    );
  });
});
