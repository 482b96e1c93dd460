import assert from 'node:assert/strict';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { describe, it } from 'node:test';
import { renderLabelPdf } from '../../server/pdf/label-pdf.ts';
import type { LabelSize } from '../../server/pdf/label-sizes.ts';
import { readCatalogue } from '../../shared/catalogue/read-catalogue.ts';
import { productLabel } from '../../shared/labels/product-label.ts';
import {
  calculate,
  dec,
  parseBatchOptions,
  presentResult,
  readFormula,
  type RawBatchOptions,
} from '../../shared/index.ts';
import { pdfText } from '../helpers/pdf-text.ts';

// A label is read back with pdf.js, an independent reader: one page at the label's size, with
// what a person reading it must find.

const read = (file: string): string => readFileSync(`formulas/${file}`, 'utf8');
const catalogue = readCatalogue(read('catalogue.yaml'), 'catalogue.yaml').catalogue;

function labelOf(id: string, options: RawBatchOptions, lotCode: string, net?: string) {
  const formula = readFormula(read(`${id}.yaml`), `${id}.yaml`).formula;
  assert.ok(formula && formula.kind !== 'assembly');
  const batch = parseBatchOptions(options, formula, { today: '2026-03-02' });
  return productLabel({
    formula,
    result: presentResult(calculate(formula, batch), 'us'),
    catalogue,
    lotCode,
    packedOn: '2026-03-02',
    netGrams: net === undefined ? undefined : dec(net),
    kitchen: { name: 'Quillmoor Smokehouse', address: '14 Kiln Lane, Quillmoor' },
  });
}

/** Label sizes in points, 72 to the inch. source: ISO 32000-1:2008, 8.3.2.3 */
const SIZES: Record<LabelSize, readonly [number, number]> = {
  '4x6': [288, 432],
  '2x1': [144, 72],
};

const LABELS = [
  labelOf('quillmoor-belly', { meat: '5 kg', start: '2026-02-20' }, '260220-QB-01', '340'),
  labelOf('chuck-grind', { total: '20 kg' }, '260302-CG-02', '453.59237'),
  labelOf('house-sauce', { total: '2 kg' }, '260302-HS-01', '250'),
];

describe('product label PDF', () => {
  for (const label of LABELS) {
    for (const size of ['4x6', '2x1'] as const) {
      it(`should print ${label.lotCode} on one ${size} in page with its lot and days`, async () => {
        const bytes = await renderLabelPdf(label, size);
        mkdirSync('test-artifacts', { recursive: true });
        writeFileSync(`test-artifacts/label-${label.lotCode}-${size}.pdf`, bytes);
        const text = await pdfText(bytes);
        assert.deepEqual(text.sizes, [SIZES[size]]);
        assert.equal(text.title, label.product);
        assert.match(text.all, new RegExp(`Lot ${label.lotCode}|${label.lotCode}`));
        // Packed 2 Mar 2026; use by day 7, 8 Mar 2026 (FDA Food Code 2022, 3-501.17(A)).
        assert.match(text.all, /2 Mar 2026/);
        assert.match(text.all, /8 Mar 2026/);
        assert.ok(label.net && text.all.includes(label.net.text), text.all);
        if (size === '4x6') {
          assert.ok(text.all.includes(label.ingredients.text), text.all);
          if (label.contains) assert.ok(text.all.includes(label.contains));
          assert.match(text.all, /KEEP REFRIGERATED/);
          assert.match(text.all, /Quillmoor Smokehouse 14 Kiln Lane, Quillmoor/);
        } else assert.doesNotMatch(text.all, /Ingredients/);
      });
    }
  }
});
