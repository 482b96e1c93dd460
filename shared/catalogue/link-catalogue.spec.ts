import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { readFormula } from '../formula/read-formula.ts';
import type { Formula } from '../formula/formula-types.ts';
import { catalogueProblems, linkLines, type LinkCatalogue } from './link-catalogue.ts';
import { readCatalogue } from './read-catalogue.ts';

const CATALOGUE = `catalogue: 1
items:
  - key: kosher-salt
    name: salt
    formula_names: [kosher salt]
    kind: salt
    unit: kg
  - key: curing-salt-1
    name: curing salt
    formula_names: [cure no. 1]
    kind: curing-salt
    unit: kg
    nitrite: 6.25
  - key: sea-salt
    name: salt
    kind: salt
    unit: kg
  - key: dry-milk
    name: nonfat dry milk
    kind: dairy
    unit: kg
    allergens: [milk]
`;

function catalogue(text = CATALOGUE): LinkCatalogue {
  const reading = readCatalogue(text, 'formulas/catalogue.yaml');
  assert.ok(reading.catalogue, reading.problems.map((p) => p.message).join('; '));
  return { catalogue: reading.catalogue, places: reading.places, file: 'formulas/catalogue.yaml' };
}

function cure(lines: string): Formula {
  const text = `formula: 1
id: test-belly
title: Test belly
kind: cure
method: dry
product: bacon
species: pork
ingredients:
${lines}`;
  const reading = readFormula(text, 'test.yaml');
  assert.ok(reading.formula, reading.problems.map((p) => p.message).join('; '));
  return reading.formula;
}

const SALT = '  - { name: Kosher  SALT, pct: 2.25, salt: 100 }\n';
const CURE =
  '  - { name: pink cure, item: curing-salt-1, pct: 0.25, nitrite: 6.25, salt: 93.75 }\n';

describe('linking formula lines to the catalogue', () => {
  it('should link by the item key, and by a name however capitalised or spaced', () => {
    const linked = linkLines(cure(SALT + CURE), catalogue().catalogue);
    assert.deepEqual(
      linked.map(({ line, index }) => [line.name, index]),
      [
        ['Kosher  SALT', 0],
        ['pink cure', 1],
      ],
    );
    assert.deepEqual(catalogueProblems(cure(SALT + CURE), catalogue()), []);
  });

  it('should warn of a line with no item, and of a name two items answer to', () => {
    const formula = cure(
      `${SALT}  - { name: black pepper, pct: 0.3 }\n  - { name: salt, pct: 0.5, salt: 100 }\n`,
    );
    assert.deepEqual(catalogueProblems(formula, catalogue()), [
      {
        path: ['ingredients', 1],
        severity: 'warning',
        message:
          '"black pepper" is not in the catalogue (formulas/catalogue.yaml); add it there, or name its item with item:',
      },
      {
        path: ['ingredients', 2],
        severity: 'warning',
        message:
          '"salt" names more than one item in the catalogue (kosher-salt, sea-salt); say which with item:',
      },
    ]);
  });

  it("should refuse a cure's meat item the catalogue does not have", () => {
    const formula = { ...cure(CURE), meat_item: 'pork-bely' } as Formula;
    assert.deepEqual(catalogueProblems(formula, catalogue()), [
      {
        path: ['meat_item'],
        severity: 'error',
        message: 'there is no item "pork-bely" in the catalogue (formulas/catalogue.yaml)',
      },
    ]);
  });

  it('should refuse an item key the catalogue does not have, with the nearest key', () => {
    const formula = cure(CURE.replace('curing-salt-1', 'curing-salt-2'));
    assert.deepEqual(catalogueProblems(formula, catalogue()), [
      {
        path: ['ingredients', 0, 'item'],
        severity: 'error',
        message:
          'there is no item "curing-salt-2" in the catalogue (formulas/catalogue.yaml); did you mean "curing-salt-1"?',
      },
    ]);
  });

  it('should refuse a strength that differs from the catalogue, naming both places', () => {
    // The catalogue's nitrite: 6.25 is on line 13, column 5.
    const formula = cure(CURE.replace('nitrite: 6.25, salt: 93.75', 'nitrite: 6, salt: 94'));
    assert.deepEqual(catalogueProblems(formula, catalogue()), [
      {
        path: ['ingredients', 0, 'nitrite'],
        severity: 'error',
        message:
          'this line says 6 % sodium nitrite but the catalogue\'s "curing-salt-1" says 6.25 % (formulas/catalogue.yaml:13:5); one of them is wrong: check the supplier\'s label',
      },
    ]);
  });

  it('should refuse a curing salt whose line states no nitrite, which the batch would not count', () => {
    const formula = cure('  - { name: cure no. 1, pct: 0.25, salt: 93.75 }\n');
    const [problem] = catalogueProblems(formula, catalogue());
    assert.equal(problem.severity, 'error');
    assert.match(problem.message, /write nitrite: 6.25 on this line so the batch counts it/);
  });

  it('should warn when the catalogue knows an allergen the line does not declare', () => {
    const formula = cure('  - { name: nonfat dry milk, pct: 2 }\n');
    assert.deepEqual(
      catalogueProblems(formula, catalogue()).map((p) => [p.severity, p.message]),
      [
        [
          'warning',
          'the catalogue\'s "dry-milk" contains milk, which this line does not declare in its allergens',
        ],
      ],
    );
    const declared = cure('  - { name: nonfat dry milk, pct: 2, allergens: [milk] }\n');
    assert.deepEqual(catalogueProblems(declared, catalogue()), []);
  });
});
