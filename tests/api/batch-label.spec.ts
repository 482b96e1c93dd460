import assert from 'node:assert/strict';
import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { BELLY, BUN, fetchLabel, recordBatch } from '../helpers/batch-calls.ts';
import { pdfText } from '../helpers/pdf-text.ts';
import { startTestServer } from '../helpers/test-server.ts';

describe('GET /api/batches/:lot/label.pdf', () => {
  it('should print a recorded batch’s label at either size, read back with its lot code', async (t) => {
    const server = await startTestServer(t);
    const lot = await recordBatch(server.as('tobin'), BELLY);
    const big = await fetchLabel(
      server,
      `/api/batches/${lot}/label.pdf?size=4x6&net=12%20oz&packed=2026-03-02`,
    );
    assert.equal(big.status, 200);
    assert.equal(big.type, 'application/pdf');
    const text = await pdfText(big.bytes);
    // 4 × 6 in at 72 points to the inch. source: ISO 32000-1:2008, 8.3.2.3
    assert.deepEqual(text.sizes, [[288, 432]]);
    assert.ok(text.all.includes(lot), text.all);
    // The catalogue's names, heaviest first (shared/labels/product-label.spec.ts works them).
    assert.match(text.all, /Ingredients: pork, sea salt, brown sugar, black pepper, curing salt/);
    // 12 oz = 340.19 g, rounded down. source: NIST SP 811 (2008), Appendix B.8
    assert.match(text.all, /Net wt 12 oz \(340 g\)/);
    // The demo bacon is cold-smoked and sold raw: no Food Code use-by day (3-501.17 is for
    // ready-to-eat food), and the safe handling instructions. source: FDA Food Code 2022,
    // 3-501.17(A); 9 CFR 317.2(l) and 381.125(b)
    assert.doesNotMatch(text.all, /Use by/);
    assert.match(text.all, /Safe Handling Instructions This product was prepared from inspected/);
    assert.match(text.all, /KEEP REFRIGERATED/);
    assert.match(text.all, /Quillmoor Smokehouse 14 Kiln Lane, Quillmoor/);
  });

  it('should print a ready-to-eat product small, alone or 40 to a letter sheet', async (t) => {
    const server = await startTestServer(t);
    // The buns are ready to eat and no meat: no safe handling instructions to make room for.
    const lot = await recordBatch(server.as('tobin'), BUN);
    const small = await fetchLabel(server, `/api/batches/${lot}/label.pdf?size=2x1`);
    assert.equal(small.status, 200);
    const smallText = await pdfText(small.bytes);
    assert.deepEqual(smallText.sizes, [[144, 72]]);
    assert.ok(smallText.all.includes(`Lot ${lot}`), smallText.all);

    // A letter sheet of 40 small labels, 8.5 × 11 in (from memory; label-pdf.ts's own grid).
    const sheet = await fetchLabel(server, `/api/batches/${lot}/label.pdf?size=letter`);
    assert.equal(sheet.status, 200);
    const sheetText = await pdfText(sheet.bytes);
    assert.deepEqual(sheetText.sizes, [[612, 792]]);
    assert.equal(sheetText.all.split(`Lot ${lot}`).length - 1, 40);
  });

  // The words of the safe handling instructions need 3.57 square inches at 1/16 in lettering; a
  // 2 × 1 in label has 2 (shared/labels/label-sizes.ts, tests/pdf/label-fit.spec.ts).
  // source: 9 CFR 381.125(b)(1)(i) (read, 2019 CFR); 9 CFR 317.2(l) for meat, from memory
  it('should refuse the raw bacon a small label, too small for its safe handling instructions', async (t) => {
    const server = await startTestServer(t);
    const tobin = server.as('tobin');
    const lot = await recordBatch(tobin, BELLY);
    for (const size of ['2x1', 'letter', 'a4']) {
      const response = await tobin.get(`/api/batches/${lot}/label.pdf?size=${size}`);
      assert.equal(response.status, 422, size);
      assert.equal(response.json.error.code, 'too-small-for-safe-handling');
      assert.match(
        response.json.error.message,
        /too small for the safe handling instructions this raw or not-ready-to-eat product must carry: print the 4 × 6 in label$/,
      );
    }
    const view = (await tobin.get(`/api/batches/${lot}/label`)).json;
    assert.deepEqual(
      view.sizes.map((s: { size: string; refused?: string }) => [s.size, s.refused !== undefined]),
      [
        ['4x6', false],
        ['2x1', true],
        ['letter', true],
        ['a4', true],
      ],
    );
  });

  // A sticker's words are set at 9 points, lower-case letters 1/16 in tall (21 CFR 101.2(c), from
  // memory past "in no case may the letter…"; 9 CFR 381.125(b)(1)(i), read), set solid at Fira
  // Sans's 1.2 em: 10.8 points a line, 66 points of room in a 1 in label less 3 at top and foot.
  // A name of four lines (46.8 points) and the lot and packed-on lines (21.6) need 68.4.
  it('should refuse a lot and date sticker whose name leaves no room, and offer none', async (t) => {
    const server = await startTestServer(t);
    const tobin = server.as('tobin');
    const bun = readFileSync(path.join(server.formulasDir, 'pit-bun.yaml'), 'utf8')
      .replace('id: pit-bun', 'id: pit-bun-long')
      .replace(
        /^title: .*$/m,
        'title: Milk and honey bun, with sponge, brushed with butter and honey, split and ' +
          'toasted for the pit-house sandwich',
      );
    writeFileSync(path.join(server.formulasDir, 'pit-bun-long.yaml'), bun);
    const lot = await recordBatch(tobin, { ...BUN, formula: 'pit-bun-long' });
    const words =
      "the product's name, lot and days do not fit on a 2 × 1 in lot and date sticker with " +
      'letters no smaller than the labelling rules allow (1/16 in)';
    for (const size of ['2x1', 'letter', 'a4']) {
      const response = await tobin.get(`/api/batches/${lot}/label.pdf?size=${size}`);
      assert.equal(response.status, 422, size);
      assert.equal(response.json.error.code, 'label-too-full');
      assert.equal(response.json.error.message, words);
    }
    const view = (await tobin.get(`/api/batches/${lot}/label`)).json;
    const refusal = words.charAt(0).toUpperCase() + words.slice(1);
    assert.deepEqual(view.sizes, [
      { size: '4x6' },
      { size: '2x1', refused: refusal },
      { size: 'letter', refused: refusal },
      { size: 'a4', refused: refusal },
    ]);
  });

  it('should give the label’s content for the preview, the net weight optional', async (t) => {
    const server = await startTestServer(t);
    const lot = await recordBatch(server.as('tobin'), BELLY);
    const preview = await server.as('rosa').get(`/api/batches/${lot}/label?packed=2026-03-02`);
    assert.equal(preview.status, 200);
    const view = preview.json;
    assert.equal(view.lotCode, lot);
    assert.equal(view.net, undefined);
    assert.match(view.ingredients, /^Ingredients: pork, sea salt/);
    assert.match(view.useBy.none, /not ready to eat/);
    assert.equal(view.handling, 'Keep refrigerated');
    // source: 9 CFR 381.125(b)(2) (read, 2019 CFR), the heading
    assert.equal(view.instructions.heading, 'Safe Handling Instructions');
    assert.equal(view.instructions.statements.length, 4);
  });

  it('should refuse a label it cannot print, saying why', async (t) => {
    const server = await startTestServer(t);
    const tobin = server.as('tobin');
    const lot = await recordBatch(tobin, BELLY);
    const refusals: [string, number, RegExp][] = [
      [`/api/batches/${lot}/label.pdf`, 400, /declares the net weight of the package/],
      [`/api/batches/${lot}/label.pdf?size=4x6&net=plenty`, 400, /the net weight/],
      [`/api/batches/${lot}/label.pdf?size=4x6&net=0%20g`, 400, /more than 0/],
      [`/api/batches/${lot}/label.pdf?size=3x5&net=1%20lb`, 400, /4x6 or 2x1/],
      [`/api/batches/${lot}/label.pdf?size=2x1&packed=March`, 400, /a date such as/],
      ['/api/batches/261202-QB-99/label.pdf?size=2x1', 404, /./],
    ];
    for (const [route, status, words] of refusals) {
      const response = await tobin.get(route);
      assert.equal(response.status, status, route);
      assert.match(response.json.error.message, words, route);
    }
    const planned = await recordBatch(tobin, { ...BELLY, status: 'planned' });
    const early = await tobin.get(`/api/batches/${planned}/label.pdf?size=2x1`);
    assert.equal(early.status, 409);
    assert.match(early.json.error.message, /planned, not made yet/);
  });
});
