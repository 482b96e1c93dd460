import { describe, it } from 'node:test';
import assert from 'node:assert/strict';
import type { MixFormula, MixIngredient } from '../../formula/formula-types.ts';
import { checkMixFormula } from './check-mix-formula.ts';

function mix(ingredients: MixIngredient[]): MixFormula {
  return { formula: 1, id: 'aioli', title: 'Garlic aioli', kind: 'mix', ingredients };
}

describe('checkMixFormula', () => {
  it('should find no problem in a good formula', () => {
    const formula = mix([
      { name: 'olive oil', pct: 100, base: true },
      { name: 'egg yolk', pct: 12, raw_egg: true, allergens: ['egg'] },
      { name: 'garlic', pct: 5 },
    ]);
    assert.deepEqual(checkMixFormula(formula), []);
  });

  it('should report a formula with no base', () => {
    const [problem] = checkMixFormula(mix([{ name: 'olive oil', pct: 100 }]));
    assert.deepEqual(problem.path, ['ingredients']);
    assert.equal(problem.severity, 'error');
    assert.match(problem.message, /base: true/);
  });

  it('should report every base after the first', () => {
    const problems = checkMixFormula(
      mix([
        { name: 'olive oil', pct: 100, base: true },
        { name: 'garlic', pct: 5 },
        { name: 'canola oil', pct: 100, base: true },
      ]),
    );
    assert.deepEqual(
      problems.map((p) => p.path),
      [['ingredients', 2, 'base']],
    );
    assert.match(problems[0].message, /"olive oil" already is/);
  });

  it('should report a base that is not at 100 %', () => {
    const [problem] = checkMixFormula(mix([{ name: 'olive oil', pct: 90, base: true }]));
    assert.deepEqual(problem.path, ['ingredients', 0, 'pct']);
    assert.match(problem.message, /100 %/);
  });

  it('should report a name listed twice, ignoring case', () => {
    const [problem] = checkMixFormula(
      mix([
        { name: 'Olive oil', pct: 100, base: true },
        { name: 'olive OIL', pct: 10 },
      ]),
    );
    assert.deepEqual(problem.path, ['ingredients', 1, 'name']);
    assert.equal(problem.severity, 'error');
  });

  it('should warn about raw egg that does not list the egg allergen', () => {
    const [problem] = checkMixFormula(
      mix([
        { name: 'olive oil', pct: 100, base: true },
        { name: 'egg yolk', pct: 12, raw_egg: true },
      ]),
    );
    assert.deepEqual(problem.path, ['ingredients', 1, 'allergens']);
    assert.equal(problem.severity, 'warning');
  });
});
