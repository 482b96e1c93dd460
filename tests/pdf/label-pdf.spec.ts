import assert from 'node:assert/strict';
import { mkdirSync, writeFileSync } from 'node:fs';
import { describe, it } from 'node:test';
import { renderLabelPdf } from '../../server/pdf/label-pdf.ts';
import type { LabelSize } from '../../shared/labels/label-sizes.ts';
import { demoLabel } from '../helpers/demo-label.ts';
import { pdfText } from '../helpers/pdf-text.ts';

// A label is read back with pdf.js, an independent reader: one page at the label's size, with
// what a person reading it must find.

/**
 * Label sizes in points, 72 to the inch. source: ISO 32000-1:2008, 8.3.2.3. Letter paper is
 * 8.5 × 11 in (from memory); A4 is 210 × 297 mm, ISO 216 (595 × 842 points as pdf.js rounds it).
 */
const SIZES: Record<LabelSize, readonly [number, number]> = {
  '4x6': [288, 432],
  '2x1': [144, 72],
  letter: [612, 792],
  a4: [595, 842],
};

const LABELS = [
  demoLabel('quillmoor-belly', { meat: '5 kg', start: '2026-02-20' }, '260220-QB-01', '340'),
  demoLabel('chuck-grind', { total: '20 kg' }, '260302-CG-02', '453.59237'),
  demoLabel('house-sauce', { total: '2 kg' }, '260302-HS-01', '250'),
  demoLabel('ham-pump', { meat: '5 kg', start: '2026-02-20' }, '260220-HP-01', '1360.8'),
];

/** The text pdf.js reads, spaces collapsed, as the label's own words must appear in it. */
const flat = (text: string): string => text.replace(/\s+/g, ' ');

describe('product label PDF', () => {
  for (const label of LABELS) {
    // The raw bacon and grind must carry the safe handling instructions, which a 2 × 1 in label
    // has no room for (tests/pdf/label-fit.spec.ts): they print at 4 × 6 only.
    const sizes = label.instructions ? (['4x6'] as const) : (['4x6', '2x1'] as const);
    for (const size of sizes) {
      it(`should print ${label.lotCode} on one ${size} in page with its lot and days`, async () => {
        const bytes = await renderLabelPdf(label, size);
        mkdirSync('test-artifacts', { recursive: true });
        writeFileSync(`test-artifacts/label-${label.lotCode}-${size}.pdf`, bytes);
        const text = await pdfText(bytes);
        assert.deepEqual(text.sizes, [SIZES[size]]);
        assert.equal(text.title, label.product);
        assert.match(text.all, new RegExp(`Lot ${label.lotCode}|${label.lotCode}`));
        assert.match(text.all, /2 Mar 2026/);
        // Ready to eat and refrigerated: use by day 7, 8 Mar 2026 (FDA Food Code 2022,
        // 3-501.17(A)); the raw bacon and grind have no use-by day (label-keeping.ts).
        if (label.useBy.mark) assert.match(text.all, /Use by 8 Mar 2026/);
        else assert.doesNotMatch(text.all, /Use by/);
        if (size === '4x6') {
          assert.ok(label.net && text.all.includes(label.net.text), text.all);
          assert.ok(text.all.includes(label.ingredients.text), text.all);
          if (label.contains) assert.ok(text.all.includes(label.contains));
          if (label.handling) assert.match(text.all, /KEEP REFRIGERATED/);
          assert.match(text.all, /Quillmoor Smokehouse 14 Kiln Lane, Quillmoor/);
        } else {
          // The 2 × 1 in label is a lot and date sticker, not the package label: its keep
          // statement, but no ingredients, net weight or kitchen (label-sticker.spec.ts).
          if (label.handling) assert.match(text.all, /Keep refrigerated/);
          assert.doesNotMatch(text.all, /Ingredients|Net wt|Kiln Lane/);
        }
      });
    }
  }

  // The raw bacon and the raw grind carry the instructions word for word; the heading larger
  // than the rest, the rest with lower-case letters 1/16 inch tall (4.5 points of x-height; Fira
  // Sans's x-height is 527/1000 em, so at least 8.54 points of type). source: 9 CFR
  // 381.125(b)(1)(i) "lettering no smaller than one-sixteenth of an inch" and (b)(2)–(3)
  // (read); the heading larger, read as quoted (see shared/labels/safe-handling-text.ts)
  for (const label of LABELS.filter((l) => l.instructions)) {
    it(`should print the safe handling instructions on ${label.lotCode} in their sizes`, async () => {
      const text = await pdfText(await renderLabelPdf(label, '4x6'));
      const shi = label.instructions!;
      for (const words of [shi.heading, shi.rationale, ...shi.statements.map((s) => s.text)])
        assert.ok(flat(text.all).includes(words), words);
      const heading = text.items.find((item) => item.text.includes('Safe Handling Instructions'));
      const statement = text.items.find((item) => item.text.includes('Cook thoroughly.'));
      assert.ok(heading && statement);
      assert.ok(statement.size * 0.527 >= 72 / 16, `${statement.size} points`);
      assert.ok(heading.size > statement.size);
    });
  }

  it('should refuse a small label of the raw bacon and grind, too small for the instructions', async () => {
    for (const label of LABELS.filter((l) => l.instructions)) {
      for (const size of ['2x1', 'letter', 'a4'] as const) {
        await assert.rejects(renderLabelPdf(label, size), {
          name: 'LabelTooFullError',
          message: /too small for the safe handling instructions/,
        });
      }
    }
  });

  it('should print no safe handling instructions on the ready-to-eat ham and sauce', async () => {
    for (const label of LABELS.filter((l) => !l.instructions)) {
      const text = await pdfText(await renderLabelPdf(label, '4x6'));
      assert.doesNotMatch(text.all, /Safe Handling Instructions/);
    }
  });

  // A letter sheet holds 4 × 10 small labels and an A4 sheet 3 × 11 (label-pdf.ts: 2 × 1 in
  // cells on 8.5 × 11 in and 210 × 297 mm paper; our own grid).
  for (const [size, count] of [
    ['letter', 40],
    ['a4', 33],
  ] as const) {
    it(`should print ${count} stickers on one ${size} sheet, saying how many`, async () => {
      const label = LABELS[3];
      const bytes = await renderLabelPdf(label, size);
      writeFileSync(`test-artifacts/label-${label.lotCode}-${size}.pdf`, bytes);
      const text = await pdfText(bytes);
      assert.deepEqual(text.sizes, [SIZES[size]]);
      assert.equal(text.all.split(`Lot ${label.lotCode}`).length - 1, count);
      assert.match(text.all, new RegExp(`^${count} lot and date stickers, 2 × 1 in`));
    });
  }
});
