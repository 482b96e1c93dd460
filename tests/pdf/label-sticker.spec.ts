import assert from 'node:assert/strict';
import { mkdirSync, writeFileSync } from 'node:fs';
import { describe, it } from 'node:test';
import { renderLabelPdf } from '../../server/pdf/label-pdf.ts';
import type { ProductLabel } from '../../shared/labels/product-label.ts';
import { demoLabel } from '../helpers/demo-label.ts';
import { pdfText, type PdfText } from '../helpers/pdf-text.ts';

// The small labels are lot and date stickers, every word set with lower-case letters no smaller
// than 1/16 inch, read back with pdf.js as tests/pdf/label-lettering.spec.ts reads the 4 × 6.
// source: 21 CFR 101.2(c) (read up to "in no case may the letter…", 2003 CFR; the 1/16 inch
// that follows is from memory); 9 CFR 381.125(b)(1)(i), "lettering no smaller than
// one-sixteenth of an inch in size" (read, 2019 CFR). 72 points to the inch, ISO 32000-1:2008,
// 8.3.2.3: 1/16 in = 4.5 points; Fira Sans's x-height is 527/1000 em (its own table, read again
// in label-fit.spec.ts), so 4.5 ÷ 0.527 = 8.54, 9 points at the half point above.
const SIXTEENTH = 72 / 16;
const X_HEIGHT = 0.527;

/** The ready-to-eat ham, held cold: a use-by day and a keep statement, every line a sticker has. */
const HAM: ProductLabel = demoLabel(
  'ham-pump',
  { meat: '5 kg', start: '2026-02-20' },
  '260220-HP-01',
);

/** The smallest type size of any word on a PDF's pages. */
function smallest(text: PdfText): number {
  return Math.min(...text.items.map((item) => item.size));
}

describe('the lot and date sticker', () => {
  it('should print the ham’s 2 × 1 in sticker with every word at 9 points or more', async () => {
    const bytes = await renderLabelPdf(HAM, '2x1');
    mkdirSync('test-artifacts', { recursive: true });
    writeFileSync('test-artifacts/label-sticker-2x1.pdf', bytes);
    const text = await pdfText(bytes);
    // 2 × 1 in at 72 points to the inch. source: ISO 32000-1:2008, 8.3.2.3
    assert.deepEqual(text.sizes, [[144, 72]]);
    assert.ok(smallest(text) * X_HEIGHT >= SIXTEENTH, `${smallest(text)} points`);
    assert.equal(smallest(text), 9);
    const flat = text.all.replace(/\s+/g, ' ');
    assert.ok(flat.includes(HAM.product), flat);
    assert.match(flat, /Lot 260220-HP-01/);
    assert.match(flat, /Packed on 2 Mar 2026/);
    // Ready to eat and refrigerated: use by day 7, the packed day counted as day 1.
    // source: FDA Food Code 2022, 3-501.17(A)
    assert.match(flat, /Use by 8 Mar 2026/);
    assert.match(flat, /Keep refrigerated/);
    // Not the package label: no ingredients, net weight or kitchen.
    assert.doesNotMatch(flat, /Ingredients|Net wt|Quillmoor Smokehouse/);
  });

  for (const [size, count, paper] of [
    // Letter paper 8.5 × 11 in (from memory), A4 210 × 297 mm (ISO 216; 595 × 842 points as
    // pdf.js rounds it); 4 × 10 and 3 × 11 cells of 2 × 1 in, label-pdf.ts's own grid.
    ['letter', 40, [612, 792]],
    ['a4', 33, [595, 842]],
  ] as const) {
    it(`should print ${count} stickers on a ${size} sheet, nothing under 9 points`, async () => {
      const bytes = await renderLabelPdf(HAM, size);
      writeFileSync(`test-artifacts/label-sticker-${size}.pdf`, bytes);
      const text = await pdfText(bytes);
      assert.deepEqual(text.sizes, [paper]);
      assert.equal(smallest(text), 9);
      assert.equal(text.all.split('Lot 260220-HP-01').length - 1, count);
      assert.equal(text.all.split('Keep refrigerated').length - 1, count);
      // The sheet says what its stickers are, and that they are not the package label.
      assert.match(
        text.all.replace(/\s+/g, ' '),
        new RegExp(
          `^${count} lot and date stickers, 2 × 1 in, lot 260220-HP-01\\. ` +
            'Goes with the full label on the pack or carton\\.',
        ),
      );
    });
  }

  it('should refuse a sticker whose name leaves no room for the lot and days at 9 points', async () => {
    // Three lines of name at 9 points, and the lot, packed-on, use-by and keep lines: seven lines
    // of 10.8 points (Fira Sans's 1.2 em, set solid) need 75.6 points, more than a 1 in label's 72.
    const product = 'Boneless ham, injected with brine, covered and smoked over applewood';
    for (const size of ['2x1', 'letter', 'a4'] as const)
      await assert.rejects(renderLabelPdf({ ...HAM, product }, size), {
        name: 'LabelTooFullError',
        message:
          "the product's name, lot and days do not fit on a 2 × 1 in lot and date sticker with letters no smaller than the labelling rules allow (1/16 in)",
      });
  });
});
