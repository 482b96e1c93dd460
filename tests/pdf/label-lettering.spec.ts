import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import { describe, it } from 'node:test';
import { leastTypeSize } from '../../server/pdf/label-lettering.ts';
import { renderLabelPdf } from '../../server/pdf/label-pdf.ts';
import { openLabel } from '../../server/pdf/sheet-document.ts';
import { readCatalogue } from '../../shared/catalogue/read-catalogue.ts';
import { productLabel, type ProductLabel } from '../../shared/labels/product-label.ts';
import {
  calculate,
  dec,
  parseBatchOptions,
  presentResult,
  readFormula,
} from '../../shared/index.ts';
import { pdfText } from '../helpers/pdf-text.ts';

// The words a label must carry are set with lower-case letters no smaller than 1/16 inch.
// source: 21 CFR 101.2(c) (read up to "in no case may the letter…", 2003 CFR; the 1/16 inch
// that follows is from memory); 9 CFR 381.125(b)(1)(i), "lettering no smaller than
// one-sixteenth of an inch in size" (read, 2019 CFR); measured on the lower-case "o" where
// upper and lower case are mixed (read for 21 CFR 101.105(i) in FDA's questions and answers).
// 72 points to the inch, ISO 32000-1:2008, 8.3.2.3: 1/16 in = 72 ÷ 16 = 4.5 points.
const SIXTEENTH = 72 / 16;

const read = (file: string): string => readFileSync(`formulas/${file}`, 'utf8');
const catalogue = readCatalogue(read('catalogue.yaml'), 'catalogue.yaml').catalogue;
const KITCHEN = { name: 'Quillmoor Smokehouse', address: '14 Kiln Lane, Quillmoor' };

/** The raw bacon's label, packed 2 March 2026, 340 g: it carries the safe handling box. */
function bacon(kitchen = KITCHEN): ProductLabel {
  const formula = readFormula(read('quillmoor-belly.yaml'), 'quillmoor-belly.yaml').formula;
  assert.ok(formula && formula.kind !== 'assembly');
  const batch = parseBatchOptions({ meat: '5 kg', start: '2026-02-20' }, formula, {
    today: '2026-03-02',
  });
  return productLabel({
    formula,
    result: presentResult(calculate(formula, batch), 'us'),
    catalogue,
    lotCode: '260220-QB-01',
    packedOn: '2026-03-02',
    netGrams: dec('340'),
    kitchen,
  });
}

describe('the lettering of a 4 × 6 product label', () => {
  it('should set nothing smaller than 9 points of Fira Sans, worked from 1/16 inch', () => {
    const layout = openLabel(
      { title: 'size', subject: 'size', units: 'us', created: '2026-03-02', lot: 'size' },
      { size: [288, 432], margins: { top: 14, bottom: 14, left: 14, right: 14 } },
    );
    // Fira Sans's lower-case letters stand 527/1000 of its size (the font's own table, read
    // again in label-fit.spec.ts): 4.5 ÷ 0.527 = 8.54 points, rounded up to the half point, 9.
    assert.equal((SIXTEENTH / 0.527).toFixed(2), '8.54');
    assert.equal(leastTypeSize(layout), 9);
  });

  it('should print the raw bacon with every word at 9 points or more', async () => {
    const text = await pdfText(await renderLabelPdf(bacon(), '4x6'));
    const sizes = text.items.filter((item) => item.text.trim()).map((item) => item.size);
    const smallest = Math.min(...sizes);
    // 9 points × 0.527 = 4.74 points of x-height, over the 4.5 of 1/16 inch.
    assert.ok(smallest * 0.527 >= SIXTEENTH, `${smallest} points`);
    assert.equal(smallest, 9);
    // The ingredient statement itself, and the kitchen's address, are among the words set so.
    const at = (words: string) => text.items.find((item) => item.text.includes(words))?.size;
    assert.ok((at('Ingredients:') ?? 0) >= 9);
    assert.equal(at('14 Kiln Lane'), 9);
  });

  it('should refuse a 4 × 6 label whose statement no longer fits at 9 points', async () => {
    const label = bacon();
    // The bacon's ingredients three times over: more lines of 9 point type than the room above
    // the safe handling box holds; refused, not set smaller.
    const own = label.ingredients.text.replace(/^Ingredients: /, '');
    const long = `${label.ingredients.text}, ${own}, ${own}`;
    await assert.rejects(
      renderLabelPdf({ ...label, ingredients: { ...label.ingredients, text: long } }, '4x6'),
      {
        name: 'LabelTooFullError',
        message:
          'the ingredient statement does not fit on a 4 × 6 label beside everything else it must say, with letters no smaller than the labelling rules allow (1/16 in)',
      },
    );
  });

  it('should say to shorten the kitchen’s address when that alone would make room', async () => {
    // An address too long for the name's line takes a line of its own, and more: the bacon's
    // statement no longer fits, but would beside an address on the name's line.
    const address = '14 Kiln Lane, behind the old tannery yard, Quillmoor, Marsh County 00000';
    await assert.rejects(renderLabelPdf(bacon({ ...KITCHEN, address }), '4x6'), {
      name: 'LabelTooFullError',
      message: /: shorten the kitchen's address to fit on one line with its name$/,
    });
  });
});
