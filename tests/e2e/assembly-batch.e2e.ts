// A pack of sliced bacon made as a batch of its own, as a cook records it: chosen on Record a
// batch with the number of packs, made from the belly batch the console suggests, then traced
// back through that belly batch to the belly lot it was cured from.
import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { TraceAnswer } from '../../shared/api/trace-record.ts';
import { choose, collectConsoleErrors, startConsole } from './browser.ts';
import { shootAtWidths } from './screens.ts';

describe('an assembly recorded as a batch in the console', () => {
  it('should record a dozen bacon packs, make them from the suggested belly batch and trace them back to its lot', async (t) => {
    const session = await startConsole(t);
    const { server } = session;
    const page = await session.page('tobin');
    const errors = collectConsoleErrors(page);

    // 1. Record a batch: the pack, 12 of them; the preview lists the belly they take.
    await page.goto(`${server.url}/batches/new`, { waitUntil: 'networkidle' });
    await choose(page, 'record-formula', /Sliced bacon, 200 g pack/);
    await page.getByTestId('record-field-count').fill('12');
    // 12 packs × 8 slices × 25 g = 2 400 g of sliced belly. source: formulas/bacon-pack.yaml
    const preview = page.getByTestId('record-preview');
    await preview.getByText('2400 g').first().waitFor();
    assert.match(await preview.innerText(), /Quillmoor belly, dry equilibrium cure/);
    assert.match(await page.getByTestId('record-status').innerText(), /Made: put together/);
    await shootAtWidths(session, page, 'assembly-record');
    await page.getByTestId('record-submit').click();
    await page.waitForURL(/\/batches\/\d{6}-BP-\d{2}#made-from$/);
    const lot = /\d{6}-BP-\d{2}/.exec(page.url())![0];
    await page.getByTestId('batch-status').getByText('Done').waitFor();
    assert.equal(await page.getByTestId('batch-units').innerText(), '12');

    // 2. Made from: the belly batch suggested, first ready first, for its 2.4 kg.
    const suggested = await server.as('tobin').get(`/api/batches/${lot}/lots`);
    const belly = suggested.json.suggested[0].takes[0].lotCode as string;
    const madeFrom = page.getByTestId('made-from');
    const part = madeFrom.getByTestId('lots-of-quillmoor-belly');
    assert.match(await part.innerText(), /Needs 2\.4 kg/);
    assert.match(await part.innerText(), new RegExp(belly));
    await shootAtWidths(session, page, 'assembly-made-from');
    // Until its parts are recorded the pack has no label: it lists what went into each part.
    assert.match(
      await page.getByTestId('label-error').innerText(),
      /record the batches this .* was made from first/,
    );
    await madeFrom.getByTestId('use-these-lots').click();
    const used = madeFrom.getByTestId('lots-used');
    await used.waitFor();
    assert.match(await used.innerText(), new RegExp(`${belly}[\\s\\S]*made here[\\s\\S]*2\\.4 kg`));
    // The label follows at once, with no reload: the part's own ingredients in parentheses.
    await page.getByTestId('label-ingredients').waitFor({ timeout: 10_000 });
    assert.match(
      await page.getByTestId('label-ingredients').innerText(),
      /Quillmoor belly, dry equilibrium cure \(pork/,
    );
    assert.equal(await page.getByTestId('label-error').count(), 0);
    await shootAtWidths(session, page, 'assembly-batch-page');

    // 3. Its trace back: the pack ← the belly batch ← the belly's received lot.
    const behind = await server.as('tobin').get(`/api/trace/back/${belly}`);
    const receipts = (behind.json as TraceAnswer).roots[0].children.filter(
      (node) => node.lot.kind === 'receipt' && node.lot.item === 'pork-belly',
    );
    assert.ok(receipts.length > 0, 'the demo belly batch has its belly lot');
    await madeFrom.getByTestId('trace-this-batch').click();
    await page.waitForURL(new RegExp(`/trace\\?lot=${lot}`));
    const back = page.getByTestId('trace-back');
    await back.getByRole('link', { name: new RegExp(belly) }).waitFor();
    const text = await back.innerText();
    for (const node of receipts) {
      const receipt = node.lot;
      assert.ok(receipt.kind === 'receipt');
      assert.match(text, new RegExp(`${receipt.lotCode}[\\s\\S]*lot ${receipt.supplierLot}`));
    }
    await shootAtWidths(session, page, 'assembly-trace');
    assert.deepEqual(errors, []);
  });
});
