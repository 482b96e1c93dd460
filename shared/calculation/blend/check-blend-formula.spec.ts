import { describe, it } from 'node:test';
import assert from 'node:assert/strict';
import type { BlendFormula } from '../../formula/formula-types.ts';
import { checkBlendFormula } from './check-blend-formula.ts';

function blend(extra: Partial<BlendFormula> = {}): BlendFormula {
  return {
    formula: 1,
    id: 'house-grind',
    title: 'House grind',
    kind: 'blend',
    components: [
      { key: 'lean', name: 'lean 90/10 trim', fat: 10 },
      { key: 'fat', name: '50/50 trim', fat: 50 },
    ],
    target: { fat: 20 },
    ...extra,
  };
}

describe('checkBlendFormula', () => {
  it('should find no problem in a good formula', () => {
    const formula = blend({
      portion: '4 oz',
      ingredients: [
        { name: 'salt', pct: 1.5 },
        { name: 'pepper', pct: 0.3 },
      ],
    });
    assert.deepEqual(checkBlendFormula(formula), []);
  });

  it('should report a component key used twice', () => {
    const formula = blend({
      components: [
        { key: 'trim', name: 'lean trim', fat: 10 },
        { key: 'trim', name: 'fat trim', fat: 50 },
      ],
    });
    const [problem] = checkBlendFormula(formula);
    assert.deepEqual(problem.path, ['components', 1, 'key']);
    assert.equal(problem.severity, 'error');
  });

  it('should report a target outside the two components at the target', () => {
    // derived (a blend is a weighted mean): the target must lie between the component fats
    const formula = blend({
      components: [
        { key: 'a', name: 'chuck trim', fat: 15 },
        { key: 'b', name: 'round trim', fat: 18 },
      ],
    });
    const [problem] = checkBlendFormula(formula);
    assert.deepEqual(problem.path, ['target']);
    assert.equal(problem.severity, 'error');
    assert.match(problem.message, /^20 % fat cannot be made from trimmings at 15 % and 18 % fat/);
  });

  it('should compare a chemical-lean target with the components', () => {
    // CL 60 is 40 % fat, which 10 % and 50 % trims can make; CL 40 is 60 %, which they cannot.
    assert.deepEqual(checkBlendFormula(blend({ target: { lean: 60 } })), []);
    assert.deepEqual(
      checkBlendFormula(blend({ target: { lean: 40 } })).map((p) => p.path),
      [['target']],
    );
  });

  it('should report a component with both fat and lean', () => {
    const formula = blend({
      components: [
        { key: 'lean', name: 'lean trim', fat: 10, lean: 90 },
        { key: 'fat', name: 'fat trim', fat: 50 },
      ],
    });
    assert.deepEqual(
      checkBlendFormula(formula).map((p) => p.path),
      [['components', 0]],
    );
  });

  it('should report a portion that is not a mass, with the reason', () => {
    const [problem] = checkBlendFormula(blend({ portion: '4 cups' }));
    assert.deepEqual(problem.path, ['portion']);
    assert.equal(problem.severity, 'error');
    assert.match(problem.message, /expected a mass .* "cups" is not a mass unit/);
  });

  it('should report a portion of 0 g', () => {
    const [problem] = checkBlendFormula(blend({ portion: '0 g' }));
    assert.deepEqual(problem.path, ['portion']);
    assert.match(problem.message, /more than 0 g/);
  });

  it('should report a seasoning listed twice, ignoring case', () => {
    const formula = blend({
      ingredients: [
        { name: 'Salt', pct: 1.5 },
        { name: 'pepper', pct: 0.3 },
        { name: 'salt ', pct: 0.5 },
      ],
    });
    const [problem] = checkBlendFormula(formula);
    assert.deepEqual(problem.path, ['ingredients', 2, 'name']);
    assert.equal(problem.severity, 'error');
  });

  it('should warn when the target is over the standard the formula names', () => {
    // source: 9 CFR 319.15(a), ≤ 30 % fat (read in training material quoting it)
    const [problem] = checkBlendFormula(blend({ standard: 'ground-beef', target: { fat: 32 } }));
    assert.deepEqual(problem.path, ['target']);
    assert.equal(problem.severity, 'warning');
    assert.match(problem.message, /30 %/);
  });

  it('should accept three trimmings whose fats reach the target between them', () => {
    // derived from the fat balance: the target must lie between the lowest and highest
    // component fat; 20 % lies between 10 % and 50 %.
    const formula = blend({
      components: [
        { key: 'lean', name: 'lean trim', fat: 10 },
        { key: 'plate', name: 'plate', fat: 30 },
        { key: 'fat', name: 'fat trim', fat: 50 },
      ],
    });
    assert.deepEqual(checkBlendFormula(formula), []);
  });

  it('should report a target outside every trimming of three, and a third key used twice', () => {
    // derived (a blend is a weighted mean): 60 % is above the fattest of 10, 30 and 50 %
    const formula = blend({
      target: { fat: 60 },
      components: [
        { key: 'lean', name: 'lean trim', fat: 10 },
        { key: 'fat', name: 'plate', fat: 30 },
        { key: 'fat', name: 'fat trim', fat: 50 },
      ],
    });
    const problems = checkBlendFormula(formula);
    assert.deepEqual(
      problems.map((p) => p.path),
      [['components', 2, 'key'], ['target']],
    );
    assert.match(problems[1].message, /60 % fat cannot be made from trimmings at 10 % to 50 % fat/);
  });
});
