import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import { describe, it } from 'node:test';
import { dec } from '../decimal.ts';
import { readFormula } from '../formula/read-formula.ts';
import { ingredientStatement } from '../labels/ingredient-statement.ts';
import { labelNames } from './label-names.ts';
import { readCatalogue } from './read-catalogue.ts';

const FORMULAS = new URL('../../formulas/', import.meta.url);
const read = (name: string): string => readFileSync(new URL(name, FORMULAS), 'utf8');

describe('label names from the catalogue', () => {
  const catalogue = readCatalogue(read('catalogue.yaml'), 'catalogue.yaml').catalogue;
  const belly = readFormula(read('quillmoor-belly.yaml'), 'quillmoor-belly.yaml').formula;

  it("should name the demo belly's cure as its items are labelled, the curing salt with its own ingredients", () => {
    assert.ok(catalogue && belly);
    assert.deepEqual(labelNames(belly, catalogue), [
      { path: ['ingredients', 0], name: 'sea salt', subIngredients: undefined },
      {
        path: ['ingredients', 1],
        name: 'curing salt',
        subIngredients: ['salt', 'sodium nitrite'],
      },
      { path: ['ingredients', 2], name: 'brown sugar', subIngredients: undefined },
      { path: ['ingredients', 3], name: 'black pepper', subIngredients: undefined },
    ]);
  });

  // A 5 000 g belly at the formula's own percentages, by hand: sea salt 2.25 % = 112.5 g, curing
  // salt 0.25 % = 12.5 g, brown sugar 1.2 % = 60 g, black pepper 0.3 % = 15 g. own example.
  // source: 21 CFR 101.4(a)(1), descending order of predominance by weight; 21 CFR 101.4(b)(2)(i),
  // a compound ingredient's own ingredients in parentheses after its name.
  it('should give the ingredient statement its names and sub-ingredients', () => {
    assert.ok(catalogue && belly);
    const grams = ['112.5', '12.5', '60', '15'];
    const statement = ingredientStatement([
      { name: 'pork belly', grams: dec('5000') },
      ...labelNames(belly, catalogue).map((line, i) => ({ ...line, grams: dec(grams[i]) })),
    ]);
    assert.equal(
      statement.list,
      'pork belly, sea salt, brown sugar, black pepper, curing salt (salt, sodium nitrite)',
    );
  });

  it('should keep the formula names without a catalogue', () => {
    assert.ok(belly);
    assert.deepEqual(
      labelNames(belly).map((line) => line.name),
      [
        'fine sea salt',
        'curing salt no. 1 (6.25 % nitrite)',
        'dark brown sugar',
        'cracked black pepper',
      ],
    );
  });
});
