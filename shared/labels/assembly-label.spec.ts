import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import { describe, it } from 'node:test';
import { readCatalogue } from '../catalogue/read-catalogue.ts';
import type { RawBatchOptions } from '../calculation/batch-input.ts';
import { calculate } from '../calculation/calculate.ts';
import { parseBatchOptions } from '../calculation/parse-batch-options.ts';
import { dec } from '../decimal.ts';
import type { AssemblyFormula, LabelKeeping } from '../formula/formula-types.ts';
import { readFormula } from '../formula/read-formula.ts';
import { presentResult } from '../presentation/present-result.ts';
import { AssemblyLabelError, assemblyLabel, type PartBatch } from './assembly-label.ts';
import { productLabel } from './product-label.ts';

const FORMULAS = new URL('../../formulas/', import.meta.url);
const read = (name: string): string => readFileSync(new URL(name, FORMULAS), 'utf8');
const catalogue = readCatalogue(read('catalogue.yaml'), 'catalogue.yaml').catalogue;
const KITCHEN = { name: 'Quillmoor Smokehouse', address: '14 Kiln Lane, Quillmoor' };

/** A demo formula as its file reads. */
function demo(id: string) {
  const formula = readFormula(read(`${id}.yaml`), `${id}.yaml`).formula;
  assert.ok(formula, id);
  return formula;
}

/** A batch of a demo formula, calculated as recorded, with how much of it went in. */
function batchOf(id: string, options: RawBatchOptions, grams: string, madeOn = '2026-03-02') {
  const formula = demo(id);
  assert.ok(formula.kind !== 'assembly');
  const batch = parseBatchOptions(options, formula, { today: '2026-02-20' });
  const result = presentResult(calculate(formula, batch), 'metric');
  return { formula, result, grams: dec(grams), madeOn } satisfies PartBatch;
}

const BELLY = batchOf('quillmoor-belly', { meat: '5 kg', start: '2026-02-20' }, '1000');
const SAUCE = batchOf('house-sauce', { total: '2 kg' }, '300');
const GRIND = batchOf('chuck-grind', { total: '20 kg' }, '2268');
const BUN = batchOf('pit-bun', { pieces: '24' }, '900');
const HAM = batchOf('ham-pump', { meat: '5 kg', start: '2026-02-20' }, '1000', '2026-03-01');

/** An assembly of our own for a test: a pack of parts, one unit of it. */
function pack(
  components: AssemblyFormula['components'],
  label?: LabelKeeping,
  title = 'Bacon and sauce pack',
): AssemblyFormula {
  return {
    formula: 1,
    id: 'test-pack',
    title,
    kind: 'assembly',
    components,
    ...(label ? { label } : {}),
  };
}

function labelOf(
  assembly: AssemblyFormula,
  parts: Record<string, PartBatch[]>,
  more: { netGrams?: string; packedOn?: string } = {},
) {
  return assemblyLabel({
    assembly,
    parts: new Map(Object.entries(parts)),
    catalogue,
    lotCode: '260303-TP-01',
    packedOn: more.packedOn ?? '2026-03-03',
    netGrams: more.netGrams === undefined ? undefined : dec(more.netGrams),
    kitchen: KITCHEN,
  });
}

/** The bacon's and the sauce's own ingredient lists, as their batch labels print them. */
const BACON_LIST =
  // worked by hand in product-label.spec.ts from quillmoor-belly's percentages of green weight
  'pork, sea salt, brown sugar, black pepper, curing salt (salt, sodium nitrite)';
const SAUCE_LIST =
  // worked by hand in tests/e2e/labels.e2e.ts from house-sauce's percentages of the mayonnaise
  'mayonnaise (soybean oil, water, egg yolks, distilled vinegar, salt, sugar, lemon juice ' +
  'concentrate), chili sauce (tomato concentrate, sugar, distilled vinegar, salt, onion, red ' +
  'pepper, spices), dill pickle brine (water, distilled vinegar, salt, dill, garlic), ' +
  'Worcestershire sauce (distilled vinegar, molasses, water, sugar, onions, anchovies, salt, ' +
  'garlic, cloves, tamarind extract, natural flavorings), smoked paprika, dehydrated garlic, ' +
  'black pepper';

describe('assemblyLabel', () => {
  // One pack holds 30 g of sauce and 4 slices of 25 g of bacon, 100 g: the bacon is the heavier
  // part, so it comes first though the formula names the sauce first; each part is a compound
  // ingredient, its own ingredients in parentheses, heaviest first as its own label lists them.
  // source: 21 CFR 101.4(a)(1), descending order of predominance by weight, and 101.4(b)(2)(i),
  // a multi-ingredient ingredient's name "followed by a parenthetical listing of all
  // ingredients contained therein" (read in the 2006 CFR edition at grokfood.com); 9 CFR
  // 317.2(f) for meat, from memory
  const BACON_PACK = pack([
    { formula: 'house-sauce', amount: '30 g' },
    { formula: 'quillmoor-belly', slices: 4, slice: '25 g', thickness: '4 cm' },
  ]);

  it('should list each part with its own ingredients, the heavier part first', () => {
    const label = labelOf(BACON_PACK, { 'quillmoor-belly': [BELLY], 'house-sauce': [SAUCE] });
    assert.equal(label.product, 'Bacon and sauce pack');
    assert.equal(
      label.ingredients.text,
      `Ingredients: Quillmoor belly, dry equilibrium cure (${BACON_LIST}), ` +
        `Pit-house sandwich sauce (${SAUCE_LIST})`,
    );
    assert.deepEqual(
      label.ingredients.entries.map((entry) => entry.grams.toFixed(0)),
      ['100', '30'],
    );
  });

  // source: 21 U.S.C. 343(w)(1)(A), "Contains" and each major allergen's source; 343(w)(2), the
  // species of fish: the sauce's mayonnaise (egg) and Worcestershire sauce (anchovy)
  it('should gather the allergens of every part, with their kinds', () => {
    const label = labelOf(BACON_PACK, { 'quillmoor-belly': [BELLY], 'house-sauce': [SAUCE] });
    assert.equal(label.contains, 'Contains: egg, fish (anchovy)');
  });

  // The bacon is cold-smoked and sold raw (its formula says ready_to_eat: false), and the pack
  // says nothing of itself: the raw part decides. source: 9 CFR 381.125(b) (read, 2019 CFR);
  // 9 CFR 317.2(l), from memory
  it('should carry the safe handling instructions for its raw bacon, naming it', () => {
    const label = labelOf(BACON_PACK, { 'quillmoor-belly': [BELLY], 'house-sauce': [SAUCE] });
    assert.equal(label.safeHandling.required, true);
    assert.equal(
      label.safeHandling.reason,
      'Quillmoor belly, dry equilibrium cure is raw or not ready to eat (9 CFR 317.2(l))',
    );
    assert.equal(label.instructions?.heading, 'Safe Handling Instructions');
    // Without its own label key, a pack has no keep statement and no use-by day.
    assert.equal(label.handling, undefined);
    assert.equal(label.useBy.mark, undefined);
  });

  // 4 × 25 g + 30 g = 130 g; 130 ÷ 28.349523125 = 4.59 oz, rounded down to 4.5.
  // source: NIST SP 811 (2008), Appendix B.8 (1 oz = 28.349523125 g)
  it('should declare one unit’s weight by its formula unless the cook gives one', () => {
    const parts = { 'quillmoor-belly': [BELLY], 'house-sauce': [SAUCE] };
    const worked = labelOf(BACON_PACK, parts);
    assert.equal(worked.net?.text, 'Net wt 4.5 oz (130 g)');
    assert.match(worked.netNote ?? '', /^the net weight of one unit by its formula/);
    const given = labelOf(BACON_PACK, parts, { netGrams: '127' });
    assert.equal(given.net?.text, 'Net wt 4.4 oz (127 g)');
    assert.equal(given.netNote, undefined);
  });

  // derived: two batches of the sauce are one part; what went in of each is added up, so the
  // sauce is listed once, its own list unchanged.
  it('should add up a part made from two batches into one', () => {
    const more = { ...SAUCE, grams: dec('120') };
    const label = labelOf(BACON_PACK, {
      'quillmoor-belly': [BELLY],
      'house-sauce': [SAUCE, more],
    });
    assert.equal(label.ingredients.entries.length, 2);
    assert.equal(label.ingredients.entries[1].subIngredients.join(', '), SAUCE_LIST);
  });

  it('should refuse a label until every part’s batch is recorded, naming the part', () => {
    assert.throws(
      () => labelOf(BACON_PACK, { 'quillmoor-belly': [BELLY] }),
      (error: unknown) =>
        error instanceof AssemblyLabelError &&
        /none is recorded for house-sauce$/.test(error.message),
    );
  });
});

describe('the demo burger’s label', () => {
  const BURGER = demo('smokehouse-burger');
  assert.ok(BURGER.kind === 'assembly');
  const PARTS = {
    'chuck-grind': [GRIND],
    'pit-bun': [BUN],
    'quillmoor-belly': [BELLY],
    'house-sauce': [SAUCE],
  };

  // One burger, worked by hand from formulas/smokehouse-burger.yaml: 2 portions of 4 oz of
  // grind = 226.8 g (1 oz = 28.349523125 g, NIST SP 811 (2008), B.8), 1 bun of 90 g (as dough),
  // 3 slices of 25 g of bacon = 75 g, 20 g of sauce: grind, bun, bacon, sauce. Each part in
  // parentheses lists what its own batch label lists. source: 21 CFR 101.4(a)(1), (b)(2)(i)
  it('should list the grind, the bun, the bacon and the sauce in that order', () => {
    const label = labelOf(BURGER, PARTS);
    const own = (batch: PartBatch) =>
      productLabel({
        formula: batch.formula,
        result: batch.result,
        catalogue,
        lotCode: 'x',
        packedOn: '2026-03-03',
        kitchen: KITCHEN,
      }).ingredients.list;
    assert.equal(
      label.ingredients.text,
      'Ingredients: ' +
        [
          `Smokehouse burger grind 80/20 (${own(GRIND)})`,
          `Milk and honey bun, with sponge (${own(BUN)})`,
          `Quillmoor belly, dry equilibrium cure (${BACON_LIST})`,
          `Pit-house sandwich sauce (${SAUCE_LIST})`,
        ].join(', '),
    );
    assert.deepEqual(
      label.ingredients.entries.map((entry) => entry.grams.toFixed(1)),
      ['226.8', '90.0', '75.0', '20.0'],
    );
    // The bun's milk, egg and wheat, the sauce's egg and anchovy, in the label's order.
    // source: 21 U.S.C. 343(w)(1)(A) and (w)(2); the order is the project's (allergen-statement.ts)
    assert.equal(label.contains, 'Contains: milk, egg, fish (anchovy), wheat');
    // The raw grind and bacon carry it. source: 9 CFR 317.2(l), from memory
    assert.equal(label.safeHandling.required, true);
    assert.match(label.safeHandling.reason, /^Smokehouse burger grind 80\/20, Quillmoor belly/);
  });

  // A bun is weighed as dough before it is baked, so the burger's weight is not its formula's.
  it('should not work out a burger’s net weight, its bun being weighed as dough', () => {
    const label = labelOf(BURGER, PARTS);
    assert.equal(label.net, undefined);
    assert.match(label.netNote ?? '', /Milk and honey bun, with sponge is weighed as dough/);
  });
});

describe('an assembly’s own label key', () => {
  const HAM_PACK = pack(
    [
      { formula: 'ham-pump', amount: '100 g', largest_piece: '2.5 kg' },
      { formula: 'house-sauce', amount: '20 g' },
    ],
    { storage: 'refrigerated', ready_to_eat: true },
    'Ham and sauce pack',
  );

  // The ham (cooked) and the sauce are ready to eat and so is the pack; it is dated from the
  // earliest part: the ham, made on 1 March, is day 1, so packed on 3 March it is used by 7
  // March. source: FDA Food Code 2022, 3-501.17(C), "the date marking of the earliest-prepared
  // or first-prepared ingredient" (Virginia, 12VAC5-421-830 C); Southern Nevada Health
  // District's FAQ: burgers cooked 1 June, made into chili 3 June, "will still be June 7"
  it('should date a ready-to-eat pack from its earliest part and keep it refrigerated', () => {
    const label = labelOf(HAM_PACK, { 'ham-pump': [HAM], 'house-sauce': [SAUCE] });
    assert.equal(label.useBy.mark?.dayOne, '2026-03-01');
    assert.equal(label.useBy.mark?.useBy, '2026-03-07');
    assert.match(label.useBy.mark?.source ?? '', /day 1 is 1 Mar 2026, when its earliest part/);
    assert.equal(label.handling, 'Keep refrigerated');
    assert.equal(label.safeHandling.required, false);
    assert.equal(label.safeHandling.reason, 'ready to eat, as its formula says');
  });

  // The formula's word wins: a pack its kitchen says is not ready to eat carries the
  // instructions whatever its parts say. source: 9 CFR 381.125(b) (read, 2019 CFR)
  it('should carry the instructions when the pack says it is not ready to eat', () => {
    const raw = { ...HAM_PACK, label: { storage: 'refrigerated', ready_to_eat: false } } as const;
    const label = labelOf(raw, { 'ham-pump': [HAM], 'house-sauce': [SAUCE] });
    assert.equal(label.safeHandling.required, true);
    assert.equal(
      label.safeHandling.reason,
      'not ready to eat, as its formula says (9 CFR 317.2(l))',
    );
    assert.equal(label.useBy.mark, undefined);
  });

  it('should need no instructions on a pack with no meat or poultry in it', () => {
    const buns = pack([
      { formula: 'pit-bun', pieces: 2 },
      { formula: 'house-sauce', amount: '20 g' },
    ]);
    const label = labelOf(buns, { 'pit-bun': [BUN], 'house-sauce': [SAUCE] });
    assert.equal(label.safeHandling.required, false);
    assert.equal(label.safeHandling.reason, 'no meat or poultry part');
  });
});
