import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { openLabel } from '../../server/pdf/sheet-document.ts';
import { shiHeight } from '../../server/pdf/label-safe-handling.ts';
import { SHI_WORDS_LEAST_SQUARE_INCHES } from '../../shared/labels/label-sizes.ts';
import {
  SHI_HEADING,
  SHI_RATIONALE,
  SHI_STATEMENTS,
} from '../../shared/labels/safe-handling-text.ts';

// Whether the safe handling instructions fit a label, worked from the rule with the font the
// labels are printed in. source: 9 CFR 381.125(b)(1)(i), "lettering no smaller than
// one-sixteenth of an inch in size" (read, 2019 CFR); 72 points to the inch, ISO 32000-1:2008,
// 8.3.2.3, so 1/16 in = 4.5 points and a square inch is 72 × 72 = 5 184 square points.

const SIXTEENTH = 72 / 16;
const SQUARE_INCH = 72 * 72;
const WORDS = [SHI_RATIONALE, ...SHI_STATEMENTS.map((statement) => statement.text)].join(' ');

/** A 4 × 6 label's page, to measure with: the shipped font, Fira Sans, as the labels use it. */
function measuringLabel() {
  return openLabel(
    { title: 'fit', subject: 'fit', units: 'us', created: '2026-03-02', lot: 'fit' },
    { size: [288, 432], margins: { top: 14, bottom: 14, left: 14, right: 14 } },
  );
}

/** The font's own heights, thousandths of an em, as pdfkit reads them from it. */
function heights(doc: PDFKit.PDFDocument): { xHeight: number; capHeight: number } {
  return (doc as unknown as { _font: { xHeight: number; capHeight: number } })._font;
}

/** The area, square inches, of the words set solid on one line at a size: length × size. */
function wordsArea(doc: PDFKit.PDFDocument, size: number): number {
  doc.fontSize(size);
  return (doc.widthOfString(WORDS) * size) / SQUARE_INCH;
}

describe('the safe handling instructions on a label', () => {
  it('should need 3.57 square inches for their words alone, more than a 2 × 1 in label has', () => {
    const doc = measuringLabel().doc;
    // Fira Sans: x-height 527 and capital height 689 thousandths of an em (the font's own table).
    const { xHeight, capHeight } = heights(doc);
    assert.deepEqual([xHeight, capHeight], [527, 689]);
    // Lower-case letters 1/16 in tall: 4.5 ÷ 0.527 = 8.54 points of type.
    const least = SIXTEENTH / (xHeight / 1000);
    assert.equal(least.toFixed(2), '8.54');
    assert.equal(WORDS.length, 556);
    doc.fontSize(least);
    // 2 167.6 points of words on one line; × 8.54 points ÷ 5 184 = 3.57 square inches.
    assert.equal(doc.widthOfString(WORDS).toFixed(1), '2167.6');
    const area = wordsArea(doc, least);
    assert.equal(area.toFixed(2), SHI_WORDS_LEAST_SQUARE_INCHES.toFixed(2));
    // A 2 × 1 in label (alone, or a cell of the letter and A4 sheets) has 2 square inches.
    assert.ok(area > 2 * 1);
    // Read more leniently, capitals 1/16 in tall (4.5 ÷ 0.689 = 6.53 points), still 2.09.
    const lenient = wordsArea(doc, SIXTEENTH / (capHeight / 1000));
    assert.equal(lenient.toFixed(2), '2.09');
    assert.ok(lenient > 2 * 1);
  });

  it('should set the whole box, heading and pictures too, in less than a 4 × 6 label’s height', () => {
    const layout = measuringLabel();
    const shi = { heading: SHI_HEADING, rationale: SHI_RATIONALE, statements: SHI_STATEMENTS };
    // The label's text area: 288 − 2 × 14 = 260 points wide, 432 − 2 × 14 = 404 points tall;
    // the box takes about 218 of them, leaving the rest of the label 186 (label-pdf.spec.ts
    // prints the raw bacon and grind with everything else they must say).
    const height = shiHeight(layout, shi, 260);
    assert.ok(height < 404, `${height} points`);
  });
});
