import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { Page } from 'playwright-core';
import { collectConsoleErrors, startConsole } from './browser.ts';
import { shootAtWidths } from './screens.ts';

/** Replaces text in the YAML editor, as someone typing into it would. */
async function editYaml(page: Page, from: string, to: string): Promise<void> {
  await page.getByRole('tab', { name: 'YAML' }).click();
  const editor = page.getByTestId('yaml-textarea');
  const text = await editor.inputValue();
  assert.ok(text.includes(from), `the YAML holds "${from}"`);
  await editor.fill(text.replace(from, to));
}

describe('formulas in the console', () => {
  it('should let an admin edit a formula, see the preview change and a revision appear', async (t) => {
    const session = await startConsole(t);
    const page = await session.page('rosa');
    const errors = collectConsoleErrors(page);
    await page.goto(`${session.server.url}/formulas`, { waitUntil: 'networkidle' });
    await page.locator('[data-testid="formula-row"][data-formula-id="quillmoor-belly"]').click();
    await page.waitForURL(/\/formulas\/quillmoor-belly$/);
    const sheet = page.getByTestId('result-sheet');
    // The preview's sample belly; 0.25 % curing salt of a 6.25 % mix is 156.25 ppm → "156.3 ppm".
    // source: USDA FSIS Directive 7620.3 ch. 3 (dry cure: nitrite × 10^6 / green weight)
    await sheet.getByText('156.3 ppm').first().waitFor();
    await session.screenshot(page, 'formula-page');
    // An admin, who works with the files, reads the file's name in words, not the id as code.
    assert.equal(
      await page.getByRole('heading', { level: 1 }).innerText(),
      'Quillmoor belly, dry equilibrium cure',
    );
    assert.equal(
      await page.getByTestId('formula-file-name').innerText(),
      'File: quillmoor-belly.yaml',
    );
    assert.equal(await page.locator('.head code').count(), 0);
    const revisionsBefore = await page.getByTestId('history-row').count();

    // 0.24 % instead of 0.25 %: 0.24 × 0.0625 × 10^4 = 150.0 ppm (same source)
    await editYaml(page, 'pct: 0.25, nitrite: 6.25', 'pct: 0.24, nitrite: 6.25');
    await sheet.getByText('150.0 ppm').first().waitFor();
    await page.getByTestId('save-message').fill('Less curing salt for the thin bellies');
    await page.getByTestId('save-formula').click();
    await page.getByTestId('save-result').waitFor();
    await page.waitForFunction(
      (n) => document.querySelectorAll('[data-testid="history-row"]').length > n,
      revisionsBefore,
    );
    const history = await page.getByTestId('history-list').innerText();
    assert.match(history, /Less curing salt for the thin bellies/);
    // The revision in words, not a hash: who edited it and where. source: the demo crew's names
    // (server/demo/demo-people.ts)
    assert.match(history, /Edited in the console by Rosa Quennick/);
    assert.doesNotMatch(history, /\b[0-9a-f]{8}\b/, 'no hashes in the history');
    const saved = await session.server.as('rosa').get('/api/formulas/quillmoor-belly');
    assert.match(saved.json.yaml, /pct: 0\.24, nitrite: 6\.25/);
    assert.match(saved.json.yaml, /# Quillmoor Smokehouse/, 'the file keeps its comments');
    assert.deepEqual(errors, []);
  });

  it('should show the conflict when someone else saved the formula first', async (t) => {
    const session = await startConsole(t);
    const page = await session.page('rosa');
    await page.goto(`${session.server.url}/formulas/brisket-rub`, { waitUntil: 'networkidle' });
    await page.getByTestId('result-sheet').waitFor();

    // Meanwhile another admin saves the same formula through the API.
    const current = await session.server.as('rosa').get('/api/formulas/brisket-rub');
    const other = await session.server
      .as('rosa')
      .request(
        'PUT',
        '/api/formulas/brisket-rub',
        { yaml: current.json.yaml.replace('pct: 12', 'pct: 14'), message: 'More paprika' },
        { 'if-match': current.headers.get('etag') ?? '' },
      );
    assert.equal(other.status, 200);

    await editYaml(page, 'pct: 3 }', 'pct: 4 }');
    await page.getByTestId('save-message').fill('More cayenne');
    await page.getByTestId('save-formula').click();
    const conflict = page.getByTestId('save-conflict');
    await conflict.waitFor();
    assert.match(await conflict.innerText(), /Someone else saved this formula/);
    await session.screenshot(page, 'formula-conflict');
    const after = await session.server.as('rosa').get('/api/formulas/brisket-rub');
    assert.match(after.json.yaml, /pct: 14/, 'their save stands');
    assert.match(after.json.yaml, /pct: 3 }/, 'ours was not written over it');
  });

  it('should show formulas read-only to a cook', async (t) => {
    const session = await startConsole(t);
    const page = await session.page('tobin');
    await page.goto(`${session.server.url}/formulas`, { waitUntil: 'networkidle' });
    await page.getByTestId('formula-row').first().waitFor();
    assert.equal(await page.getByTestId('new-formula').count(), 0);
    await session.screenshot(page, 'formula-list');
    await page.goto(`${session.server.url}/formulas/pit-bun`, { waitUntil: 'networkidle' });
    await page.getByTestId('result-sheet').waitFor();
    assert.equal(await page.getByTestId('save-formula').count(), 0);
    // The recipe is headed by its title; its id or file name is nowhere a cook reads.
    assert.equal(
      await page.getByRole('heading', { level: 1 }).innerText(),
      'Milk and honey bun, with sponge',
    );
    assert.doesNotMatch(await page.locator('app-formula-page').innerText(), /pit-bun/);
  });

  it('should keep Save in reach at the foot of the screen, with the problem count beside it', async (t) => {
    const session = await startConsole(t);
    const page = await session.page('rosa');
    const errors = collectConsoleErrors(page);
    await page.goto(`${session.server.url}/formulas/quillmoor-belly`, { waitUntil: 'networkidle' });
    await page.getByTestId('result-sheet').waitFor();
    const bar = page.getByTestId('save-bar');
    const count = page.getByTestId('save-problem-count');
    assert.match(await count.innerText(), /No problems/);
    // With nothing to save the bar is a line, not a third of a phone's screen.
    await page.setViewportSize({ width: 390, height: 844 });
    assert.equal(await page.getByTestId('save-message').count(), 0);
    // The page reflows after the resize (the navigation folds away): measure once it has settled.
    await page
      .waitForFunction(
        () =>
          (document.querySelector('[data-testid=save-bar]')?.getBoundingClientRect().height ??
            999) < 130,
        undefined,
        { timeout: 5000 },
      )
      .catch(() => undefined);
    const barHeight = (await bar.boundingBox())?.height ?? 999;
    assert.ok(barHeight < 130, `a short save bar on a phone, not ${barHeight} px`);
    await page.setViewportSize({ width: 1280, height: 860 });
    // At the top of a long form the bar is held at the foot of the window, not below the fold.
    const inView = async (): Promise<boolean> => {
      const box = await bar.boundingBox();
      const height = page.viewportSize()?.height ?? 0;
      return box !== null && box.y >= 0 && box.y + box.height <= height + 1;
    };
    await page.getByRole('heading', { name: 'Formula', exact: true }).scrollIntoViewIfNeeded();
    assert.ok(await inView(), 'the save bar is on screen at the top of the form');
    // A name column wide enough to read the curing salt's whole name.
    const name = page.getByRole('textbox', { name: 'Name, row 2' });
    const fits = await name.evaluate(
      (input: HTMLInputElement) => input.scrollWidth <= input.clientWidth,
    );
    assert.ok(fits, 'the ingredient name is not cut off');

    await editYaml(page, 'pct: 0.25, nitrite: 6.25', 'pct: lots, nitrite: 6.25');
    await page.waitForFunction(() =>
      /error/.test(document.querySelector('[data-testid="save-problem-count"]')?.textContent ?? ''),
    );
    assert.match(await count.innerText(), /^\S*\s*\d+ errors?/);
    assert.ok(await inView(), 'the count is beside Save while the YAML is edited');
    await shootAtWidths(session, page, 'formula-save-bar');
    // The count leads to the problem.
    await count.click();
    await page.getByRole('tab', { name: 'YAML', selected: true }).waitFor();
    await editYaml(page, 'pct: lots, nitrite: 6.25', 'pct: 0.25, nitrite: 6.25');
    await page.waitForFunction(() =>
      /No problems/.test(
        document.querySelector('[data-testid="save-problem-count"]')?.textContent ?? '',
      ),
    );
    // The preview of the broken file was refused (422), as it should be; nothing else went wrong.
    assert.deepEqual(
      errors.filter((e) => !/status of 422/.test(e)),
      [],
    );
  });

  it('should show a cook the formula as a recipe to read, not a greyed-out form', async (t) => {
    const session = await startConsole(t);
    const page = await session.page('tobin');
    const errors = collectConsoleErrors(page);
    await page.goto(`${session.server.url}/formulas/quillmoor-belly`, { waitUntil: 'networkidle' });
    const recipe = page.getByTestId('formula-recipe');
    await recipe.waitFor();
    const text = await recipe.innerText();
    // source: formulas/quillmoor-belly.yaml (the cure, the hold rule, the controls)
    assert.match(text, /fine sea salt\s+2\.25 %/);
    assert.match(text, /curing salt no\. 1 \(6\.25 % nitrite\)\s+0\.25 %/);
    assert.match(text, /Cure 2 days per cm of thickness, at least 7 days in all/);
    assert.match(text, /Curing cooler/);
    // The smoker's own limit, 30 °C = 86 °F. source: °F = °C × 9/5 + 32 (NIST SP 811)
    assert.match(text, /at most 30 °C \(86 °F\)/);
    assert.match(text, /Skin the bellies and square them off/);
    // No form to look at: no boxes, no Save.
    assert.equal(await page.getByRole('textbox', { name: 'Name, row 1' }).count(), 0);
    assert.equal(await page.getByTestId('save-formula').count(), 0);
    // The last change in words, never a hash.
    const facts = await page.locator('.facts').innerText();
    assert.doesNotMatch(facts, /revision|\b[0-9a-f]{8}\b/);
    await page.getByTestId('result-sheet').waitFor();
    await shootAtWidths(session, page, 'formula-recipe');
    assert.deepEqual(errors, []);
  });

  it('should list the formulas by title and find them by a word of the title', async (t) => {
    const session = await startConsole(t);
    const page = await session.page('tobin');
    await page.goto(`${session.server.url}/formulas`, { waitUntil: 'networkidle' });
    const rows = page.getByTestId('formula-row');
    await rows.first().waitFor();
    const titles = await page.locator('[data-testid="formula-row"] .title').allInnerTexts();
    const sorted = [...titles].sort((a, b) =>
      a.localeCompare(b, 'en', { sensitivity: 'base', numeric: true }),
    );
    assert.deepEqual(titles, sorted, 'by title');
    assert.ok(titles.length >= 10, 'every demo formula is listed');
    await page.getByTestId('formula-search').fill('burger');
    await page.waitForFunction(
      () => document.querySelectorAll('[data-testid="formula-row"]').length === 2,
    );
    // source: formulas/smokehouse-burger.yaml and chuck-grind.yaml, the two titles with "burger"
    assert.deepEqual(await page.locator('[data-testid="formula-row"] .title').allInnerTexts(), [
      'Smokehouse burger',
      'Smokehouse burger grind 80/20',
    ]);
    await shootAtWidths(session, page, 'formula-list-search');
    await page.getByTestId('formula-search').fill('no such thing');
    await page.getByTestId('formula-none-found').waitFor();
  });
});
