import { describe, it } from 'node:test';
import assert from 'node:assert/strict';
import type { ContentProblem } from '../../formula/formula-problem.ts';
import { checkDoughFormula } from './check-dough-formula.ts';
import { bunDough, doughFormula, leanDough, POOLISH, poolishDough } from './dough-fixtures.ts';

const paths = (problems: ContentProblem[]) =>
  problems.map((problem) => [problem.severity, problem.path]);

describe('checking a dough formula', () => {
  it('should find nothing wrong with sound formulas', () => {
    assert.deepEqual(checkDoughFormula(leanDough()), []);
    assert.deepEqual(
      checkDoughFormula(bunDough({ piece: '80 g', ddt: { target: '78 °F', friction: '14 °F' } })),
      [],
    );
    assert.deepEqual(checkDoughFormula(poolishDough()), []);
  });

  it('should want at least one flour', () => {
    const problems = checkDoughFormula(doughFormula([{ name: 'Water', pct: 70 }]));
    assert.deepEqual(paths(problems), [['error', ['ingredients']]]);
    assert.match(problems[0].message, /flour: true/);
  });

  it('should want the flours to add up to exactly 100 %, naming them', () => {
    const problems = checkDoughFormula(
      doughFormula([
        { name: 'Bread flour', pct: 80, flour: true },
        { name: 'Rye flour', pct: 15, flour: true },
        { name: 'Water', pct: 70 },
      ]),
    );
    assert.deepEqual(paths(problems), [['error', ['ingredients']]]);
    assert.match(problems[0].message, /95 %/);
    assert.match(problems[0].message, /Bread flour 80 %, Rye flour 15 %/);
  });

  it('should accept flours that add up to 100 % in decimals', () => {
    const formula = doughFormula([
      { name: 'Bread flour', pct: 70.1, flour: true },
      { name: 'Rye flour', pct: 19.7, flour: true },
      { name: 'Spelt flour', pct: 10.2, flour: true },
    ]);
    assert.deepEqual(checkDoughFormula(formula), []);
  });

  it('should want ingredient names to be unique regardless of capitals', () => {
    const formula = leanDough();
    formula.ingredients.push({ name: 'water ', pct: 3 });
    const problems = checkDoughFormula(formula);
    assert.deepEqual(paths(problems), [['error', ['ingredients', 4, 'name']]]);
    assert.match(problems[0].message, /"water "/);
  });

  it('should want every preferment ingredient in the overall formula', () => {
    const preferment = {
      ...POOLISH,
      ingredients: [...POOLISH.ingredients, { name: 'Rye flour', pct: 5 }],
    };
    const problems = checkDoughFormula(poolishDough(preferment));
    assert.deepEqual(paths(problems), [['error', ['preferment', 'ingredients', 3, 'name']]]);
    assert.match(problems[0].message, /"Rye flour".*not in the overall formula/);
  });

  it('should want the preferment flours to add up to 100 % of its own flour', () => {
    const preferment = {
      ...POOLISH,
      ingredients: [
        { name: 'Bread flour', pct: 90 },
        { name: 'Water', pct: 100 },
      ],
    };
    const problems = checkDoughFormula(poolishDough(preferment));
    assert.deepEqual(paths(problems), [['error', ['preferment', 'ingredients']]]);
    assert.match(problems[0].message, /90 %/);
  });

  it('should refuse a preferment that needs more of an ingredient than the overall formula holds', () => {
    // own example, derived: 80 % of the flour at 100 % hydration needs 80 % water; the formula has 70
    const problems = checkDoughFormula(poolishDough({ ...POOLISH, flour_pct: 80 }));
    assert.deepEqual(paths(problems), [['error', ['preferment', 'ingredients', 1, 'pct']]]);
    assert.match(problems[0].message, /more Water than the whole batch has/);
    assert.match(problems[0].message, /80 % of the total flour.*has 70 %/);
  });

  it('should accept a preferment that uses up an ingredient exactly', () => {
    assert.deepEqual(checkDoughFormula(poolishDough({ ...POOLISH, flour_pct: 70 })), []);
  });

  it('should want a piece weight that is a weight above 0', () => {
    assert.deepEqual(paths(checkDoughFormula(leanDough({ piece: 'ninety' }))), [
      ['error', ['piece']],
    ]);
    assert.deepEqual(paths(checkDoughFormula(leanDough({ piece: '90 ml' }))), [
      ['error', ['piece']],
    ]);
    assert.deepEqual(paths(checkDoughFormula(leanDough({ piece: '0 g' }))), [['error', ['piece']]]);
    assert.deepEqual(checkDoughFormula(leanDough({ piece: '3 oz' })), []);
  });

  it('should want a desired dough temperature between 10 and 40 °C', () => {
    const at = (target: string) => paths(checkDoughFormula(leanDough({ ddt: { target } })));
    assert.deepEqual(at('26 °C'), []);
    assert.deepEqual(at('78 °F'), []);
    assert.deepEqual(at('45 °C'), [['error', ['ddt', 'target']]]);
    // 78 written without its scale reads as nothing; 9 °C is too cold to be meant
    assert.deepEqual(at('78'), [['error', ['ddt', 'target']]]);
    assert.deepEqual(at('9 °C'), [['error', ['ddt', 'target']]]);
  });

  it('should want a friction factor that is a temperature rise', () => {
    const problems = checkDoughFormula(leanDough({ ddt: { target: '26 °C', friction: '14' } }));
    assert.deepEqual(paths(problems), [['error', ['ddt', 'friction']]]);
  });

  it('should warn when an ingredient gives both food and water_pct', () => {
    const formula = bunDough();
    formula.ingredients[1] = { ...formula.ingredients[1], water_pct: 87 };
    const problems = checkDoughFormula(formula);
    assert.deepEqual(paths(problems), [['warning', ['ingredients', 1, 'water_pct']]]);
    assert.match(problems[0].message, /"Whole milk".*87 %.*88\.13 %/);
  });
});
