import { describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { dec } from '../../decimal.ts';
import { gramsToOunces, parseMass } from '../../units/mass.ts';
import {
  doughForFlour,
  findIngredient,
  flourForDough,
  gramsAtPercent,
  totalFormulaPercent,
} from './bakers-percent.ts';
import { leanDough } from './dough-fixtures.ts';

describe("baker's percentages", () => {
  it('should add up the total formula percentage', () => {
    // source: course worksheet, pieces × piece weight (issuing school not identified)
    assert.equal(totalFormulaPercent(leanDough().ingredients).toString(), '170');
  });

  it('should find 794.70 g of flour in 3000 g of a 377.5 % formula', () => {
    // source: Professional Cooking (culinary textbook), "Procedure for converting a formula to a
    // new yield"
    assert.equal(flourForDough(dec(3000), dec('377.5')).toFixed(2), '794.70');
  });

  it('should find 25.43 oz of flour in 96 oz of a 377.5 % formula', () => {
    // source: Professional Cooking (culinary textbook), "Procedure for converting a formula to a
    // new yield"
    const flour = flourForDough(parseMass('96 oz'), dec('377.5'));
    assert.equal(gramsToOunces(flour).toFixed(2), '25.43');
  });

  it('should work out flour and every ingredient for 73 pieces of 390 g before rounding', () => {
    // source: course worksheet, pieces × piece weight (issuing school not identified)
    const dough = dec(73).times(390);
    assert.equal(dough.toString(), '28470');
    const flour = flourForDough(dough, dec(170));
    assert.equal(flour.toFixed(2), '16747.06');
    const water = gramsAtPercent(flour, dec(67));
    assert.equal(water.toFixed(2), '11220.53');
    assert.equal(gramsAtPercent(flour, dec(2)).toFixed(2), '334.94');
    assert.equal(gramsAtPercent(flour, dec(1)).toFixed(2), '167.47');
    // The worksheet rounds flour to 16 747 g first and prints 11 220.49 g water; we do not.
    assert.notEqual(water.toFixed(2), '11220.49');
    assert.equal(doughForFlour(flour, dec(170)).toFixed(2), '28470.00');
  });

  it('should match ingredient names regardless of capitals and spaces', () => {
    const found = findIngredient(leanDough().ingredients, '  bread FLOUR ');
    assert.equal(found?.name, 'Bread flour');
  });

  it('should refuse a formula that adds up to 0 %', () => {
    assert.throws(() => flourForDough(dec(100), dec(0)), RangeError);
  });
});
