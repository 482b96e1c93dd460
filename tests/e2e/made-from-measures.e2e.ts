import assert from 'node:assert/strict';
import path from 'node:path';
import { describe, it } from 'node:test';
import { QueryTypes } from 'sequelize';
import { addDays } from '../../shared/calculation/dates.ts';
import { insertReceipts, lotsLeft, recordAssembly } from '../helpers/lot-use-fixture.ts';
import { DAIRY_LOTS, dairyDelivery } from '../helpers/dairy-fixture.ts';
import { clearStock } from '../helpers/pull-list-fixture.ts';
import { clockFrom, type TestServer } from '../helpers/test-server.ts';
import { ARTIFACTS, collectConsoleErrors, startConsole } from './browser.ts';
import { atWidths, shootAtWidths } from './screens.ts';

const TODAY = new Date().toISOString().slice(0, 10);

/** A day as the console writes it: "3 Dec 2026". */
function dayWords(day: string): string {
  const date = new Date(`${day}T00:00:00Z`);
  const month = 'Jan Feb Mar Apr May Jun Jul Aug Sep Oct Nov Dec'.split(' ')[date.getUTCMonth()];
  return `${date.getUTCDate()} ${month} ${date.getUTCFullYear()}`;
}

/** A batch of a formula recorded on the server's today, marked done then; its lot code. */
async function madeToday(server: TestServer, formula: string, batch: object): Promise<string> {
  const tobin = server.as('tobin');
  const recorded = await tobin.post('/api/batches', { formula, batch });
  assert.equal(recorded.status, 201, recorded.text);
  const lot = recorded.json.batch.lotCode as string;
  const done = await tobin.post(`/api/batches/${lot}/status`, { to: 'done' });
  assert.equal(done.status, 200, done.text);
  return lot;
}

describe('what a batch was made from: eggs counted, and batches with a use-by', () => {
  it('should need whole eggs and millilitres of milk, turned from the batch’s grams', async (t) => {
    const session = await startConsole(t);
    const { server } = session;
    await clearStock(server.context.db);
    await insertReceipts(server.context.db, dairyDelivery(TODAY));
    const recorded = await server.as('tobin').post('/api/batches', {
      formula: 'pit-bun',
      batch: { pieces: '24', start: TODAY },
    });
    assert.equal(recorded.status, 201, recorded.text);
    const lot = recorded.json.batch.lotCode as string;
    const page = await session.page('tobin');
    const errors = collectConsoleErrors(page);
    await page.goto(`${server.url}/batches/${lot}#made-from`, { waitUntil: 'networkidle' });
    const section = page.getByTestId('made-from');
    const eggs = section.getByTestId('lots-of-eggs');
    await eggs.waitFor();
    // by hand: the sheet's 119 g of egg at 50 g a large egg (source: USDA FoodData Central, SR
    // Legacy, "Egg, whole, raw, fresh", 1 large = 50 g, from memory, the demo catalogue's
    // figure) is 2.38 eggs: 3 cracked
    assert.match(await eggs.innerText(), /Needs 3 \(119 g at 50 g for one, whole pieces\)\./);
    assert.equal(await eggs.getByLabel('Amount').inputValue(), '3');
    const milk = section.getByTestId('lots-of-whole-milk');
    assert.match(await milk.innerText(), /Needs \d+ ml \(\d+ g at 244 g per cup\)\./);
    await milk.scrollIntoViewIfNeeded();
    await atWidths(page, async (width) => {
      await section.screenshot({
        path: path.join(ARTIFACTS, `made-from-eggs-section-${width}.png`),
      });
    });
    await shootAtWidths(session, page, 'made-from-eggs');
    await section.getByTestId('use-these-lots').click();
    await section.getByTestId('lots-used').waitFor();
    assert.equal((await lotsLeft(server.context.db))[DAIRY_LOTS.eggs].remaining, '27');
    assert.deepEqual(errors, []);
  });

  it('should offer the sauce by its use-by, set an old one apart and show the use-by once used', async (t) => {
    const clock = { day: addDays(TODAY, -9) };
    const session = await startConsole(t, { now: () => clockFrom(clock.day)() });
    const { server } = session;
    // The sauce is ready to eat and held cold: 7 days, the day it was made day 1 (FDA Food Code
    // 2022, 3-501.17(A)). Made 9 days ago: its use-by was 3 days ago.
    const old = await madeToday(server, 'house-sauce', { total: '2 kg' });
    clock.day = addDays(TODAY, -2);
    const fresh = await madeToday(server, 'house-sauce', { total: '2 kg' });
    clock.day = addDays(TODAY, -1);
    const grind = await madeToday(server, 'chuck-grind', { want: '5 kg' });
    clock.day = TODAY;
    const burgers = await recordAssembly(server, 'smokehouse-burger', TODAY);
    const page = await session.page('tobin');
    const errors = collectConsoleErrors(page);
    await page.goto(`${server.url}/batches/${burgers}#made-from`, { waitUntil: 'networkidle' });
    const section = page.getByTestId('made-from');
    const sauce = section.getByTestId('lots-of-house-sauce');
    await sauce.waitFor();
    assert.match(
      await sauce.innerText(),
      new RegExp(`${old} was to be used by ${dayWords(addDays(TODAY, -3))}: discard it`),
    );
    assert.match(
      await section.getByTestId('lots-of-chuck-grind').getByTestId('no-use-by').innerText(),
      /^No use-by: not ready to eat/,
    );
    // The sauce's line comes suggested (the first batch on offer at its weight); its choices:
    assert.equal(await sauce.getByLabel('Batch').count(), 1);
    await sauce.getByLabel('Batch').click();
    const freshWords = `${fresh} · use by ${dayWords(addDays(TODAY, 4))} · made ${dayWords(addDays(TODAY, -2))}`;
    const options = await page.getByRole('option').allInnerTexts();
    assert.ok(options.includes(freshWords), options.join('\n'));
    assert.ok(!options.some((o) => o.startsWith(old)), options.join('\n'));
    await page.getByRole('option', { name: freshWords }).click();
    await page.getByRole('listbox').waitFor({ state: 'detached' });
    await sauce.getByLabel('Amount').fill('600 g');
    await shootAtWidths(session, page, 'made-from-sources');
    await atWidths(page, async (width) => {
      await section.screenshot({
        path: path.join(ARTIFACTS, `made-from-sources-section-${width}.png`),
      });
    });
    await section.getByTestId('use-these-lots').click();
    const used = section.getByTestId('lots-used');
    await used.waitFor();
    // The label above the day, as every field of a lot used.
    assert.equal(
      (await used.getByTestId('use-by').innerText()).replace(/\s+/g, ' '),
      `Use by ${dayWords(addDays(TODAY, 4))}`,
    );
    await shootAtWidths(session, page, 'made-from-sources-used');
    await atWidths(page, async (width) => {
      await used.screenshot({
        path: path.join(ARTIFACTS, `made-from-sources-used-list-${width}.png`),
      });
    });
    const [row] = await server.context.db.sequelize.query<{ lot_code: string }>(
      `SELECT s.lot_code FROM lot_uses u
       JOIN batches s ON s.id = u.source_batch_id
       JOIN batches b ON b.id = u.batch_id
       WHERE b.lot_code = ? AND s.formula_id = 'house-sauce' AND u.replaced_at IS NULL`,
      { type: QueryTypes.SELECT, replacements: [burgers] },
    );
    assert.equal(row.lot_code, fresh);
    assert.ok(grind);
    assert.deepEqual(errors, []);
  });
});
