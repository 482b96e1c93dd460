import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { Page } from 'playwright-core';
import { collectConsoleErrors, startConsole, type ConsoleSession } from './browser.ts';

const TODAY = new Date().toISOString().slice(0, 10);
const WIDTHS = [1280, 820, 390] as const;

/** Screenshots of the page as it is at a desk, on a tablet and on a phone; back to the desk after. */
async function atEveryWidth(session: ConsoleSession, page: Page, name: string): Promise<void> {
  for (const width of WIDTHS) {
    await page.setViewportSize({ width, height: 900 });
    await session.screenshot(page, `${name}-${width}`);
  }
  await page.setViewportSize({ width: 1280, height: 860 });
}

/** The data-testid of the element with the keyboard focus, or its tag when it has none. */
function focused(page: Page): Promise<string> {
  return page.evaluate(() => {
    const element = document.activeElement;
    return element?.getAttribute('data-testid') ?? element?.tagName.toLowerCase() ?? '';
  });
}

/** Presses Tab until the element with this data-testid has the focus. */
async function tabTo(page: Page, testId: string, most = 40): Promise<void> {
  for (let i = 0; i < most; i++) {
    if ((await focused(page)) === testId) return;
    await page.keyboard.press('Tab');
  }
  assert.fail(`Tab never reached ${testId}; the focus is on ${await focused(page)}`);
}

/** Waits until the element with this data-testid has the focus (dialogs move it once open). */
async function focusReaches(page: Page, testId: string): Promise<void> {
  await page.waitForFunction(
    (id) => document.activeElement?.getAttribute('data-testid') === id,
    testId,
    { timeout: 5000 },
  );
}

/** Whether the focus is inside the open dialog. */
function focusInDialog(page: Page): Promise<boolean> {
  return page.evaluate(
    () => !!document.activeElement?.closest('mat-dialog-container, .mat-mdc-dialog-container'),
  );
}

describe('recording a batch from the keyboard', () => {
  it('should ask for the size the hold goes by, focus it, and record once it is given', async (t) => {
    const session = await startConsole(t);
    const page = await session.page('tobin');
    const errors = collectConsoleErrors(page);
    await page.goto(`${session.server.url}/batches/new`, { waitUntil: 'networkidle' });

    // Tab to the formula, open it with Enter, pick the belly by typing and Enter.
    await tabTo(page, 'record-formula');
    await page.keyboard.press('Enter');
    await page.getByRole('option', { name: /Quillmoor belly/ }).waitFor();
    const activeText = (): Promise<string> =>
      page.evaluate(
        () => document.querySelector('mat-option.mat-mdc-option-active')?.textContent ?? '',
      );
    for (let i = 0; i < 15; i++) {
      const before = await activeText();
      if (/Quillmoor belly/.test(before)) break;
      await page.keyboard.press('ArrowDown');
      // The list marks the next option a frame later: wait for it, so no key press is read twice.
      await page.waitForFunction(
        (previous) =>
          (document.querySelector('mat-option.mat-mdc-option-active')?.textContent ?? '') !==
          previous,
        before,
      );
    }
    assert.match(await activeText(), /Quillmoor belly/);
    await page.keyboard.press('Enter');
    await page.getByTestId('record-field-meat').waitFor();
    // formulas/quillmoor-belly.yaml holds 2 days per cm: the thickness, never the heaviest piece.
    assert.equal(await page.getByTestId('record-field-largestPiece').count(), 0);
    assert.equal(await page.getByTestId('record-field-thickness').getAttribute('required'), '');

    await tabTo(page, 'record-field-meat');
    await page.keyboard.type('4.26');
    await page.getByTestId('record-preview').getByText('10.7 g').first().waitFor();
    // The sheet says what is missing with the box's own label, never a command-line option.
    const sheet = await page.getByTestId('record-preview').innerText();
    assert.match(sheet, /Thickness of the thickest piece/);
    assert.doesNotMatch(sheet, /--[a-z]/);

    // Enter records; the form refuses without the thickness and puts the cursor in its box.
    await page.keyboard.press('Enter');
    await page
      .getByText('Give the thickness of the thickest piece: the hold time goes by it.')
      .waitFor();
    assert.equal(await focused(page), 'record-field-thickness');
    assert.match(new URL(page.url()).pathname, /\/batches\/new$/);
    await atEveryWidth(session, page, 'record-size-needed');

    await page.keyboard.type('4');
    await page.keyboard.press('Enter');
    await page.waitForURL(/\/batches\/\d{6}-QB-\d{2}#made-from$/);
    assert.deepEqual(errors, []);
  });

  it('should offer no size to a cure held for fixed days, and only the piece to one held per kg', async (t) => {
    const session = await startConsole(t);
    const page = await session.page('tobin');
    const sizes = async (formula: RegExp): Promise<string[]> => {
      await page.goto(`${session.server.url}/batches/new`, { waitUntil: 'networkidle' });
      await page.getByTestId('record-formula').click();
      await page.getByRole('option', { name: formula }).click();
      await page.getByTestId('record-field-meat').waitFor();
      const shown: string[] = [];
      for (const key of ['thickness', 'largestPiece'])
        if (await page.getByTestId(`record-field-${key}`).count()) shown.push(key);
      return shown;
    };
    // formulas/maple-pump-belly.yaml holds 2 days; formulas/ham-pump.yaml 1 day per kg.
    assert.deepEqual(await sizes(/maple/i), []);
    assert.deepEqual(await sizes(/Boneless ham/), ['largestPiece']);
    await atEveryWidth(session, page, 'record-ham-sizes');
  });
});

describe('the batch page asks before it ends something', () => {
  it('should confirm marking a curing batch done before its ready date, and return the focus', async (t) => {
    const session = await startConsole(t);
    const { server } = session;
    const tobin = server.as('tobin');
    // formulas/quillmoor-belly.yaml: 2 days per cm × 4 cm = 8 days, ready well after today.
    const recorded = await tobin.post('/api/batches', {
      formula: 'quillmoor-belly',
      batch: { meat: '4.26kg', thickness: '4cm', start: TODAY },
    });
    assert.equal(recorded.status, 201, recorded.text);
    const lot = recorded.json.batch.lotCode as string;
    assert.equal((await tobin.post(`/api/batches/${lot}/status`, { to: 'curing' })).status, 200);

    const page = await session.page('tobin');
    await page.goto(`${server.url}/batches/${lot}`, { waitUntil: 'networkidle' });
    await page
      .getByTestId('batch-revision')
      .getByText(/changed in the files/)
      .waitFor();
    const revision = await page.getByTestId('batch-revision').innerText();
    assert.match(revision, /made from the formula as changed in the files/);
    assert.doesNotMatch(revision, /[0-9a-f]{12}/);
    assert.equal(await page.getByTestId('batch-revision').getAttribute('title'), null);

    await page.getByTestId('status-to-done').focus();
    await page.keyboard.press('Enter');
    const dialog = page.getByTestId('confirm-dialog');
    await dialog.waitFor();
    assert.match(await dialog.innerText(), /It is not ready until .*may not have cured through/s);
    // The focus starts on the button that changes nothing, and stays in the dialog.
    await focusReaches(page, 'confirm-keep');
    for (let i = 0; i < 4; i++) {
      await page.keyboard.press('Tab');
      assert.ok(await focusInDialog(page), 'the dialog keeps the focus');
    }
    await atEveryWidth(session, page, 'confirm-done-early');
    await page.keyboard.press('Escape');
    await dialog.waitFor({ state: 'detached' });
    await focusReaches(page, 'status-to-done');
    assert.equal((await server.as('rosa').get(`/api/batches/${lot}`)).json.batch.status, 'curing');

    await page.keyboard.press('Enter');
    await page.getByTestId('confirm-go').click();
    await page.getByTestId('batch-status').getByText(/done/i).waitFor();
    assert.equal((await server.as('rosa').get(`/api/batches/${lot}`)).json.batch.status, 'done');

    // An admin may see the revision's hash, in a tooltip only.
    const admin = await session.page('rosa');
    await admin.goto(`${server.url}/batches/${lot}`, { waitUntil: 'networkidle' });
    const title = await admin.getByTestId('batch-revision').getAttribute('title');
    assert.equal(title, `Revision ${recorded.json.batch.formula.revision}`);
  });

  it('should ask why before discarding a batch, and keep it when the cook backs out', async (t) => {
    const session = await startConsole(t);
    const { server } = session;
    const recorded = await server.as('tobin').post('/api/batches', {
      formula: 'quillmoor-belly',
      batch: { meat: '4.26kg', thickness: '4cm', start: TODAY },
    });
    assert.equal(recorded.status, 201, recorded.text);
    const lot = recorded.json.batch.lotCode as string;
    const statusNow = async (): Promise<string> =>
      (await server.as('rosa').get(`/api/batches/${lot}`)).json.batch.status;

    const page = await session.page('tobin');
    await page.goto(`${server.url}/batches/${lot}`, { waitUntil: 'networkidle' });
    await page.getByTestId('status-to-discarded').click();
    // The dialog is named by its title, which says which batch goes.
    const dialog = page.getByRole('dialog', { name: `Discard batch ${lot}?` });
    await dialog.waitFor();
    await atEveryWidth(session, page, 'confirm-discard');

    // Backing out changes nothing.
    await page.getByTestId('reason-cancel').click();
    await dialog.waitFor({ state: 'detached' });
    assert.equal(await statusNow(), 'in-progress');

    // No reason, no discard: the dialog says what is missing and stays open.
    await page.getByTestId('status-to-discarded').click();
    await page.getByTestId('reason-confirm').click();
    await dialog.getByText('Say why the batch is discarded.').waitFor();
    assert.equal(await statusNow(), 'in-progress');

    await page.getByTestId('reason-input').fill('Cooler failed overnight');
    await page.getByTestId('reason-confirm').click();
    await dialog.waitFor({ state: 'detached' });
    await page.getByText('Cooler failed overnight').first().waitFor();
    assert.equal(await statusNow(), 'discarded');
  });
});

describe('signing off a batch that is not plainly good', () => {
  it('should name the failed check and ask a note before signing it off', async (t) => {
    const session = await startConsole(t);
    const { server } = session;
    // The demo burger grind is held to the ground beef standard, at most 30 % fat
    // (source: 9 CFR 319.15(a)); blended to 35 % it fails that check, which is not critical.
    const recorded = await server.as('tobin').post('/api/batches', {
      formula: 'chuck-grind',
      batch: { total: '10 kg', targetFat: '35', start: TODAY },
    });
    assert.equal(recorded.status, 201, recorded.text);
    const lot = recorded.json.batch.lotCode as string;

    const page = await session.page('imke');
    const errors = collectConsoleErrors(page);
    await page.goto(`${server.url}/batches/${lot}`, { waitUntil: 'networkidle' });
    const summary = await page.getByTestId('failed-checks').innerText();
    assert.match(summary.trim(), /^Fat failed: 35/);
    assert.doesNotMatch(
      await page.getByRole('region', { name: 'The record' }).locator('dl.facts').innerText(),
      /see below/,
    );

    // Open from the keyboard; Escape gives the focus back to the button.
    await page.getByTestId('sign-off-button').focus();
    await page.keyboard.press('Enter');
    await page.getByTestId('sign-off-dialog').waitFor();
    await focusReaches(page, 'sign-off-note');
    await page.keyboard.press('Escape');
    await page.getByTestId('sign-off-dialog').waitFor({ state: 'detached' });
    await focusReaches(page, 'sign-off-button');

    await page.keyboard.press('Enter');
    const dialog = page.getByTestId('sign-off-dialog');
    await dialog.waitFor();
    assert.match(
      await page.getByTestId('sign-off-concern').innerText(),
      /You are signing off a batch where the check “Fat” failed\./,
    );
    // Without a note the dialog stays and says what to write.
    await tabTo(page, 'sign-off-confirm');
    await page.keyboard.press('Enter');
    await page.getByText('Say what you checked: the check “Fat” failed.').waitFor();
    assert.equal(await dialog.count(), 1);
    assert.equal((await server.as('rosa').get(`/api/batches/${lot}`)).json.batch.signedOff, null);
    await atEveryWidth(session, page, 'sign-off-needs-note');

    await page.getByTestId('sign-off-note').focus();
    await page.keyboard.type('Fat over the ground beef standard: labelled as hamburger patties.');
    await tabTo(page, 'sign-off-confirm');
    await page.keyboard.press('Enter');
    await page.getByTestId('signed-off').getByText(/Imke/).waitFor();
    const batch = (await server.as('rosa').get(`/api/batches/${lot}`)).json.batch;
    assert.match(batch.events.at(-1).reason, /labelled as hamburger patties/);
    await atEveryWidth(session, page, 'batch-page-failed-check');
    assert.deepEqual(errors, []);
  });
});
