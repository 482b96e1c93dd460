import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import path from 'node:path';
import type { Locator, Page } from 'playwright-core';
import { addDays } from '../../shared/calculation/dates.ts';
import { insertReceipts, lotsLeft } from '../helpers/lot-use-fixture.ts';
import { clearStock } from '../helpers/pull-list-fixture.ts';
import { ARTIFACTS, collectConsoleErrors, startConsole } from './browser.ts';
import { atWidths, shootAtWidths } from './screens.ts';

const TODAY = new Date().toISOString().slice(0, 10);
const code = (day: string, n: number) => `R${day.slice(2).replaceAll('-', '')}-0${n}`;

/** The section alone at each width, to look at closely beside the whole page. */
async function sectionAtWidths(page: Page, section: Locator, name: string): Promise<void> {
  await atWidths(page, async (width) => {
    await section.screenshot({ path: path.join(ARTIFACTS, `${name}-section-${width}.png`) });
  });
}

describe('what a batch was made from', () => {
  it('should let a cook record the lots suggested for a batch, first to expire first', async (t) => {
    const session = await startConsole(t);
    const { server } = session;
    const twoDaysAgo = addDays(TODAY, -2);
    const yesterday = addDays(TODAY, -1);
    // Two lots of belly, the later delivery expiring first, and the house sea salt.
    const later = code(yesterday, 1);
    const earlier = code(twoDaysAgo, 1);
    const salt = code(twoDaysAgo, 2);
    // From a kitchen that has received nothing: the demo's deliveries would take these codes.
    await clearStock(server.context.db);
    await insertReceipts(server.context.db, [
      {
        lotCode: earlier,
        item: 'pork-belly',
        itemName: 'pork belly',
        supplierLot: 'HV-4471',
        quantity: '8',
        unit: 'kg',
        amount: '8000',
        receivedOn: twoDaysAgo,
        useBy: addDays(TODAY, 6),
      },
      {
        lotCode: later,
        item: 'pork-belly',
        itemName: 'pork belly',
        supplierLot: 'HV-4480',
        quantity: '3',
        unit: 'kg',
        amount: '3000',
        receivedOn: yesterday,
        useBy: addDays(TODAY, 3),
      },
      {
        lotCode: salt,
        item: 'sea-salt',
        itemName: 'sea salt',
        supplier: 'Saltmarsh Traders',
        supplierLot: 'SM-2210',
        quantity: '1',
        unit: 'kg',
        amount: '1000',
        receivedOn: twoDaysAgo,
      },
    ]);
    const recorded = await server.as('tobin').post('/api/batches', {
      formula: 'quillmoor-belly',
      batch: { meat: '10 kg', thickness: '4 cm', start: TODAY },
    });
    assert.equal(recorded.status, 201, recorded.text);
    const lot = recorded.json.batch.lotCode as string;

    const page = await session.page('tobin');
    const errors = collectConsoleErrors(page);
    // As the record-a-batch screen leaves it: the batch page, opened at its lots.
    await page.goto(`${server.url}/batches/${lot}#made-from`, { waitUntil: 'networkidle' });
    const section = page.getByTestId('made-from');
    await section.getByTestId('made-from-lead').waitFor();
    const belly = section.getByTestId('lots-of-pork-belly');
    // hand-worked: 10 kg of belly; the 3 kg lot expires first, then 7 kg of the 8 kg lot
    assert.match(await belly.innerText(), /Needs 10 kg/);
    const amounts = belly.getByLabel('Amount');
    assert.deepEqual(
      await amounts.evaluateAll((els) => els.map((e) => (e as HTMLInputElement).value)),
      ['3 kg', '7 kg'],
    );
    assert.match(await belly.innerText(), new RegExp(`${later}[\\s\\S]*${earlier}`));
    await shootAtWidths(session, page, 'batch-lots-suggested');
    await sectionAtWidths(page, section, 'batch-lots-suggested');

    await section.getByTestId('use-these-lots').click();
    const used = section.getByTestId('lots-used');
    await used.waitFor();
    const text = await used.innerText();
    assert.match(text, new RegExp(later));
    assert.match(text, /HV-4480/);
    assert.match(text, /Saltmarsh Traders SM-2210/);
    // source: the formula's 2.25 % sea salt of 10 000 g green weight = 225 g
    assert.match(text, /225 g/);
    await shootAtWidths(session, page, 'batch-lots-used');
    await sectionAtWidths(page, section, 'batch-lots-used');
    const left = await lotsLeft(server.context.db);
    assert.deepEqual(left[later], { remaining: '0', emptiedOn: TODAY });
    assert.equal(left[earlier].remaining, '1000');
    assert.equal(left[salt].remaining, '775');
    assert.deepEqual(errors, []);
  });
});
