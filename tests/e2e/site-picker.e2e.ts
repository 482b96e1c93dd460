// The site picker in the top bar: a single kitchen never sees it; the demo of two kitchens shows
// it, the batch log follows the site chosen, and the choice is kept after a reload.
import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { Page } from 'playwright-core';
import { collectConsoleErrors, startConsole } from './browser.ts';
import { addPerson, SITE_PASSWORD } from '../helpers/site-fixture.ts';
import { shootAtWidths } from './screens.ts';

// source: server/demo/demo-people.ts (the demo's own invented shop)
const SHOP = 'Saltmarrow Quay shop';

/** The lot codes the batch log shows, once it has loaded. */
async function loggedLots(page: Page): Promise<string[]> {
  await page.getByTestId('batch-lot-link').first().waitFor();
  return page.getByTestId('batch-lot-link').allInnerTexts();
}

describe('the site picker', () => {
  it('should not show on a single kitchen, nor say "site" anywhere on its batch log', async (t) => {
    const session = await startConsole(t);
    const page = await session.page('rosa');
    const errors = collectConsoleErrors(page);
    await page.goto(`${session.server.url}/batches`, { waitUntil: 'networkidle' });
    await loggedLots(page);
    assert.equal(await page.getByTestId('site-picker').count(), 0);
    assert.doesNotMatch(await page.locator('mat-toolbar').innerText(), /site/i);
    assert.deepEqual(errors, []);
  });

  it('should show the batch log of the site chosen, and keep the choice after a reload', async (t) => {
    const session = await startConsole(t, { env: { LARDER_DEMO_SITES: '2' } });
    const { server } = session;
    const page = await session.page('rosa');
    const errors = collectConsoleErrors(page);
    await page.goto(`${server.url}/batches`, { waitUntil: 'networkidle' });
    const picker = page.getByTestId('site-picker');
    assert.match(await picker.innerText(), /Quillmoor Smokehouse/);
    const main = await loggedLots(page);
    const mainApi = await server.as('rosa').get('/api/batches?limit=200');
    const mainLots = mainApi.json.items.map((b: { lotCode: string }) => b.lotCode) as string[];
    for (const lot of main) assert.ok(mainLots.includes(lot), `${lot} is the smokehouse's`);
    await shootAtWidths(session, page, 'site-picker-main');

    await picker.click();
    const item = page.getByRole('menuitemradio', { name: new RegExp(SHOP) });
    assert.match(await item.innerText(), /Admin/);
    await item.click();
    await page.getByTestId('site-picker').getByText(SHOP).waitFor();
    await page.waitForFunction(
      (first) => document.querySelector('[data-testid="batch-lot-link"]')?.textContent !== first,
      main[0],
    );
    const shop = await loggedLots(page);
    const shopApi = await server.as('rosa').get('/api/batches?site=saltmarrow');
    assert.deepEqual(
      [...shop].sort(),
      shopApi.json.items.map((b: { lotCode: string }) => b.lotCode).sort(),
    );
    assert.equal(shop.length, 6);
    for (const lot of shop) assert.ok(!main.includes(lot), `${lot} is the shop's alone`);
    await page.getByTestId('site-picker').click();
    await shootAtWidths(session, page, 'site-picker-menu');
    await page.keyboard.press('Escape');

    await page.reload({ waitUntil: 'networkidle' });
    await page.getByTestId('site-picker').getByText(SHOP).waitFor();
    assert.deepEqual(await loggedLots(page), shop);
    await shootAtWidths(session, page, 'site-picker-shop');
    assert.deepEqual(errors, []);
  });

  it('should give the role at the site chosen, and show a cook of one shop its name only', async (t) => {
    const session = await startConsole(t, { env: { LARDER_DEMO_SITES: '2' } });
    const { server } = session;
    // A reviewer of the group who cooks at the shop.
    await addPerson(server, 'group-reviewer', 'reviewer', [{ key: 'saltmarrow', role: 'cook' }]);
    const page = await session.page();
    await page.getByLabel('Username').fill('group-reviewer');
    await page.getByLabel('Password').fill(SITE_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
    const role = page.getByTestId('signed-in-as').locator('.role');
    const queue = page.getByRole('link', { name: 'To sign off' });
    assert.equal(await role.innerText(), 'Reviewer');
    assert.equal(await queue.count(), 1);
    await page.getByTestId('site-picker').click();
    await page.getByRole('menuitemradio', { name: new RegExp(SHOP) }).click();
    await page.getByTestId('site-picker').getByText(SHOP).waitFor();
    assert.equal(await role.innerText(), 'Cook');
    assert.equal(await queue.count(), 0, 'a cook at the shop has no sign-off queue there');

    const cook = await session.page('maren');
    await cook.goto(`${server.url}/batches`, { waitUntil: 'networkidle' });
    const only = cook.getByTestId('site-picker');
    assert.match(await only.innerText(), new RegExp(SHOP));
    assert.equal(await only.getByRole('button').count(), 0, 'one site: nothing to choose');
    assert.equal((await loggedLots(cook)).length, 6);
    await shootAtWidths(session, cook, 'site-picker-one-shop');
  });
});
