import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import { describe, it } from 'node:test';
import { choose, collectConsoleErrors, startConsole } from './browser.ts';
import { recordMarkedBatches } from './marked-batches.ts';
import { shoot } from './screens.ts';

/** Relative luminance of a CSS rgb() colour. source: Web Content Accessibility Guidelines 2.1, "relative luminance" */
function luminance(css: string): number {
  const [r, g, b] = (css.match(/\d+(\.\d+)?/g) ?? []).slice(0, 3).map((v) => {
    const s = Number(v) / 255;
    return s <= 0.03928 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4;
  });
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

/** Contrast ratio of two CSS colours. source: Web Content Accessibility Guidelines 2.1, "contrast ratio" */
function contrast(a: string, b: string): number {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return (hi + 0.05) / (lo + 0.05);
}

describe('the batch log in the console', () => {
  it('should let a cook record a batch, but not reach People', async (t) => {
    const session = await startConsole(t);
    const page = await session.page('tobin');
    const errors = collectConsoleErrors(page);
    await page.goto(`${session.server.url}/batches/new`, { waitUntil: 'networkidle' });
    await choose(page, 'record-formula', /Quillmoor belly/);
    await page.getByTestId('record-field-meat').fill('4.26');
    await page.getByTestId('record-field-thickness').fill('4');
    // The live preview weighs the curing salt: 4260 g × 0.25 % = 10.65 → 10.7 g.
    // source: the product brief's scale rounding; amounts from the formula file
    await page.getByTestId('record-preview').getByText('10.7 g').first().waitFor();
    await session.screenshot(page, 'record-batch');
    await page.getByTestId('record-submit').click();
    await page.waitForURL(/\/batches\/\d{6}-QB-\d{2}#made-from$/);
    const lot = await page.getByTestId('batch-lot').innerText();
    assert.match(lot, /\d{6}-QB-\d{2}/);
    await page.getByTestId('timeline').waitFor();
    await session.screenshot(page, 'batch-page');

    assert.equal(await page.getByRole('link', { name: 'People' }).count(), 0);
    await page.goto(`${session.server.url}/people`, { waitUntil: 'networkidle' });
    // The address stays, and the page says whom it is for instead of showing another one.
    assert.match(new URL(page.url()).pathname, /^\/people$/);
    await page.getByRole('heading', { name: 'This page is for admins' }).waitFor();
    const response = await session.server.as('tobin').get('/api/people');
    assert.equal(response.status, 403);
    assert.deepEqual(errors, []);
  });

  it('should refuse an over-limit cure with the reason on screen and record nothing', async (t) => {
    const session = await startConsole(t);
    const page = await session.page('tobin');
    const before = (await session.server.as('rosa').get('/api/batches?limit=1')).json
      .total as number;
    await page.goto(`${session.server.url}/batches/new`, { waitUntil: 'networkidle' });
    await choose(page, 'record-formula', /Maple belly/);
    await page.getByTestId('record-field-meat').fill('10');
    await page.getByTestId('record-field-pumpedWeight').fill('11.2');
    // Pumped to 12 % instead of 10 %: 144 ppm over 120 ppm. source: 9 CFR 424.22(b); FSIS 7620.3 pumped formula
    const refusal = page.getByTestId('refusal');
    await refusal
      .getByText(/144\.0 ppm/)
      .first()
      .waitFor();
    await page.getByTestId('record-submit').click();
    await refusal
      .getByText(/not recorded/i)
      .first()
      .waitFor();
    assert.match(
      await refusal.innerText(),
      /critical limit exceeded: 144\.0 ppm is over the 120 ppm limit for pumped bacon/i,
    );
    await session.screenshot(page, 'record-refused');
    assert.equal((await session.server.as('rosa').get('/api/batches?limit=1')).json.total, before);
  });

  it('should let a reviewer sign a batch off', async (t) => {
    const session = await startConsole(t);
    const waiting = await session.server
      .as('imke')
      .get('/api/batches?status=done&signedOff=false&limit=1');
    const lot = waiting.json.items[0]?.lotCode as string;
    assert.ok(lot, 'the demo history has a done batch waiting for sign-off');
    const page = await session.page('imke');
    await page.goto(`${session.server.url}/batches/${lot}`, { waitUntil: 'networkidle' });
    await page.getByTestId('sign-off-button').click();
    await page.getByTestId('sign-off-note').fill('Sheet and weights checked');
    await page.getByTestId('sign-off-confirm').click();
    await page.getByTestId('signed-off').getByText(/Imke/).waitFor();
    const batch = (await session.server.as('imke').get(`/api/batches/${lot}`)).json.batch;
    assert.equal(batch.signedOff.by.displayName, 'Imke Tressaly (food safety)');
    assert.equal(
      await page.getByTestId('sign-off-button').count(),
      0,
      'a batch is signed off once',
    );
  });

  it('should say why the person who recorded a batch does not sign it off', async (t) => {
    const session = await startConsole(t);
    const { server } = session;
    const recorded = await server.as('rosa').post('/api/batches', {
      formula: 'pit-bun',
      batch: { pieces: '24' },
    });
    assert.equal(recorded.status, 201, recorded.text);
    const lot = recorded.json.batch.lotCode as string;
    assert.equal(
      (await server.as('rosa').post(`/api/batches/${lot}/status`, { to: 'done' })).status,
      200,
    );
    const page = await session.page('rosa');
    const errors = collectConsoleErrors(page);
    await page.goto(`${server.url}/batches/${lot}`, { waitUntil: 'networkidle' });
    const button = page.getByTestId('sign-off-button');
    await button.waitFor();
    assert.equal(await button.isDisabled(), true);
    assert.match(
      await page.getByTestId('sign-off-held').innerText(),
      /You recorded this batch; another person signs it off\./,
    );
    await session.screenshot(page, 'sign-off-own-batch');
    assert.deepEqual(errors, []);
  });

  it('should hold a cook back from a signed-off batch and let an admin move it, saying why', async (t) => {
    const session = await startConsole(t);
    const { server } = session;
    const recorded = await server.as('tobin').post('/api/batches', {
      formula: 'quillmoor-belly',
      batch: { meat: '4.26kg', thickness: '4cm' },
    });
    assert.equal(recorded.status, 201, recorded.text);
    const lot = recorded.json.batch.lotCode as string;

    // In progress, a cure is not offered done: it cures first.
    const cook = await session.page('tobin');
    await cook.goto(`${server.url}/batches/${lot}`, { waitUntil: 'networkidle' });
    await cook.getByTestId('status-to-done').waitFor();
    assert.equal(await cook.getByTestId('status-to-done').isDisabled(), true);
    assert.match(
      await cook.getByTestId('moves-held-back').innerText(),
      /A cure is done only after curing; start curing first\./,
    );
    await cook.getByTestId('status-to-curing').click();
    await cook
      .getByTestId('batch-status')
      .getByText(/curing/i)
      .waitFor();
    // Still curing, so the sign-off says what was checked.
    const signed = await server
      .as('imke')
      .post(`/api/batches/${lot}/sign-off`, { note: 'Cure weights checked.' });
    assert.equal(signed.status, 200, signed.text);

    // Signed off, the cook's moves are held back with the reason.
    await cook.reload({ waitUntil: 'networkidle' });
    await cook.getByTestId('moves-held-back').waitFor();
    assert.equal(await cook.getByTestId('status-to-done').isDisabled(), true);
    assert.equal(await cook.getByTestId('status-to-discarded').isDisabled(), true);
    assert.match(
      await cook.getByTestId('moves-held-back').innerText(),
      /This batch is signed off; only an admin can change its status now, with a reason\./,
    );
    await session.screenshot(cook, 'signed-off-held-back');

    // The admin moves it on, and is asked why.
    const admin = await session.page('rosa');
    await admin.goto(`${server.url}/batches/${lot}`, { waitUntil: 'networkidle' });
    await admin.getByTestId('status-to-done').click();
    await admin.getByTestId('reason-dialog').waitFor();
    await admin.getByTestId('reason-confirm').click();
    await admin.getByText('Say why the status changes.').waitFor();
    const reason = 'Signed off while curing; the cure finished on its ready day.';
    await admin.getByTestId('reason-input').fill(reason);
    await session.screenshot(admin, 'signed-off-move-reason');
    await admin.getByTestId('reason-confirm').click();
    await admin.getByTestId('timeline').getByText(reason).waitFor();
    const batch = (await server.as('rosa').get(`/api/batches/${lot}`)).json.batch;
    assert.equal(batch.status, 'done');
    assert.equal(batch.events.at(-1).reason, reason);
  });

  it('should export exactly the filtered rows as CSV', async (t) => {
    const session = await startConsole(t);
    const page = await session.page('rosa');
    await page.goto(`${session.server.url}/batches?formula=quillmoor-belly`, {
      waitUntil: 'networkidle',
    });
    await page.getByTestId('batch-row').first().waitFor();
    await session.screenshot(page, 'batch-log');
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByTestId('export-csv').click(),
    ]);
    const csv = readFileSync(await download.path(), 'utf8')
      .trim()
      .split(/\r?\n/);
    const expected = (
      await session.server.as('rosa').get('/api/batches?formula=quillmoor-belly&limit=1')
    ).json.total as number;
    assert.ok(expected > 0);
    assert.equal(csv.length - 1, expected, 'one header row and one row per filtered batch');
    assert.ok(csv.slice(1).every((row) => row.includes('quillmoor-belly')));
  });

  it('should open newest started first, and mark failed and overdue rows in words', async (t) => {
    const session = await startConsole(t);
    const { server } = session;
    const { lateLot, failedLot } = await recordMarkedBatches(server);

    const page = await session.page('imke');
    const errors = collectConsoleErrors(page);
    await page.goto(`${server.url}/batches`, { waitUntil: 'networkidle' });
    await page.getByTestId('batch-row').first().waitFor();
    assert.equal(
      await page.getByRole('columnheader', { name: 'Started' }).getAttribute('aria-sort'),
      'descending',
      'newest started first',
    );
    const shown = await page
      .getByTestId('batch-row')
      .evaluateAll((rows) => rows.map((r) => r.getAttribute('data-lot')));
    const newest = (
      await server.as('imke').get('/api/batches?sort=started&order=desc&limit=25')
    ).json.items.map((b: { lotCode: string }) => b.lotCode);
    assert.deepEqual(shown, newest);

    // Overdue: one click, and each row says so with an icon and a word.
    await page.getByTestId('show-overdue').click();
    await page.waitForURL(/show=overdue/);
    const lateRow = page.locator(`[data-testid="batch-row"][data-lot="${lateLot}"]`);
    await lateRow.waitFor();
    // The address changes before the filtered page arrives: wait for the list to be the overdue.
    await page
      .waitForFunction(() => {
        const all = document.querySelectorAll('[data-testid="batch-row"]');
        const marked = document.querySelectorAll(
          '[data-testid="batch-row"] [data-testid="mark-overdue"]',
        );
        return all.length > 0 && all.length === marked.length;
      })
      .catch(() => undefined);
    const rows = page.getByTestId('batch-row');
    assert.equal(
      await page.locator('[data-testid="batch-row"] [data-testid="mark-overdue"]').count(),
      await rows.count(),
    );
    assert.match(await lateRow.getByTestId('mark-overdue').innerText(), /Overdue/);
    assert.equal(await lateRow.locator('mat-icon').first().innerText(), 'schedule');

    // Failed checks: FAIL in words beside its icon.
    await page.getByTestId('show-failed').click();
    const failedRow = page.locator(`[data-testid="batch-row"][data-lot="${failedLot}"]`);
    await failedRow.waitFor();
    assert.match(await failedRow.locator('.verdict').innerText(), /close\s*FAIL/);
    assert.equal(await rows.count(), 1, 'only the batch with a failed check');

    // One colour a status, none of them the colour of PASS or FAIL; words readable on each (AA).
    await page.getByTestId('show-all').click();
    await page.waitForURL((url) => !url.search.includes('show='));
    await page.getByTestId('page-size').click();
    await page.getByRole('option', { name: '100' }).click();
    await page.waitForURL(/size=100/);
    await page.getByTestId('batch-row').nth(30).waitFor();
    // Read in the page, judged here (a function declared inside evaluate would not survive tsx).
    const colours = {
      chips: (
        await page
          .locator('app-batch-status-chip')
          .evaluateAll((chips) =>
            chips.map((chip) => [
              chip.getAttribute('data-status') ?? '',
              getComputedStyle(chip).backgroundColor,
              getComputedStyle(chip).color,
            ]),
          )
      ).map(([status, bg, fg]) => ({ status, bg, contrast: contrast(bg, fg) })),
      verdicts: await page
        .locator('.verdict')
        .evaluateAll((verdicts) => verdicts.map((v) => getComputedStyle(v).backgroundColor)),
    };
    const byStatus = new Map(colours.chips.map((c) => [c.status, c.bg]));
    assert.ok(byStatus.size >= 4, [...byStatus.keys()].join());
    assert.equal(new Set(byStatus.values()).size, byStatus.size, 'each status its own colour');
    for (const chip of colours.chips) {
      assert.ok(!colours.verdicts.includes(chip.bg), `${chip.status} is not a check's colour`);
      // WCAG 2.1 AA, 1.4.3: 4.5:1 for text. source: Web Content Accessibility Guidelines 2.1, 1.4.3
      assert.ok(chip.contrast >= 4.5, `${chip.status}: ${chip.contrast.toFixed(2)}:1`);
    }

    // The nitrite chart: time to scale, and a caption saying what it judges.
    await page.getByTestId('nitrite-chart-toggle').click();
    await page.getByTestId('nitrite-chart').waitFor();
    assert.match(
      await page.getByTestId('nitrite-chart-scope').innerText(),
      /judges ingoing nitrite only/,
    );
    // Its days in the product's words, never ISO: "from 1 Nov 2026 to 3 Dec 2026".
    const summary = await page.getByTestId('nitrite-chart-summary').innerText();
    assert.match(summary, /\d{1,2} [A-Z][a-z]{2} \d{4}/);
    assert.doesNotMatch(summary, /\d{4}-\d{2}-\d{2}/);
    for (const width of [1280, 820, 390]) {
      await page.setViewportSize({ width, height: width === 390 ? 844 : 1000 });
      await page.waitForTimeout(200);
      await shoot(session, page, `batch-log-${width}`);
    }
    assert.deepEqual(errors, []);
  });
});
