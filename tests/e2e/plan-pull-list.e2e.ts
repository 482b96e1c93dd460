import assert from 'node:assert/strict';
import path from 'node:path';
import { describe, it } from 'node:test';
import { addReceipts, burgerReceipts, clearStock } from '../helpers/pull-list-fixture.ts';
import { ARTIFACTS, collectConsoleErrors, startConsole } from './browser.ts';
import { atWidths, framesSideways, shootAtWidths } from './screens.ts';

/** A calendar day `days` after `day` (YYYY-MM-DD). */
function addDays(day: string, days: number): string {
  const [y, m, d] = day.split('-').map(Number);
  return new Date(Date.UTC(y, m - 1, d + days)).toISOString().slice(0, 10);
}

/** A day with its weekday, as the console writes it: "Mon 14 Dec 2026". */
function weekdayWords(day: string): string {
  const date = new Date(`${day}T00:00:00Z`);
  const weekday = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'][date.getUTCDay()];
  const month = 'Jan Feb Mar Apr May Jun Jul Aug Sep Oct Nov Dec'.split(' ')[date.getUTCMonth()];
  return `${weekday} ${date.getUTCDate()} ${month} ${date.getUTCFullYear()}`;
}

// The server plans from its own today (UTC): three weeks ahead, the belly starts 10 days before
// service and the bun the day before (formulas/*.yaml).
const TODAY = new Date().toISOString().slice(0, 10);
const SERVICE = addDays(TODAY, 21);
const BELLY_START = addDays(SERVICE, -10);

describe('a plan’s pull list against stock in the console', () => {
  it('should mark short materials in words, with the morning to arrive by and whom to ask', async (t) => {
    const session = await startConsole(t);
    const db = session.server.context.db;
    await clearStock(db);
    await addReceipts(db, [
      ...burgerReceipts(TODAY, SERVICE),
      // Eggs, counted: compared with the bun's grams through the catalogue's 50 g for one.
      {
        item: 'eggs',
        itemName: 'eggs',
        supplier: 'Lowmere Dairy',
        supplierLot: 'LD-40',
        grams: '2',
        unit: 'each',
        useBy: addDays(SERVICE, 30),
        receivedAt: `${TODAY}T06:40:00Z`,
      },
    ]);
    const page = await session.page('tobin');
    const errors = collectConsoleErrors(page);
    await page.goto(
      `${session.server.url}/plans?assembly=smokehouse-burger&count=120&for=${SERVICE}`,
    );
    const stock = page.getByTestId('plan-stock');
    await stock.waitFor();

    const card = (item: string) => stock.locator(`[data-testid="stock-line"][data-item="${item}"]`);
    const cure = card('curing-salt-1');
    assert.match(await cure.getByTestId('stock-status').innerText(), /^error\s*Short \d/);
    assert.equal(
      await cure.getByTestId('stock-arrive-by').innerText(),
      `Must arrive by the morning of ${weekdayWords(BELLY_START)}, when Quillmoor belly, dry equilibrium cure starts.`,
    );
    assert.match(
      await cure.getByTestId('stock-supplier').innerText(),
      /^Ask Kestrel Cure Supply \(last delivered \d{1,2} [A-Z][a-z]{2} \d{4}\)\.$/,
    );
    assert.match(await card('honey').getByTestId('stock-status').innerText(), /Enough on hand/);
    // Never received: the cook is told to find a supplier.
    assert.match(
      await card('pepper-cracked').getByTestId('stock-supplier').innerText(),
      /Never received here/,
    );
    // The sea salt lot is past its use-by by the bun's day.
    assert.match(await card('sea-salt').innerText(), /is past its use-by .* when it would be used/);
    assert.match(await stock.getByTestId('plan-stock-summary').innerText(), /materials are short/);
    // The belly's green meat is compared through its formula's meat_item; tap water is not.
    assert.match(await card('pork-belly').innerText(), /green meat for/);
    assert.match(await stock.getByTestId('stock-apart').innerText(), /water/);
    // The bun's egg in whole eggs against the 2 on hand, with how its grams were counted.
    const eggs = card('eggs');
    assert.match(await eggs.getByTestId('stock-status').innerText(), /Short \d+ each/);
    assert.equal(
      await eggs.getByTestId('stock-conversion').innerText(),
      'Weighed in the formulas: counted at 50 g for one, in whole pieces for each batch.',
    );

    await atWidths(page, async (width) => {
      const inStock = (await framesSideways(page)).filter((frame) => frame.startsWith('stock'));
      assert.deepEqual(inStock, [], `nothing in the stock scrolls sideways at ${width} px`);
      // The section itself, top of the window, for a look at the cards.
      await stock.evaluate((section) => section.scrollIntoView());
      await page.screenshot({ path: path.join(ARTIFACTS, `plan-pull-list-stock-${width}.png`) });
      await stock.getByTestId('stock-apart').evaluate((list) => list.scrollIntoView());
      await page.screenshot({ path: path.join(ARTIFACTS, `plan-pull-list-apart-${width}.png`) });
      await eggs.screenshot({ path: path.join(ARTIFACTS, `plan-pull-list-eggs-${width}.png`) });
    });
    await shootAtWidths(session, page, 'plan-pull-list');
    assert.deepEqual(errors, []);
  });
});
