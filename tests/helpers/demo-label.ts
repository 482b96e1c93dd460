import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import { readCatalogue } from '../../shared/catalogue/read-catalogue.ts';
import { productLabel, type ProductLabel } from '../../shared/labels/product-label.ts';
import {
  calculate,
  dec,
  parseBatchOptions,
  presentResult,
  readFormula,
  type RawBatchOptions,
} from '../../shared/index.ts';

const read = (file: string): string => readFileSync(`formulas/${file}`, 'utf8');
const catalogue = readCatalogue(read('catalogue.yaml'), 'catalogue.yaml').catalogue;

/**
 * The label of a batch of a demo formula as the route works it out, in US units, with the demo
 * catalogue's names, packed 2 March 2026 at Quillmoor Smokehouse.
 * @param net the package's net weight, grams, as a string; none when omitted
 */
export function demoLabel(
  id: string,
  options: RawBatchOptions,
  lotCode: string,
  net?: string,
): ProductLabel {
  const formula = readFormula(read(`${id}.yaml`), `${id}.yaml`).formula;
  assert.ok(formula && formula.kind !== 'assembly', id);
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
