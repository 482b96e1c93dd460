import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { dec } from '../decimal.ts';
import { ingredientStatement } from './ingredient-statement.ts';

// A dry-cured bacon batch on 5 000 g of belly at 120 ppm nitrite and 2.5 % salt, worked by hand:
// source: FSIS Directive 7620.3, Processing Inspectors' Calculations Handbook (1995), ch. 3,
// ppm = cure mix × nitrite fraction × 1 000 000 ÷ meat: 5 000 × 120 ÷ 1 000 000 ÷ 0.0625 =
// 9.60 g of a 6.25 % curing salt, which carries 9.60 × 0.9375 = 9.00 g of salt; 2.5 % salt is
// 125.00 g, so 116.00 g of plain salt. Brown sugar 1 % = 50 g and black pepper 0.1 % = 5 g are
// the own example's choices. The curing salt's make-up, 93.75 % salt and 6.25 % sodium nitrite,
// is common practice, no source, so its supplier lists salt first.
const BACON = [
  { name: 'pork belly', grams: dec('5000') },
  { name: 'curing salt', grams: dec('9.60'), subIngredients: ['salt', 'sodium nitrite'] },
  { name: 'black pepper', grams: dec('5') },
  { name: 'salt', grams: dec('116.00') },
  { name: 'brown sugar', grams: dec('50') },
];

describe('ingredientStatement', () => {
  // source: 21 CFR 101.4(a)(1), descending order of predominance by weight; 21 CFR 101.4(b)(2)(i),
  // a compound ingredient's own ingredients in parentheses after its name.
  it('should list the bacon heaviest first with the curing salt made of salt and sodium nitrite', () => {
    const statement = ingredientStatement(BACON);
    assert.equal(
      statement.list,
      'pork belly, salt, brown sugar, curing salt (salt, sodium nitrite), black pepper',
    );
    assert.equal(statement.text, `Ingredients: ${statement.list}`);
    assert.deepEqual(
      statement.entries.map((entry) => entry.grams.toFixed(2)),
      ['5000.00', '116.00', '50.00', '9.60', '5.00'],
    );
  });

  // derived: salt weighed in twice is still one ingredient of the food; 116 + 9 = 125 g
  it('should add up lines of the same name and place them by the sum', () => {
    const statement = ingredientStatement([
      { name: 'pork belly', grams: dec('5000') },
      { name: 'brown sugar', grams: dec('100') },
      { name: 'Salt', grams: dec('60') },
      { name: 'salt ', grams: dec('65') },
    ]);
    assert.equal(statement.list, 'pork belly, Salt, brown sugar');
    assert.ok(statement.entries[1].grams.equals(dec('125')));
  });

  // common practice, no source: the rule orders by weight only, so equal weights keep the
  // formula's order, which the cook wrote.
  it('should keep the formula order for ingredients of equal weight', () => {
    const statement = ingredientStatement([
      { name: 'beef', grams: dec('1000') },
      { name: 'onion', grams: dec('20') },
      { name: 'garlic', grams: dec('20.0') },
      { name: 'paprika', grams: dec('20') },
    ]);
    assert.equal(statement.list, 'beef, onion, garlic, paprika');
  });

  // derived: an ingredient not in this batch is not in the food
  it('should leave out an ingredient weighing nothing and refuse a negative weight', () => {
    const statement = ingredientStatement([
      { name: 'beef', grams: dec('1000') },
      { name: 'ice', grams: dec('0') },
    ]);
    assert.equal(statement.list, 'beef');
    assert.throws(
      () => ingredientStatement([{ name: 'beef', grams: dec('-1') }]),
      /beef weighs less than nothing/,
    );
  });
});
