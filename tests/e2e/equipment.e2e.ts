import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { Locator, Page } from 'playwright-core';
import { collectConsoleErrors, dialogSettled, startConsole } from './browser.ts';

/** The card of the demo's piece of equipment with this name. */
function card(page: Page, name: string): Locator {
  return page.locator('li.card').filter({ has: page.getByRole('heading', { name, exact: true }) });
}

/** Whether the page scrolls sideways (it must not, down to a phone's 390 px). */
async function scrollsSideways(page: Page): Promise<boolean> {
  return page.evaluate(
    () => document.documentElement.scrollWidth > document.documentElement.clientWidth,
  );
}

/** Records a reading through the big button and the dialog, and waits for the outcome. */
async function recordReading(page: Page, name: string, value: string): Promise<Locator> {
  await card(page, name).getByTestId('equipment-record').click();
  const dialog = page.getByRole('dialog');
  await dialog.getByTestId('reading-value').fill(value);
  await dialog.getByTestId('reading-save').click();
  await dialog.getByTestId('reading-result').waitFor();
  return dialog;
}

describe('equipment in the console', () => {
  it('should let a cook record cooler readings in and out of range and check a thermometer, on a tablet and a phone', async (t) => {
    const session = await startConsole(t);
    const page = await session.page('tobin');
    const errors = collectConsoleErrors(page);
    await page.getByRole('link', { name: 'Equipment' }).click();
    await page.waitForURL(/\/equipment$/);
    await card(page, 'Walk-in cooler').waitFor();
    await session.screenshot(page, 'equipment-1280');

    // At the cooler, on a tablet held upright.
    await page.setViewportSize({ width: 820, height: 1180 });
    assert.equal(await scrollsSideways(page), false, 'no sideways scroll at 820 px');
    const cooler = card(page, 'Walk-in cooler');
    assert.match(await cooler.getByTestId('equipment-standing').innerText(), /Within limit/);

    // In range: cold holding at 5 °C (41 °F) or less. source: FDA Food Code 2022, §3-501.16(A)(2)
    const inRange = await recordReading(page, 'Walk-in cooler', '3.5');
    assert.match(await inRange.getByTestId('reading-ok').innerText(), /3\.5 °C .*within the limit/);
    await session.screenshot(page, 'equipment-reading-820');
    await inRange.getByTestId('reading-done').click();
    await inRange.waitFor({ state: 'detached' });
    await cooler.getByTestId('equipment-last').getByText('3.5 °C').waitFor();

    // Out of range, in °F: 45 °F = 7.2 °C, above 41 °F.
    await card(page, 'Walk-in cooler').getByTestId('equipment-record').click();
    const dialog = page.getByRole('dialog');
    await dialog.getByTestId('reading-value').fill('45');
    await dialog.getByRole('radio', { name: '°F' }).click();
    await dialog.getByTestId('reading-save').click();
    const deviation = dialog.getByTestId('reading-deviation');
    await deviation.waitFor();
    assert.match(await deviation.innerText(), /deviation is open/);
    assert.match(await deviation.innerText(), /Walk-in cooler: 7\.2 °C/);
    await session.screenshot(page, 'equipment-deviation-820');

    // The corrective action, the four things a HACCP record asks, in the batch page's dialog.
    await dialog.getByTestId('reading-act').click();
    const action = page.getByTestId('action-dialog');
    await action.waitFor();
    await dialogSettled(page);
    await action.getByTestId('action-cause').fill('The door was left ajar during a delivery.');
    await action.getByTestId('action-restored').fill('Door shut; read 3.5 °C half an hour later.');
    await action.getByTestId('action-prevention').fill('A door alarm after two minutes open.');
    await action.getByTestId('disposition-rechilled').getByRole('radio').check();
    // Under load a keystroke can land before the dialog settles: confirm only a form that holds it all.
    for (const [field, text] of [
      ['action-cause', 'The door was left ajar during a delivery.'],
      ['action-restored', 'Door shut; read 3.5 °C half an hour later.'],
      ['action-prevention', 'A door alarm after two minutes open.'],
    ] as const) {
      assert.equal(await action.getByTestId(field).inputValue(), text, field);
    }
    await action.getByTestId('action-confirm').click();
    await action.waitFor({ state: 'detached' });
    const acted = page.getByTestId('reading-acted').or(page.getByTestId('reading-failure'));
    await acted.waitFor();
    assert.equal(await acted.getAttribute('data-testid'), 'reading-acted', await acted.innerText());
    await dialog.getByTestId('reading-done').click();
    await dialog.waitFor({ state: 'detached' });
    await cooler.getByTestId('equipment-standing').getByText('Out of limit').waitFor();

    // The thermometer's ice-point check, on a phone.
    await page.setViewportSize({ width: 390, height: 844 });
    assert.equal(await scrollsSideways(page), false, 'no sideways scroll at 390 px');
    await session.screenshot(page, 'equipment-390');
    await card(page, 'Probe thermometer 1').getByTestId('equipment-check').click();
    const check = page.getByRole('dialog');
    // ±1 °C of the ice point passes. common practice, no source
    await check.getByTestId('check-value').fill('1.5');
    assert.match(await check.getByTestId('check-verdict').innerText(), /Fails/);
    await check.getByTestId('check-value').fill('0.5');
    assert.match(await check.getByTestId('check-verdict').innerText(), /Passes/);
    await check.getByTestId('check-note').fill('Crushed ice, stirred, one minute.');
    await session.screenshot(page, 'equipment-check-390');
    assert.equal(await scrollsSideways(page), false, 'no sideways scroll in the dialog at 390 px');
    await check.getByTestId('check-save').click();
    await check.waitFor({ state: 'detached' });
    await card(page, 'Probe thermometer 1').getByText('Last check: 0.5 °C').waitFor();

    // The cooler's log shows the deviation, closed by its corrective action.
    await card(page, 'Walk-in cooler').getByTestId('equipment-log').click();
    const log = page.getByRole('dialog');
    await log.getByTestId('log-deviations').waitFor();
    assert.match(await log.getByTestId('log-deviations').innerText(), /corrective action taken/);
    await session.screenshot(page, 'equipment-log-390');
    assert.deepEqual(errors, []);
  });

  it('should let an admin add a freezer with a limit of its own and its source', async (t) => {
    const session = await startConsole(t);
    const page = await session.page('rosa');
    const errors = collectConsoleErrors(page);
    await page.goto(`${session.server.url}/equipment`);
    await card(page, 'Walk-in cooler').waitFor();
    await page.getByTestId('equipment-add').click();
    const form = page.getByRole('dialog');
    await form.getByTestId('equipment-name').fill('Reach-in freezer');
    await form.getByTestId('equipment-kind').click();
    await page.getByRole('option', { name: 'Freezer' }).click();
    await form.getByTestId('equipment-mode-own').click();
    // source: USDA FSIS, "Freezing and Food Safety": food kept at 0 °F or below is always safe
    await form.getByTestId('equipment-max').fill('0 °F');
    await form.getByTestId('equipment-source').fill('USDA FSIS, Freezing and Food Safety');
    await form.getByTestId('equipment-every').fill('12');
    await session.screenshot(page, 'equipment-add-1280');
    await form.getByTestId('equipment-save').click();
    await form.waitFor({ state: 'detached' });
    const freezer = card(page, 'Reach-in freezer');
    await freezer.waitFor();
    // 0 °F = −17.8 °C. source: NIST SP 811 (2008), t/°C = (t/°F − 32) × 5/9
    assert.match(await freezer.innerText(), /at or below -17\.8 °C \(0 °F\), every 12 h/);
    assert.match(await freezer.getByTestId('equipment-standing').innerText(), /No reading yet/);
    assert.deepEqual(errors, []);
  });
});
