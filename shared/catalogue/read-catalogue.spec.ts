import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { readCatalogue } from './read-catalogue.ts';

const GOOD = `catalogue: 1
items:
  - key: kosher-salt
    name: salt
    formula_names: [kosher salt]
    kind: salt
    unit: kg
  - key: curing-salt-1
    name: curing salt
    kind: curing-salt
    unit: kg
    sub_ingredients: [salt, sodium nitrite]
    nitrite: 6.25
  - key: worcestershire
    name: Worcestershire sauce
    kind: sauce
    unit: l
    allergens: [{ fish: anchovy }]
`;

describe('readCatalogue', () => {
  it('should read a catalogue and say where each item and its strength are', () => {
    const reading = readCatalogue(GOOD, 'catalogue.yaml');
    assert.deepEqual(reading.problems, []);
    assert.deepEqual(
      reading.catalogue?.items.map((item) => item.key),
      ['kosher-salt', 'curing-salt-1', 'worcestershire'],
    );
    assert.deepEqual(reading.catalogue?.items[1].sub_ingredients, ['salt', 'sodium nitrite']);
    // Line 8 is "  - key: curing-salt-1"; line 13 is "    nitrite: 6.25".
    assert.deepEqual(reading.places[1].item, { line: 8, column: 5 });
    assert.deepEqual(reading.places[1].nitrite, { line: 13, column: 5 });
  });

  it('should place a schema error at its key, in the catalogue file', () => {
    const reading = readCatalogue(
      GOOD.replace('unit: l', 'unit: litre'),
      'formulas/catalogue.yaml',
    );
    assert.equal(reading.catalogue, undefined);
    assert.equal(reading.problems.length, 1);
    const [problem] = reading.problems;
    assert.deepEqual(
      { file: problem.file, line: problem.line, column: problem.column, path: problem.path },
      { file: 'formulas/catalogue.yaml', line: 17, column: 5, path: ['items', 2, 'unit'] },
    );
    assert.match(problem.message, /must be one of g, kg, oz, lb, ml, l, each, not "litre"/);
  });

  it('should ask a curing salt for its nitrite', () => {
    const reading = readCatalogue(GOOD.replace('    nitrite: 6.25\n', ''), 'catalogue.yaml');
    assert.equal(reading.catalogue, undefined);
    assert.deepEqual(
      reading.problems.map((p) => [p.line, p.message]),
      [[8, '"nitrite" is missing']],
    );
  });

  it('should refuse an allergen the formula schema does not know', () => {
    const reading = readCatalogue(GOOD.replace('{ fish: anchovy }', 'shellfish'), 'catalogue.yaml');
    assert.equal(reading.problems.length, 1);
    assert.equal(reading.problems[0].line, 18);
    assert.match(reading.problems[0].message, /crustacean shellfish/);
  });

  it('should refuse a key used twice, and a formula name given to two items', () => {
    const twice = `${GOOD}  - key: kosher-salt
    name: salt
    formula_names: [Kosher  Salt]
    kind: salt
    unit: kg
`;
    const reading = readCatalogue(twice, 'catalogue.yaml');
    assert.equal(reading.catalogue, undefined);
    assert.deepEqual(
      reading.problems.map((p) => [p.line, p.column, p.message]),
      [
        [19, 5, 'the key "kosher-salt" is already item 1\'s; every item needs its own key'],
        [
          21,
          21,
          '"Kosher  Salt" is already a formula name of item 1 (kosher-salt); a formula name may belong to one item only',
        ],
      ],
    );
  });

  it('should read a weight per unit, and refuse one that does not fit its item at its place', () => {
    const eggs = `${GOOD}  - key: eggs
    name: eggs
    kind: egg
    unit: each
    weighs: 50 g
`;
    assert.equal(readCatalogue(eggs, 'catalogue.yaml').catalogue?.items[3].weighs, '50 g');
    const reading = readCatalogue(
      eggs
        .replace('weighs: 50 g', 'weighs: 50 g per cup')
        .replace('unit: kg', 'unit: kg\n    weighs: 5 g'),
      'formulas/catalogue.yaml',
    );
    assert.equal(reading.catalogue, undefined);
    // Line 8 is the salt's "weighs: 5 g", put under its "unit: kg"; line 24 the eggs' weighs.
    assert.deepEqual(
      reading.problems.map((p) => [p.file, p.line, p.column, p.message]),
      [
        [
          'formulas/catalogue.yaml',
          8,
          5,
          'expected no weight per unit, but got "5 g": this item is stocked by weight (kg): leave weighs out',
        ],
        [
          'formulas/catalogue.yaml',
          24,
          5,
          'expected the weight of one, such as "50 g" or "1.8 oz", but got "50 g per cup": this item is stocked by count: give one’s weight',
        ],
      ],
    );
  });

  it('should refuse a file that is not a set of keys', () => {
    const reading = readCatalogue('- salt\n- pepper\n', 'catalogue.yaml');
    assert.match(reading.problems[0].message, /a catalogue file is a set of keys/);
  });
});
