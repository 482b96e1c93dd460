import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import { describe, it } from 'node:test';
import type { Page } from 'playwright-core';
import { collectConsoleErrors, startConsole } from './browser.ts';
import { shootAtWidths } from './screens.ts';

/** A calendar day `days` after `day` (YYYY-MM-DD). */
function addDays(day: string, days: number): string {
  const [y, m, d] = day.split('-').map(Number);
  return new Date(Date.UTC(y, m - 1, d + days)).toISOString().slice(0, 10);
}

/** A day as the date box shows it and reads it back ("23 Dec 2026"), whatever the time zone. */
function inWords(day: string): string {
  const [y, m, d] = day.split('-').map(Number);
  const month = [
    'Jan',
    'Feb',
    'Mar',
    'Apr',
    'May',
    'Jun',
    'Jul',
    'Aug',
    'Sep',
    'Oct',
    'Nov',
    'Dec',
  ];
  return `${d} ${month[m - 1]} ${y}`;
}

/** The text of one batch's section of the plan. */
function batchText(page: Page, formula: string): Promise<string> {
  return page.locator(`[data-testid="plan-batch"][data-formula="${formula}"]`).innerText();
}

// The server plans from its own today (UTC); three weeks ahead leaves room for the belly's cure.
const TODAY = new Date().toISOString().slice(0, 10);
const SERVICE = addDays(TODAY, 21);

describe('plans in the console', () => {
  it('should let a cook plan 120 burgers, see every batch, day and allergen, and record them', async (t) => {
    const session = await startConsole(t);
    const page = await session.page('tobin');
    const errors = collectConsoleErrors(page);
    // The list of assemblies must have arrived before the select is opened, or it opens empty.
    const listed = page.waitForResponse(
      (response) => new URL(response.url()).pathname === '/api/formulas' && response.ok(),
    );
    await page.getByRole('link', { name: 'Plans' }).click();
    await page.waitForURL(/\/plans$/);
    await listed;
    // Opened from the keyboard: the select's long label lies over the middle of it.
    await page.getByTestId('plan-assembly').focus();
    await page.keyboard.press('Enter');
    await page.getByRole('option', { name: /Smokehouse burger/ }).click();
    await page.getByTestId('plan-count').fill('120');
    await page.getByTestId('plan-for').fill(inWords(SERVICE));
    await page.getByTestId('plan-show').click();
    await page.waitForURL(
      (url) =>
        url.pathname === '/plans' &&
        url.searchParams.get('assembly') === 'smokehouse-burger' &&
        url.searchParams.get('count') === '120' &&
        url.searchParams.get('for') === SERVICE,
    );
    await page.getByTestId('plan-title').getByText('Smokehouse burger × 120').waitFor();

    // Start days, worked back from service (formulas/*.yaml; lead days are the kitchen's own
    // rule, common practice, no source): the belly's hold is 2 days per cm × 4 cm = 8 days, plus
    // 2 days to rinse and dry, smoke and chill = 10 days ahead; the bun's sponge is mixed the day
    // before; the grind and the sauce are made on the day.
    const days = await page
      .getByTestId('plan-day')
      .evaluateAll((items) =>
        items.map((item) => [
          item.getAttribute('data-date'),
          [...item.querySelectorAll('[data-testid="plan-day-batch"]')]
            .map((batch) => batch.getAttribute('data-formula'))
            .sort(),
        ]),
      );
    assert.deepEqual(days, [
      [addDays(SERVICE, -10), ['quillmoor-belly']],
      [addDays(SERVICE, -1), ['pit-bun']],
      [SERVICE, ['chuck-grind', 'house-sauce']],
    ]);
    assert.equal(await page.getByTestId('plan-batch').count(), 4);
    // Each batch names its formula by title and links to it without showing its id.
    for (const text of await page.getByTestId('plan-batch').allInnerTexts()) {
      assert.doesNotMatch(text, /quillmoor-belly|pit-bun|chuck-grind|house-sauce/);
      assert.match(text, /Open the formula/);
    }

    // 120 burgers × 2 patties = 240 portions of 4 oz; 240 × 113.398 g = 27 215.5 g → 27.216 kg.
    // source: the formula files (portions: 2, portion: 4 oz); 1 oz = 28.349523125 g (NIST SP 811)
    const grind = await batchText(page, 'chuck-grind');
    assert.match(grind, /240 portions of 4 oz/);
    assert.match(grind, /27\.216 kg/);
    // 120 × 1 bun = 120 pieces; 120 × 3 slices × 25 g = 9000 g of sliced belly; 120 × 20 g = 2400 g
    // of sauce. source: formulas/smokehouse-burger.yaml
    assert.match(await batchText(page, 'pit-bun'), /120 pieces of 90 g/);
    assert.match(await batchText(page, 'quillmoor-belly'), /9000 g sliced/);
    assert.match(await batchText(page, 'house-sauce'), /2400 g/);

    // Milk, egg and wheat from the bun; egg and anchovy (in Worcestershire) from the sauce, the
    // species of fish named. source: 21 U.S.C. 343(w)(2); formulas/house-sauce.yaml
    assert.match(
      await page.getByTestId('plan-allergens').innerText(),
      /Contains: milk, egg, fish \(anchovy\), wheat/,
    );
    assert.match(await page.getByTestId('plan-cautions').innerText(), /Curing salt is poisonous/);
    assert.ok((await page.getByTestId('pull-item').count()) > 10, 'the pull list is filled');
    await session.screenshot(page, 'plan-page');

    // The PDF is asked for through the app's HTTP layer, with the session's CSRF token.
    const pdfRequest = page.waitForRequest((request) => request.url().endsWith('/sheet.pdf'));
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByTestId('plan-pdf').click(),
    ]);
    assert.ok((await pdfRequest).headers()['x-csrf-token'], 'the PDF request carries the token');
    assert.equal(download.suggestedFilename(), `plan-smokehouse-burger-${SERVICE}.pdf`);
    assert.equal(
      readFileSync(await download.path())
        .subarray(0, 5)
        .toString(),
      '%PDF-',
    );

    await page.getByTestId('plan-record').click();
    const recorded = page.getByTestId('plan-recorded-batch');
    await page.getByTestId('plan-recorded').waitFor();
    // The four batches of the plan, and the 120 burgers' own batch for the day of service.
    assert.equal(await recorded.count(), 5);
    const lots = await recorded.allInnerTexts();
    assert.equal(await page.getByTestId('plan-record').count(), 0, 'a plan is recorded once');
    await session.screenshot(page, 'plan-recorded');

    await page.getByTestId('plan-batch-log').click();
    await page.waitForURL(/\/batches\?status=planned$/);
    // Each recorded lot appears in the log filtered to planned batches (newest first).
    for (const lot of lots) {
      await page.locator(`[data-testid="batch-row"][data-lot="${lot}"]`).waitFor();
    }
    await session.screenshot(page, 'plan-batch-log');

    const planned = await session.server.as('tobin').get('/api/batches?status=planned&limit=100');
    const mine = (planned.json.items as { lotCode: string; notes: string; startedOn: string }[])
      .filter((batch) => lots.includes(batch.lotCode))
      .map((batch) => [batch.notes, batch.startedOn]);
    assert.equal(mine.length, 5);
    for (const [notes] of mine) assert.equal(notes, `plan: smokehouse-burger ×120 for ${SERVICE}`);
    assert.deepEqual(errors, []);
  });

  it('should warn before recording a service twice, show what is recorded, and record again only when asked', async (t) => {
    const session = await startConsole(t);
    const day = addDays(SERVICE, 7);
    // Rosa already recorded 100 burgers for that day.
    const first = await session.server.as('rosa').post('/api/plans/record', {
      assembly: 'smokehouse-burger',
      count: 100,
      for: day,
    });
    assert.equal(first.status, 201, first.text);
    const already = (first.json.batches as { lotCode: string }[]).map((b) => b.lotCode);

    const page = await session.page('tobin');
    const errors = collectConsoleErrors(page);
    await page.goto(`${session.server.url}/plans?assembly=smokehouse-burger&count=120&for=${day}`, {
      waitUntil: 'networkidle',
    });
    await page.getByTestId('plan-title').getByText('Smokehouse burger × 120').waitFor();
    await page.getByTestId('plan-record').click();
    const warning = page.getByTestId('plan-already-recorded');
    await warning.waitFor();
    assert.match(await warning.innerText(), /already recorded/);
    assert.match(await warning.innerText(), /Nothing was recorded this time/);
    assert.deepEqual(
      (await page.getByTestId('plan-already-batch').allInnerTexts()).sort(),
      [...already].sort(),
    );
    assert.equal(await page.getByTestId('plan-record').count(), 0, 'no second record button');
    // The plans made: Rosa's recorded 100, and Tobin's 120 not recorded.
    const items = page.getByTestId('plan-list-item');
    await items.filter({ hasText: '120 × Smokehouse burger' }).waitFor();
    assert.match(
      await items.filter({ hasText: '100 × Smokehouse burger' }).first().innerText(),
      /Recorded: 5 batches, by Rosa/,
    );
    assert.match(
      await items.filter({ hasText: '120 × Smokehouse burger' }).first().innerText(),
      /Not recorded/,
    );
    await shootAtWidths(session, page, 'plan-already-recorded');

    const again = page.waitForRequest((r) => r.url().endsWith('/api/plans/record'));
    await page.getByTestId('plan-record-again').click();
    assert.equal((await again).postDataJSON().again, true);
    await page.getByTestId('plan-recorded').waitFor();
    const lots = await page.getByTestId('plan-recorded-batch').allInnerTexts();
    assert.equal(lots.length, 5);
    for (const lot of lots) assert.ok(!already.includes(lot), `${lot} is a new batch`);
    await page.getByTestId('plan-already-recorded').waitFor({ state: 'detached' });
    // The list of plans made is read again once the batches are recorded.
    await items
      .filter({ hasText: '120 × Smokehouse burger' })
      .filter({ hasText: /Recorded: 5 batches, by Tobin/ })
      .waitFor();
    // The browser logs the refusal it was given; nothing else went wrong.
    assert.deepEqual(
      errors.filter((e) => !/status of 409/.test(e)),
      [],
    );
  });

  it('should offer the room and flour temperatures right in the dough warning, in plain words', async (t) => {
    const session = await startConsole(t);
    const page = await session.page('tobin');
    const errors = collectConsoleErrors(page);
    await page.goto(
      `${session.server.url}/plans?assembly=smokehouse-burger&count=120&for=${SERVICE}`,
      { waitUntil: 'networkidle' },
    );
    const warning = page.getByTestId('plan-dough-warning');
    await warning.waitFor();
    const words = await page.getByTestId('plan-warnings').innerText();
    assert.doesNotMatch(words, /--/, 'no command-line options on a cook’s screen');
    assert.match(
      words,
      /Milk and honey bun, with sponge: the water temperature is not worked out yet/,
    );
    // In plain words: no formula keys, no textbook convention.
    const bun = await batchText(page, 'pit-bun');
    assert.match(bun, /Made 1 day before service\./);
    assert.doesNotMatch(bun, /lead_days|loss\/100/);
    assert.match(await batchText(page, 'quillmoor-belly'), /Cures 8 days, then 2 days to finish/);

    await warning.getByTestId('dough-room').fill('22');
    await warning.getByTestId('dough-flour').fill('20');
    await warning.getByTestId('dough-preferment').fill('24');
    await warning.getByTestId('dough-work-out').click();
    const result = warning.getByTestId('dough-water-result');
    await result.waitFor();
    // 4 × 26 − (22 + 20 + 24) − 12.2 (the formula's 22 °F friction) = 25.8 °C, shown to 0.5 °C.
    // source: San Francisco Baking Institute, Artisan I workshop reference material (2009), the
    // desired dough temperature method; formulas/pit-bun.yaml (DDT 26 °C, friction 22 °F)
    assert.match(await result.innerText(), /Water temperature\s+26\.0 °C/);
    await shootAtWidths(session, page, 'plan-dough-warning');
    assert.deepEqual(errors, []);
  });

  it('should show a linked plan to a reviewer, without a record button', async (t) => {
    const session = await startConsole(t);
    const page = await session.page('imke');
    const errors = collectConsoleErrors(page);
    await page.goto(
      `${session.server.url}/plans?assembly=smokehouse-burger&count=120&for=${SERVICE}`,
      { waitUntil: 'networkidle' },
    );
    await page.getByTestId('plan-title').getByText('Smokehouse burger × 120').waitFor();
    assert.equal(await page.getByTestId('plan-batch').count(), 4);
    assert.equal(await page.getByTestId('plan-record').count(), 0);
    assert.equal(await page.getByTestId('plan-pdf').count(), 1);
    await session.screenshot(page, 'plan-reviewer');
    const response = await session.server.as('imke').post('/api/plans/record', {
      assembly: 'smokehouse-burger',
      count: 120,
      for: SERVICE,
    });
    assert.equal(response.status, 403, 'the server refuses a reviewer too');
    assert.deepEqual(errors, []);
  });

  it('should show why a plan cannot be made, naming the formula', async (t) => {
    const session = await startConsole(t);
    const page = await session.page('tobin');
    // Service in 3 days: the belly (8 days' hold + 2 lead days) would have to start 7 days ago.
    await page.goto(
      `${session.server.url}/plans?assembly=smokehouse-burger&count=120&for=${addDays(TODAY, 3)}`,
      { waitUntil: 'networkidle' },
    );
    const refusal = page.getByTestId('plan-refusal');
    await refusal.waitFor();
    assert.match(await refusal.innerText(), /before today/);
    // The formula by its title and the days in words: no id, no ISO date on a cook's screen.
    const message = await page.getByTestId('plan-refusal-message').innerText();
    assert.match(
      message,
      /^Quillmoor belly, dry equilibrium cure must start \d{1,2} [A-Z][a-z]{2} \d{4}, already past/,
    );
    assert.doesNotMatch(await refusal.innerText(), /\d{4}-\d{2}-\d{2}|quillmoor-belly/);
    const link = page.getByTestId('plan-refusal-formula');
    assert.equal(await link.innerText(), 'Open the formula');
    assert.match((await link.getAttribute('href')) ?? '', /\/formulas\/quillmoor-belly$/);
    assert.equal(await page.getByTestId('plan-record').count(), 0);
    await session.screenshot(page, 'plan-refused');
  });

  it('should show an assembly’s parts as a table in Formulas, with a small plan as its preview', async (t) => {
    const session = await startConsole(t);
    const page = await session.page('rosa');
    const errors = collectConsoleErrors(page);
    await page.goto(`${session.server.url}/formulas`, { waitUntil: 'networkidle' });
    await page
      .getByTestId('kind-filter')
      .getByText(/Assembly/)
      .click();
    await page.locator('[data-testid="formula-row"][data-formula-id="smokehouse-burger"]').click();
    await page.waitForURL(/\/formulas\/smokehouse-burger$/);
    const parts = page.getByTestId('assembly-part');
    await parts.first().waitFor();
    assert.equal(await parts.count(), 4);
    assert.equal(await parts.nth(0).getByTestId('part-count').inputValue(), '2');
    assert.equal(await parts.nth(2).getByTestId('part-slice').inputValue(), '25 g');
    assert.equal(await parts.nth(2).getByTestId('part-thickness').inputValue(), '4 cm');

    // A dough is counted in pieces or by finished weight, or applied to another part by percent.
    await parts.nth(1).getByTestId('part-quantity').focus();
    await page.keyboard.press('Enter');
    assert.deepEqual(await page.getByRole('option').allInnerTexts(), [
      'Pieces',
      'Finished weight',
      '% of the part it goes on',
    ]);
    await page.keyboard.press('Escape');

    // The preview plans 10 burgers two weeks ahead: 10 × 2 = 20 portions of the grind.
    const preview = page.getByTestId('assembly-preview');
    await preview.getByText('20 portions of 4 oz').waitFor();
    assert.match(
      await page.getByTestId('assembly-preview-allergens').innerText(),
      /milk, egg, fish \(anchovy\), wheat/,
    );
    await session.screenshot(page, 'assembly-formula');

    // Three patties instead of two: the YAML follows the form, line by line.
    await parts.nth(0).getByTestId('part-count').fill('3');
    await page.getByRole('tab', { name: 'YAML' }).click();
    await page.waitForFunction(() =>
      (
        document.querySelector('[data-testid="yaml-textarea"]') as HTMLTextAreaElement | null
      )?.value.includes('- { formula: chuck-grind, portions: 3 }'),
    );
    assert.deepEqual(errors, []);
  });
});
