import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { Page } from 'playwright-core';
import { collectConsoleErrors, startConsole } from './browser.ts';
import { shoot, shootAtWidths, sideways } from './screens.ts';

const dayAfter = (days: number): string =>
  new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

/** Fills the receiving form for a delivery of pork belly read at `temperature` °C. */
async function fillBelly(page: Page, lot: string, temperature: string): Promise<void> {
  const form = page.getByTestId('receive-form');
  await form.getByTestId('receive-item').click();
  await page.getByRole('option', { name: 'pork belly', exact: true }).click();
  await form.getByLabel('Supplier', { exact: true }).fill('Browser Test Pork');
  await form.getByLabel("Supplier's lot").fill(lot);
  await form.getByLabel('Establishment number').fill('EST. 9012');
  await form.getByLabel('Use by').fill(dayAfter(10));
  await form.getByLabel('Quantity').fill('12.5');
  await form.getByLabel('Temperature at the door').fill(temperature);
  for (const [label, value] of [
    ["Supplier's lot", lot],
    ['Quantity', '12.5'],
    ['Temperature at the door', temperature],
  ] as const)
    assert.equal(await form.getByLabel(label).inputValue(), value, label);
}

describe('receiving in the console', () => {
  it('should hold the item list until the items arrive on a slow line, then take a tap', async (t) => {
    const session = await startConsole(t);
    const page = await session.page('tobin');
    const errors = collectConsoleErrors(page);
    // The items answer 2 s late, as on a slow kitchen connection.
    await page.route('**/api/stock/items', async (route) => {
      await new Promise((resolve) => setTimeout(resolve, 2000));
      await route.continue();
    });
    await page.getByRole('link', { name: 'Deliveries' }).click();
    await page.waitForURL(/\/deliveries$/);
    const item = page.getByTestId('receive-form').getByTestId('receive-item');
    await page.getByText('Loading the items…').waitFor();
    // An empty list would open nothing on a tap: it is shown as not ready instead.
    assert.equal(await item.getAttribute('aria-disabled'), 'true');
    await item.click();
    await page.getByRole('option', { name: 'pork belly', exact: true }).click();
    assert.match(await item.innerText(), /pork belly/);
    assert.deepEqual(errors, []);
  });

  it('should receive a delivery at a desk and on a phone, and refuse one over its limit', async (t) => {
    const session = await startConsole(t);
    const page = await session.page('tobin');
    const errors = collectConsoleErrors(page);
    await page.getByRole('link', { name: 'Deliveries' }).click();
    await page.waitForURL(/\/deliveries$/);
    await page.getByTestId('stock-pork-belly').waitFor();

    // At a desk: within its limit. source: FDA Food Code 2022, §3-202.11(A): 5 °C (41 °F) or below
    await fillBelly(page, 'BT-1', '3');
    assert.match(await page.getByTestId('receive-limit').innerText(), /5 °C \(41 °F\) or colder/);
    await page.getByTestId('receive-submit').click();
    const saved = page.getByTestId('receive-saved');
    await saved.waitFor();
    assert.match(await saved.innerText(), /Taken in: R\d{6}-01, 12\.5 kg pork belly/);
    const lot = /R\d{6}-01/.exec(await saved.innerText())![0];
    await page.getByTestId(`lot-${lot}`).waitFor();
    await shootAtWidths(session, page, 'deliveries');
    await session.screenshot(page, 'deliveries-820-view');

    // On a phone: another delivery within its limit.
    await page.setViewportSize({ width: 390, height: 844 });
    await fillBelly(page, 'BT-2', '4');
    await page.getByTestId('receive-submit').click();
    await page
      .getByTestId('receive-saved')
      .getByText(/R\d{6}-02/)
      .waitFor();
    assert.equal(await sideways(page), 0, 'nothing sticks out sideways at 390 px');

    // Over its limit: 8 °C is above 5 °C. The form asks; the cook refuses it.
    await fillBelly(page, 'BT-3', '8');
    await page.getByTestId('receive-submit').click();
    const over = page.getByTestId('receive-over');
    await over.waitFor();
    assert.match(await over.innerText(), /8 °C \(46 °F\): over its limit of 5 °C \(41 °F\)/);
    await shoot(session, page, 'deliveries-over-limit-390');
    // What the cook sees on the phone: the question, where the form was.
    await over.scrollIntoViewIfNeeded();
    await session.screenshot(page, 'deliveries-over-limit-390-view');
    await over.getByTestId('receive-refuse').click();
    await page
      .getByTestId('receive-saved')
      .getByText(/Refused: R\d{6}-03/)
      .waitFor();
    const refused = /R\d{6}-03/.exec(await page.getByTestId('receive-saved').innerText())![0];
    await page.getByTestId(`receipt-${refused}`).waitFor();
    assert.equal(
      await page.getByTestId(`lot-${refused}`).count(),
      0,
      'a refused lot is never on hand',
    );
    await page.getByTestId('receive-saved').scrollIntoViewIfNeeded();
    await session.screenshot(page, 'deliveries-refused-390-view');
    // The one 422 is the door's question, over its limit: refuse it or take it in.
    assert.deepEqual(
      errors.filter((e) => !/status of 422/.test(e)),
      [],
    );
  });
});
