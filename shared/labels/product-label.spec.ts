import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import { describe, it } from 'node:test';
import { readCatalogue } from '../catalogue/read-catalogue.ts';
import { calculate } from '../calculation/calculate.ts';
import type { BatchInput } from '../calculation/batch-input.ts';
import { dec } from '../decimal.ts';
import { readFormula } from '../formula/read-formula.ts';
import type { Formula } from '../formula/formula-types.ts';
import { presentResult } from '../presentation/present-result.ts';
import { productLabel, safeHandling } from './product-label.ts';

const FORMULAS = new URL('../../formulas/', import.meta.url);
const read = (name: string): string => readFileSync(new URL(name, FORMULAS), 'utf8');
const catalogue = readCatalogue(read('catalogue.yaml'), 'catalogue.yaml').catalogue;

function formula(id: string): Formula {
  const read1 = readFormula(read(`${id}.yaml`), `${id}.yaml`).formula;
  assert.ok(read1, id);
  return read1;
}

/** A demo batch's label as the route makes it: its recorded result, the catalogue's names. */
function labelOf(id: string, batch: BatchInput, netGrams?: string) {
  const f = formula(id);
  return productLabel({
    formula: f,
    result: presentResult(calculate(f, batch), 'metric'),
    catalogue,
    lotCode: '260302-QB-01',
    packedOn: '2026-03-02',
    netGrams: netGrams === undefined ? undefined : dec(netGrams),
    kitchen: { name: 'Quillmoor Smokehouse', address: '14 Kiln Lane, Quillmoor' },
  });
}

describe('productLabel', () => {
  // quillmoor-belly on 5 000 g of green belly, worked by hand from the formula's percentages of
  // green weight: fine sea salt 2.25 % = 112.5 g, curing salt 0.25 % = 12.5 g, dark brown sugar
  // 1.2 % = 60 g, cracked black pepper 0.3 % = 15 g; the belly itself, 5 000 g, is named by its
  // species. Heaviest first: pork 5 000, sea salt 112.5, brown sugar 60, black pepper 15, curing
  // salt 12.5. source: 21 CFR 101.4(a)(1), descending order of predominance by weight; 21 CFR
  // 101.4(b)(2)(i), a compound ingredient's own ingredients in parentheses after its name.
  it('should list the demo bacon heaviest first under the catalogue names', () => {
    const label = labelOf('quillmoor-belly', { meat: dec('5000'), start: '2026-02-20' }, '340');
    assert.equal(label.product, 'Quillmoor belly, dry equilibrium cure');
    assert.equal(
      label.ingredients.text,
      'Ingredients: pork, sea salt, brown sugar, black pepper, curing salt (salt, sodium nitrite)',
    );
    assert.deepEqual(
      label.ingredients.entries.map((entry) => entry.grams.toFixed(1)),
      ['5000.0', '112.5', '60.0', '15.0', '12.5'],
    );
    // No line of the cure, nor its catalogue item, holds a major food allergen.
    assert.equal(label.contains, undefined);
  });

  // source: FDA Food Code 2022, 3-501.17(A): 7 days at 5 °C (41 °F) or below, "the day of
  // preparation shall be counted as Day 1": packed Monday 2 March 2026, day 7 is Sunday 8 March.
  it('should date the label by the Food Code, the packed day counted as day 1', () => {
    const label = labelOf('quillmoor-belly', { meat: dec('5000'), start: '2026-02-20' });
    assert.equal(label.packedOn, '2026-03-02');
    assert.equal(label.useBy.useBy, '2026-03-08');
    assert.equal(label.useBy.basis, 'food-code');
    assert.equal(label.handling, 'Keep refrigerated');
  });

  // source: FSIS Directive 10240.4, Resource 1: a meat product that has not had a lethality
  // treatment is not ready to eat and needs the safe handling instructions (9 CFR 317.2(l)).
  it('should ask for the safe handling instructions on the cold-smoked bacon', () => {
    const label = labelOf('quillmoor-belly', { meat: dec('5000'), start: '2026-02-20' });
    assert.equal(label.safeHandling.required, true);
    assert.match(label.safeHandling.reason, /not ready to eat/);
  });

  // chuck-grind, 10 000 g at 20 % fat from trims of 15 % and 50 % fat, by the Pearson square:
  // lean (50 − 20) ÷ (50 − 15) = 6/7 of the batch = 8 571.43 g, fat trim 1/7 = 1 428.57 g.
  // source: the Pearson square, Ockerman and Basu, Carcass By-Products / any meat science text
  // (from memory); names from the catalogue: chuck trim is "beef", brisket fat trim "beef fat".
  it('should list the burger grind as beef then beef fat, raw, with safe handling asked for', () => {
    const label = labelOf('chuck-grind', { total: dec('10000') }, '453.59237');
    assert.equal(label.ingredients.text, 'Ingredients: beef, beef fat');
    assert.deepEqual(
      label.ingredients.entries.map((entry) => entry.grams.toFixed(2)),
      ['8571.43', '1428.57'],
    );
    assert.equal(label.safeHandling.required, true);
    assert.match(label.safeHandling.reason, /raw meat/);
    // 453.59237 g is 1 lb exactly. source: NIST SP 811 (2008), Appendix B.8
    assert.equal(label.net?.text, 'Net wt 1 lb (453 g)');
  });

  // The house sauce's mayonnaise holds egg and its Worcestershire sauce anchovy, by the
  // catalogue. source: 21 U.S.C. 343(w)(1)(A) and (w)(2), "Contains" with the species of fish.
  it("should say what the sauce contains, the fish's kind named, and ask no safe handling", () => {
    const label = labelOf('house-sauce', { total: dec('1000') });
    assert.equal(label.contains, 'Contains: egg, fish (anchovy)');
    assert.equal(label.safeHandling.required, false);
  });

  // source: FSIS Directive 10240.4, Resource 1: a product that had an adequate lethality
  // treatment is ready to eat; the demo ham is cooked to an FSIS Appendix A lethality control.
  it('should not ask safe handling of a ham cooked to a lethality control', () => {
    assert.equal(safeHandling(formula('ham-pump')).required, false);
  });
});
