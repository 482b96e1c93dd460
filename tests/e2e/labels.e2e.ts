import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import { describe, it } from 'node:test';
import {
  BACON_PACK,
  madeBatch,
  madeFrom,
  writeAssembly,
} from '../helpers/assembly-label-fixture.ts';
import { recordAssembly } from '../helpers/lot-use-fixture.ts';
import { pdfText } from '../helpers/pdf-text.ts';
import type { Page } from 'playwright-core';
import { collectConsoleErrors, startConsole, ARTIFACTS, type ConsoleSession } from './browser.ts';
import { shootAtWidths } from './screens.ts';
import path from 'node:path';

const TODAY = new Date().toISOString().slice(0, 10);

/**
 * The house sauce's statement worked by hand from formulas/house-sauce.yaml: mayonnaise 100 %,
 * chili sauce 25 %, dill pickle brine 8 %, Worcestershire sauce 3 %, smoked paprika 1.5 %,
 * granulated garlic 0.8 %, fine black pepper 0.5 % of the mayonnaise — heaviest first, each named
 * as formulas/catalogue.yaml labels it, a compound ingredient's own ingredients in parentheses.
 * source: 21 CFR 101.4(a)(1) and (b)(2)(i); 9 CFR 317.2(f), from memory
 */
const STATEMENT =
  'Ingredients: mayonnaise (soybean oil, water, egg yolks, distilled vinegar, salt, sugar, ' +
  'lemon juice concentrate), chili sauce (tomato concentrate, sugar, distilled vinegar, salt, ' +
  'onion, red pepper, spices), dill pickle brine (water, distilled vinegar, salt, dill, garlic), ' +
  'Worcestershire sauce (distilled vinegar, molasses, water, sugar, onions, anchovies, salt, ' +
  'garlic, cloves, tamarind extract, natural flavorings), smoked paprika, dehydrated garlic, ' +
  'black pepper';

/**
 * The label section alone at every width, to look at closely (the page shots are long). The
 * window is made tall enough for the whole section: the page scrolls inside its frame, and a
 * picture of an element is cut at the window's foot.
 */
async function shootSection(page: Page, name: string): Promise<void> {
  for (const width of [1280, 820, 390]) {
    await page.setViewportSize({ width, height: 2400 });
    await page
      .locator('section.product-label')
      .screenshot({ path: path.join(ARTIFACTS, `${name}-section-${width}.png`) });
  }
  await page.setViewportSize({ width: 1280, height: 860 });
}

/** Records a batch of the house sauce, ready to eat and held cold, as Tobin; returns its lot. */
async function recordSauce(session: ConsoleSession): Promise<string> {
  const recorded = await session.server.as('tobin').post('/api/batches', {
    formula: 'house-sauce',
    batch: { total: '2 kg', start: TODAY },
  });
  assert.equal(recorded.status, 201, recorded.text);
  return recorded.json.batch.lotCode as string;
}

/** Records a batch of the raw bacon started today, as Tobin; returns its lot code. */
async function recordRawBacon(session: ConsoleSession): Promise<string> {
  const recorded = await session.server.as('tobin').post('/api/batches', {
    formula: 'quillmoor-belly',
    batch: { meat: '4.26kg', thickness: '4cm', start: TODAY },
  });
  assert.equal(recorded.status, 201, recorded.text);
  return recorded.json.batch.lotCode as string;
}

describe('product labels in the console', () => {
  it('should preview a batch’s label, print it and read the PDF back', async (t) => {
    const session = await startConsole(t);
    const lot = await recordSauce(session);

    const page = await session.page('tobin');
    const errors = collectConsoleErrors(page);
    await page.goto(`${session.server.url}/batches/${lot}`, { waitUntil: 'networkidle' });
    await page.getByTestId('label-caution').waitFor();
    assert.match(await page.getByTestId('label-caution').innerText(), /FSIS label approval/);

    await page.getByTestId('label-net').fill('250 g');
    await page.getByTestId('label-packed').fill('2026-03-02');
    // Ready to eat and held cold: use by day 7, the packed day counted as day 1.
    // source: FDA Food Code 2022, 3-501.17(A)
    await page.getByTestId('label-use-by').filter({ hasText: '8 Mar 2026' }).waitFor();
    const preview = page.getByTestId('label-preview');
    assert.equal((await page.getByTestId('label-ingredients').innerText()).trim(), STATEMENT);
    // source: 21 U.S.C. 343(w)(1)(A) and (w)(2): "Contains" and the species of fish
    assert.equal(
      (await page.getByTestId('label-contains').innerText()).trim(),
      'Contains: egg, fish (anchovy)',
    );
    assert.equal(await page.getByTestId('label-shi').count(), 0);
    await preview.scrollIntoViewIfNeeded();
    await shootAtWidths(session, page, 'label-preview');
    await shootSection(page, 'label-preview');

    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByTestId('label-print').click(),
    ]);
    assert.equal(download.suggestedFilename(), `${lot}-label-4x6.pdf`);
    const text = await pdfText(readFileSync(await download.path()));
    // 4 × 6 in at 72 points to the inch. source: ISO 32000-1:2008, 8.3.2.3
    assert.deepEqual(text.sizes, [[288, 432]]);
    assert.ok(text.all.includes(STATEMENT), text.all);
    assert.ok(text.all.includes('Contains: egg, fish (anchovy)'), text.all);
    assert.match(text.all, /Use by 8 Mar 2026/);
    // 250 g is 8.8 oz, rounded down. source: NIST SP 811 (2008), Appendix B.8
    assert.match(text.all, /Net wt 8\.8 oz \(250 g\)/);
    assert.deepEqual(errors, []);
  });

  it('should print the sauce’s lot and date stickers on a letter sheet, every word at 9 points', async (t) => {
    const session = await startConsole(t);
    const lot = await recordSauce(session);
    const page = await session.page('tobin');
    const errors = collectConsoleErrors(page);
    await page.goto(`${session.server.url}/batches/${lot}`, { waitUntil: 'networkidle' });
    await page.getByTestId('label-packed').fill('2026-03-02');
    await page.getByTestId('label-size').click();
    await page.getByRole('option', { name: /^Letter sheet, 40 stickers$/ }).click();
    await page.getByRole('listbox').waitFor({ state: 'detached' });
    // The sticker says what it is, and that it is not the package label.
    assert.match(
      await page.getByTestId('label-size-about').innerText(),
      /^A lot and date sticker: .* It is not the package label: it goes with the full label on the pack or carton\.$/,
    );
    assert.match(
      await page.getByTestId('label-sticker-note').innerText(),
      /Goes with the full label on the pack or carton\.$/,
    );
    // Ready to eat and held cold: use by day 7, the packed day counted as day 1.
    // source: FDA Food Code 2022, 3-501.17(A)
    await page.getByTestId('label-use-by').filter({ hasText: '8 Mar 2026' }).waitFor();
    assert.equal(await page.getByTestId('label-handling').innerText(), 'Keep refrigerated');
    assert.equal(await page.getByTestId('label-ingredients').count(), 0);
    // A sticker declares no net weight, so none is asked for.
    assert.equal(await page.getByTestId('label-net').count(), 0);
    await page.getByTestId('label-preview').scrollIntoViewIfNeeded();
    await shootAtWidths(session, page, 'label-preview-sticker');
    await shootSection(page, 'label-preview-sticker');
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByTestId('label-print').click(),
    ]);
    assert.equal(download.suggestedFilename(), `${lot}-label-letter.pdf`);
    const text = await pdfText(readFileSync(await download.path()));
    // Letter paper, 8.5 × 11 in at 72 points to the inch (from memory; ISO 32000-1:2008, 8.3.2.3)
    assert.deepEqual(text.sizes, [[612, 792]]);
    assert.equal(text.all.split(`Lot ${lot}`).length - 1, 40);
    // 9 points of Fira Sans: lower-case letters 1/16 in tall (tests/pdf/label-lettering.spec.ts).
    assert.equal(Math.min(...text.items.map((item) => item.size)), 9);
    assert.match(text.all, /Goes with the full label on the pack or carton/);
    assert.deepEqual(errors, []);
  });

  it('should show the raw bacon’s safe handling instructions and no use-by day', async (t) => {
    const session = await startConsole(t);
    const lot = await recordRawBacon(session);
    const page = await session.page('rosa');
    const errors = collectConsoleErrors(page);
    await page.goto(`${session.server.url}/batches/${lot}`, { waitUntil: 'networkidle' });
    const shi = page.getByTestId('label-shi');
    await shi.waitFor();
    // source: 9 CFR 381.125(b)(2)–(3) (read, 2019 CFR and 1-1-06 edition); 317.2(l) for meat
    assert.match(await shi.innerText(), /^Safe Handling Instructions\s+This product was prepared/);
    assert.equal(await page.getByTestId('label-use-by').count(), 0);
    assert.match(await page.getByTestId('label-notes').innerText(), /No use-by day: not ready/);
    await shootSection(page, 'label-preview-raw-4x6');
    // Without a net weight, the 4 × 6 label is not offered.
    assert.match(await page.getByTestId('label-problem').innerText(), /net weight/);
    // The small sizes have no room for the instructions the raw bacon must carry: each is
    // offered as unavailable, and the notes say why (shared/labels/label-sizes.ts).
    assert.match(
      await page.getByTestId('label-small-refused').innerText(),
      /^A 2 × 1 in label is too small for the safe handling instructions this raw or not-ready-to-eat product must carry: print the 4 × 6 in label\.$/,
    );
    await page.getByTestId('label-size').click();
    for (const name of ['2 × 1 in', 'Letter sheet', 'A4 sheet']) {
      const option = page.getByRole('option', { name: new RegExp(`^${name}`) });
      assert.equal(await option.getAttribute('aria-disabled'), 'true', name);
      assert.match(await option.innerText(), /not for this product, see why below$/);
    }
    await shootAtWidths(session, page, 'label-preview-raw-sizes');
    await page.keyboard.press('Escape');
    // The list of sizes closes with an animation; the screenshots wait for it to go.
    await page.getByRole('listbox').waitFor({ state: 'detached' });
    // The list on a phone, where each size's note must wrap, not run off the edge.
    await page.setViewportSize({ width: 390, height: 860 });
    await page.getByTestId('label-size').scrollIntoViewIfNeeded();
    await page.getByTestId('label-size').click();
    await page.getByRole('listbox').waitFor();
    await page.screenshot({
      path: path.join(ARTIFACTS, 'label-preview-raw-sizes-list-390.png'),
      animations: 'disabled',
    });
    await page.keyboard.press('Escape');
    await page.getByRole('listbox').waitFor({ state: 'detached' });
    await page.setViewportSize({ width: 1280, height: 860 });
    await page.getByTestId('label-net').fill('12 oz');
    await page.getByTestId('label-print').waitFor();
    await shootAtWidths(session, page, 'label-preview-raw');
    await shootSection(page, 'label-preview-raw');
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByTestId('label-print').click(),
    ]);
    const text = await pdfText(readFileSync(await download.path()));
    assert.deepEqual(text.sizes, [[288, 432]]);
    assert.match(text.all, /Safe Handling Instructions/);
    assert.deepEqual(errors, []);
  });

  it('should offer no 4 × 6 label the kitchen’s long address crowds out, saying to shorten it', async (t) => {
    // An address of two lines at 9 points (the least lettering a label's words may have, 1/16 in
    // lower-case letters: tests/pdf/label-lettering.spec.ts) leaves the raw bacon's statement no
    // room above its safe handling box; on the name's line it would fit.
    const session = await startConsole(t, {
      env: {
        LARDER_KITCHEN_ADDRESS:
          '14 Kiln Lane, behind the old tannery yard, Quillmoor, Marsh County 00000',
      },
    });
    const lot = await recordRawBacon(session);
    const page = await session.page('rosa');
    const errors = collectConsoleErrors(page);
    await page.goto(`${session.server.url}/batches/${lot}`, { waitUntil: 'networkidle' });
    await page.getByTestId('label-net').fill('12 oz');
    const problem = page.getByTestId('label-problem');
    await problem.waitFor();
    assert.equal(
      await problem.innerText(),
      'The ingredient statement does not fit on a 4 × 6 label beside everything else it must ' +
        'say, with letters no smaller than the labelling rules allow (1/16 in): shorten the ' +
        "kitchen's address to fit on one line with its name.",
    );
    assert.equal(await page.getByTestId('label-print').count(), 0);
    await shootAtWidths(session, page, 'label-preview-too-long');
    await shootSection(page, 'label-preview-too-long');
    await page.getByTestId('label-size').click();
    const option = page.getByRole('option', { name: /^4 × 6 in/ });
    assert.equal(await option.getAttribute('aria-disabled'), 'true');
    assert.match(await option.innerText(), /this label is too long for it$/);
    await page.keyboard.press('Escape');
    await page.getByRole('listbox').waitFor({ state: 'detached' });
    assert.deepEqual(errors, []);
  });

  it('should label a pack of bacon made from a belly batch, its net weight worked out', async (t) => {
    const session = await startConsole(t);
    const { server } = session;
    writeAssembly(server, BACON_PACK.formula, BACON_PACK.lines);
    const belly = await madeBatch(server, 'quillmoor-belly', {
      meat: '4.26kg',
      thickness: '4cm',
      start: TODAY,
    });
    const packs = await recordAssembly(server, BACON_PACK.formula.id, TODAY);
    await madeFrom(server, packs, [['quillmoor-belly', belly, '3 kg']]);
    const page = await session.page('rosa');
    const errors = collectConsoleErrors(page);
    // Every request the batch page makes answers without a fault (its cost among them).
    const failed: string[] = [];
    page.on('response', (response) => {
      if (response.status() >= 500) failed.push(new URL(response.url()).pathname);
    });
    await page.goto(`${server.url}/batches/${packs}`, { waitUntil: 'networkidle' });
    await page.getByTestId('label-shi').waitFor();
    // The pack's one part, a compound ingredient with its own ingredients in parentheses.
    // source: 21 CFR 101.4(b)(2)(i); the belly's list worked by hand in
    // shared/labels/product-label.spec.ts
    assert.equal(
      (await page.getByTestId('label-ingredients').innerText()).trim(),
      'Ingredients: Quillmoor belly, dry equilibrium cure (pork, sea salt, brown sugar, ' +
        'black pepper, curing salt (salt, sodium nitrite))',
    );
    // 12 × 25 g = 300 g = 10.58 oz, rounded down. source: NIST SP 811 (2008), Appendix B.8
    assert.equal(await page.getByTestId('label-net-text').innerText(), 'Net wt 10.5 oz (300 g)');
    assert.match(await page.getByTestId('label-net-note').innerText(), /one unit by its formula/);
    await page.getByTestId('label-preview').scrollIntoViewIfNeeded();
    await shootAtWidths(session, page, 'label-preview-assembly');
    await shootSection(page, 'label-preview-assembly');
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByTestId('label-print').click(),
    ]);
    const text = await pdfText(readFileSync(await download.path()));
    assert.deepEqual(text.sizes, [[288, 432]]);
    assert.match(text.all, /Ingredients: Quillmoor belly, dry equilibrium cure \(pork, sea salt/);
    assert.match(text.all, /Net wt 10\.5 oz \(300 g\)/);
    assert.match(text.all, /Safe Handling Instructions/);
    assert.deepEqual(failed, []);
    assert.deepEqual(errors, []);
  });
});
