import { describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { dec, sum } from '../../decimal.ts';
import { POOLISH, poolishDough } from './dough-fixtures.ts';
import type { DoughLine } from './dough-line.ts';
import { prefermentLine, prefermentShare, splitPreferment } from './preferment.ts';

const table = (lines: readonly DoughLine[]) =>
  lines.map((line) => [line.name, line.grams.toString(), line.percent.toString()]);

describe('splitting off a preferment', () => {
  it('should give each preferment ingredient its share of the total flour', () => {
    // source: Bread Bakers Guild of America, Formatting Guild Formulas (2009): 30 % of the flour
    // prefermented at 100 % hydration takes 30 points of the water's baker's percentage
    assert.equal(prefermentShare(POOLISH, 100).toString(), '30');
    assert.equal(prefermentShare(POOLISH, 0.3).toString(), '0.09');
  });

  it('should weigh the preferment in % of its own flour and the final dough as overall − preferment', () => {
    // own example, derived: 1000 g flour, 30 % poolish
    const formula = poolishDough();
    const split = splitPreferment(formula.ingredients, POOLISH, dec(1000));
    assert.equal(split.prefermentFlour.toString(), '300');
    assert.deepEqual(table(split.preferment), [
      ['Bread flour', '300', '100'],
      ['Water', '300', '100'],
      ['Fresh yeast', '0.9', '0.3'],
    ]);
    assert.deepEqual(table(split.final), [
      ['Bread flour', '700', '70'],
      ['Water', '400', '40'],
      ['Salt', '20', '2'],
      ['Fresh yeast', '14.1', '1.41'],
    ]);
    const poolish = prefermentLine(POOLISH, split.preferment);
    assert.equal(poolish.role, 'preferment');
    assert.equal(poolish.grams.toString(), '600.9');
    assert.equal(poolish.percent.toString(), '60.09');
  });

  it('should preserve the total: final dough plus preferment line equals the overall formula', () => {
    // own example, derived: 1000 + 700 + 20 + 15 = 1735 g
    const formula = poolishDough();
    const split = splitPreferment(formula.ingredients, POOLISH, dec(1000));
    const final = [...split.final, prefermentLine(POOLISH, split.preferment)];
    assert.equal(sum(final.map((line) => line.grams)).toString(), '1735');
    assert.equal(sum(final.map((line) => line.percent)).toString(), '173.5');
  });

  it('should leave out an ingredient the preferment uses up', () => {
    // own example, derived: a 70 % poolish at 100 % hydration takes all of 70 % water
    const preferment = { ...POOLISH, flour_pct: 70 };
    const split = splitPreferment(poolishDough(preferment).ingredients, preferment, dec(1000));
    assert.deepEqual(
      split.final.map((line) => line.name),
      ['Bread flour', 'Salt', 'Fresh yeast'],
    );
  });

  it('should refuse a preferment that needs more than the overall formula holds', () => {
    const preferment = { ...POOLISH, flour_pct: 80 };
    assert.throws(() =>
      splitPreferment(poolishDough(preferment).ingredients, preferment, dec(1000)),
    );
  });
});
