import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { AssemblyComponent } from '../../formula/formula-types.ts';
import { checkAssemblyFormula } from './check-assembly-formula.ts';
import { BURGER, assembly } from './plan-fixtures.ts';

/** The problems of a one-component assembly, as "path: message". */
function problems(component: AssemblyComponent): string[] {
  return checkAssemblyFormula(assembly('test-plate', [component])).map(
    (p) => `${p.severity} ${p.path.join('.')}: ${p.message}`,
  );
}

describe('checkAssemblyFormula: what the schema cannot say about one assembly file', () => {
  it('should find nothing wrong with the smokehouse burger', () => {
    assert.deepEqual(checkAssemblyFormula(BURGER), []);
  });

  it('should want exactly one quantity per component', () => {
    assert.match(
      problems({ formula: 'house-sauce' })[0],
      /^error components\.0: say how much of house-sauce goes into one unit: one of portions/,
    );
    assert.deepEqual(problems({ formula: 'chuck-grind', portions: 2, amount: '200 g' }), [
      'error components.0.amount: give one quantity for chuck-grind, not portions and amount',
    ]);
  });

  it('should keep slice and slices together', () => {
    assert.deepEqual(problems({ formula: 'quillmoor-belly', slices: 3, thickness: '4 cm' }), [
      'error components.0.slices: slices needs slice, the finished weight of one slice (slice: 25 g)',
    ]);
    assert.deepEqual(problems({ formula: 'quillmoor-belly', amount: '60 g', slice: '25 g' }), [
      'error components.0.slice: slice is the weight of one slice: it goes with slices (how many)',
    ]);
  });

  it('should keep a cure’s sizes to a cure’s quantities', () => {
    assert.deepEqual(problems({ formula: 'pit-bun', pieces: 1, thickness: '4 cm' }), [
      "error components.0.thickness: thickness is the size of a cure's pieces, for its hold rule: it goes with slices or amount",
    ]);
  });

  it('should read every weight and length, and want them over zero', () => {
    assert.match(
      problems({ formula: 'house-sauce', amount: '20 parsecs' })[0],
      /^error components\.0\.amount: /,
    );
    assert.deepEqual(problems({ formula: 'house-sauce', amount: '0 g' }), [
      'error components.0.amount: amount must be more than 0, not "0 g"',
    ]);
    assert.match(
      problems({ formula: 'quillmoor-belly', slices: 2, slice: '25 g', thickness: '4 kg' })[0],
      /^error components\.0\.thickness: .*"kg" is not a length unit/,
    );
  });

  it('should refuse an assembly that names itself, and warn when one formula is named twice', () => {
    assert.deepEqual(problems({ formula: 'test-plate', units: 1 }), [
      'error components.0.formula: an assembly cannot be a part of itself',
    ]);
    const twice = assembly('twice', [
      { formula: 'house-sauce', amount: '10 g' },
      { formula: 'house-sauce', amount: '5 g' },
    ]);
    assert.deepEqual(
      checkAssemblyFormula(twice).map((p) => `${p.severity} ${p.path.join('.')}`),
      ['warning components.1.formula'],
    );
  });
});
