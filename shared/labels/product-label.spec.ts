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
import { noSizeFits, productLabel, productLabelView } from './product-label.ts';
import { safeHandling } from './safe-handling.ts';

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
  // The ham is cooked to a lethality and kept cold: ready to eat, refrigerated.
  it('should date a ready-to-eat refrigerated label by the Food Code, the packed day as day 1', () => {
    const label = labelOf('ham-pump', { meat: dec('5000'), start: '2026-02-20' });
    assert.equal(label.packedOn, '2026-03-02');
    assert.equal(label.useBy.mark?.dayOne, '2026-03-02');
    assert.equal(label.useBy.mark?.useBy, '2026-03-08');
    assert.equal(label.useBy.mark?.basis, 'food-code');
    assert.equal(label.handling, 'Keep refrigerated');
    assert.equal(label.instructions, undefined);
  });

  // A raw product is not dated by the Food Code's 7 days (3-501.17 is for ready-to-eat food):
  // without a validated shelf life it has no use-by day. source: FDA Food Code 2022, 3-501.17(A)
  it('should give the raw bacon no use-by day, saying why, and keep it refrigerated', () => {
    const label = labelOf('quillmoor-belly', { meat: dec('5000'), start: '2026-02-20' });
    assert.equal(label.useBy.mark, undefined);
    assert.match(label.useBy.none ?? '', /not ready to eat/);
    // source: 9 CFR 381.125(a), "Keep Refrigerated" (read, 2019 CFR); 317.2(k), from memory
    assert.equal(label.handling, 'Keep refrigerated');
  });
  // source: FSIS Directive 10240.4, Resource 1: a meat product that has not had a lethality
  // treatment is not ready to eat and needs the safe handling instructions (9 CFR 317.2(l)).
  it('should ask for the safe handling instructions on the cold-smoked bacon', () => {
    const label = labelOf('quillmoor-belly', { meat: dec('5000'), start: '2026-02-20' });
    assert.equal(label.safeHandling.required, true);
    assert.match(label.safeHandling.reason, /not ready to eat.*317\.2\(l\)/);
    // The heading, the rationale and the four statements word for word, in the regulation's
    // order. source: 9 CFR 381.125(b)(2) and (b)(3)(i)–(iv) (1-1-06 edition); FSIS, "Safe
    // Handling Label Text"
    assert.equal(label.instructions?.heading, 'Safe Handling Instructions');
    assert.equal(
      label.instructions?.rationale,
      'This product was prepared from inspected and passed meat and/or poultry. Some food products may contain bacteria that could cause illness if the product is mishandled or cooked improperly. For your protection, follow these safe handling instructions.',
    );
    assert.deepEqual(
      label.instructions?.statements.map((s) => [s.picture, s.text]),
      [
        ['refrigerator', 'Keep refrigerated or frozen. Thaw in refrigerator or microwave.'],
        [
          'hands',
          'Keep raw meat and poultry separate from other foods. Wash working surfaces (including cutting boards), utensils, and hands after touching raw meat or poultry.',
        ],
        ['skillet', 'Cook thoroughly.'],
        ['thermometer', 'Keep hot foods hot. Refrigerate leftovers immediately or discard.'],
      ],
    );
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

  // A butter sauce of our own, on 1 000 g of butter: butter 1 000 g, Worcestershire sauce 5 % =
  // 50 g, black pepper 1 % = 10 g. Heaviest first, each compound ingredient followed by its own
  // ingredients in parentheses in the order the catalogue gives them (the supplier's label).
  // source: 21 CFR 101.4(a)(1) (descending order of predominance by weight) and 101.4(b)(2)(i)
  // (a parenthetical listing of a multi-ingredient ingredient's own ingredients); 9 CFR
  // 317.2(c)(2) and (f) for a meat product, (f)(1)'s order from memory. Allergens with their
  // kinds: source: 21 U.S.C. 343(w)(1)(A) and (w)(2) (FALCPA 2004 §203): "Contains" and the
  // species of fish — butter holds milk, Worcestershire sauce anchovy (formulas/catalogue.yaml).
  it('should list a sauce with compound ingredients heaviest first and say it contains milk and fish', () => {
    const sauce = readFormula(
      [
        'formula: 1',
        'id: anchovy-butter',
        'title: Anchovy butter',
        'kind: mix',
        'ingredients:',
        '  - { name: unsalted butter, pct: 100, base: true }',
        '  - { name: fine black pepper, pct: 1 }',
        '  - { name: Worcestershire sauce, pct: 5 }',
        'label: { storage: refrigerated, ready_to_eat: true }',
      ].join('\n'),
      'anchovy-butter.yaml',
    ).formula;
    assert.ok(sauce && sauce.kind === 'mix');
    const label = productLabel({
      formula: sauce,
      result: presentResult(calculate(sauce, { total: dec('1060') }), 'metric'),
      catalogue,
      lotCode: '260302-AB-01',
      packedOn: '2026-03-02',
      kitchen: { name: 'Quillmoor Smokehouse' },
    });
    assert.equal(
      label.ingredients.text,
      'Ingredients: butter (cream), Worcestershire sauce (distilled vinegar, molasses, water, ' +
        'sugar, onions, anchovies, salt, garlic, cloves, tamarind extract, natural flavorings), ' +
        'black pepper',
    );
    assert.deepEqual(
      label.ingredients.entries.map((entry) => entry.grams.toFixed(0)),
      ['1000', '50', '10'],
    );
    assert.equal(label.contains, 'Contains: milk, fish (anchovy)');
  });

  // A validated shelf life replaces the Food Code's 7 days and is counted the same way, day 1
  // the packed day: 10 days from Monday 2 March 2026 is Wednesday 11 March.
  // source: FDA Food Code 2022, 3-501.17(A), "the day of preparation shall be counted as Day 1"
  it('should date a raw product by its validated shelf life, and keep a frozen one frozen', () => {
    const belly = formula('quillmoor-belly');
    assert.equal(belly.kind, 'cure');
    const validated = {
      ...belly,
      label: {
        storage: 'frozen' as const,
        ready_to_eat: false,
        shelf_life: { days: 10, basis: 'challenge study, Quillmoor lab report 3, 2026' },
      },
    };
    const label = productLabel({
      formula: validated,
      result: presentResult(
        calculate(validated, { meat: dec('5000'), start: '2026-02-20' }),
        'metric',
      ),
      catalogue,
      lotCode: '260302-QB-01',
      packedOn: '2026-03-02',
      kitchen: { name: 'Quillmoor Smokehouse' },
    });
    assert.equal(label.useBy.mark?.useBy, '2026-03-11');
    assert.equal(label.useBy.mark?.basis, 'validated');
    assert.equal(label.useBy.mark?.source, 'challenge study, Quillmoor lab report 3, 2026');
    // source: 9 CFR 381.125(a), "Keep Frozen" (read, 2019 CFR); 317.2(k), from memory
    assert.equal(label.handling, 'Keep frozen');
    assert.equal(label.safeHandling.required, true);
  });

  // A baked bun kept at room temperature: no keep statement, and no date mark (the Food Code's is
  // for refrigerated food, FDA Food Code 2022, 3-501.17(A)).
  it('should print no keep statement and no use-by day on a shelf-stable bun', () => {
    const label = labelOf('pit-bun', { pieces: 24 });
    assert.equal(label.handling, undefined);
    assert.equal(label.useBy.mark, undefined);
    assert.match(label.useBy.none ?? '', /shelf-stable/);
    assert.equal(label.instructions, undefined);
  });

  // The formula's word wins over the controls: a smoked product the kitchen says is not ready to
  // eat carries the instructions. source: 9 CFR 381.125(b), products "that have not undergone
  // other processing that would render them ready-to-eat" (read, 2019 CFR)
  it('should ask safe handling of a smoked meat its formula says is not ready to eat', () => {
    const ham = formula('ham-pump');
    assert.equal(ham.kind, 'cure');
    const raw = { ...ham, label: { storage: 'refrigerated' as const, ready_to_eat: false } };
    assert.equal(safeHandling(raw).required, true);
  });
});

describe('noSizeFits', () => {
  const tooFull = 'The ingredient statement does not fit on a 4 × 6 label';

  it('should say no size prints a label the small sizes refuse too, and that a served dish needs none', () => {
    assert.equal(
      noSizeFits(tooFull, true),
      'This label is too long for any size we print: the ingredient statement does not fit on ' +
        'a 4 × 6 label, and the small labels have no room for the safe handling instructions. ' +
        'A dish you serve rather than pack, such as a burger from the grill, needs no package label',
    );
  });

  it('should give the 4 × 6 label’s own reason while the small labels still print', () => {
    assert.equal(noSizeFits(tooFull, false), tooFull);
  });

  it('should say what to do, not that nothing prints, when shortening the address makes room', () => {
    const fixable = `${tooFull}: shorten the kitchen's address to fit on one line with its name`;
    assert.equal(noSizeFits(fixable, true), fixable);
  });
});

describe('productLabelView', () => {
  const sticker = 'The product’s name, lot and days do not fit on a 2 × 1 in lot and date sticker';
  const tooFull = 'The ingredient statement does not fit on a 4 × 6 label';

  it('should refuse every small size with the sticker’s reason, and not the 4 × 6', () => {
    // The ham is ready to eat: no safe handling instructions to refuse the small sizes for.
    const ham = labelOf('ham-pump', { meat: dec('5000'), start: '2026-02-20' }, '1360.8');
    assert.deepEqual(productLabelView(ham, undefined, sticker).sizes, [
      { size: '4x6' },
      { size: '2x1', refused: sticker },
      { size: 'letter', refused: sticker },
      { size: 'a4', refused: sticker },
    ]);
    // Both too full: the 4 × 6 keeps its own reason, not the safe handling instructions'.
    assert.equal(productLabelView(ham, tooFull, sticker).sizes[0]?.refused, tooFull);
  });

  it('should give the safe handling instructions’ reason before the sticker’s', () => {
    const bacon = labelOf('quillmoor-belly', { meat: dec('5000'), start: '2026-02-20' }, '340');
    const refused = productLabelView(bacon, undefined, sticker).sizes[1]?.refused;
    assert.match(refused ?? '', /too small for the safe handling instructions/);
  });
});
