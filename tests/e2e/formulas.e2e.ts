import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { Page } from 'playwright-core';
import { collectConsoleErrors, startConsole } from './browser.ts';

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
    assert.match(
      await page.getByTestId('history-list').innerText(),
      /Less curing salt for the thin bellies/,
    );
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
  });
});
