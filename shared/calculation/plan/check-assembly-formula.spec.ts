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

describe('checkAssemblyFormula: a part applied to another part (on, pct)', () => {
  const brisket = { formula: 'brisket-brine', amount: '140 g', thickness: '5 cm' };
  const errors = (...components: AssemblyComponent[]): string[] =>
    checkAssemblyFormula(assembly('sandwich', components))
      .filter((p) => p.severity === 'error')
      .map((p) => `${p.path.join('.')}: ${p.message}`);

  it('should take a rub applied to a brisket of the same assembly', () => {
    assert.deepEqual(
      errors(brisket, { formula: 'brisket-rub', on: 'brisket-brine', pct: 1.5 }),
      [],
    );
  });

  it('should keep on and pct together', () => {
    assert.deepEqual(errors(brisket, { formula: 'brisket-rub', on: 'brisket-brine' }), [
      'components.1: say how much of brisket-rub goes into one unit: one of portions (a blend), pieces (a dough), slices with slice (a cure), amount (any kind), units (another assembly) or pct with on (a part applied to another, such as a rub)',
      "components.1.on: on names the part brisket-rub goes on: it goes with pct, its weight as a percent of that part's green weight (pct: 1.5)",
    ]);
    assert.deepEqual(errors(brisket, { formula: 'brisket-rub', pct: 1.5 }), [
      'components.1.pct: pct is a share of the part brisket-rub goes on: name that part with on (on: brisket-brine)',
    ]);
  });

  it('should refuse, at its line, a part applied to a part not in the assembly, or to itself', () => {
    assert.deepEqual(errors(brisket, { formula: 'brisket-rub', on: 'quillmoor-belly', pct: 1 }), [
      'components.1.on: brisket-rub goes on quillmoor-belly, which is not a part of this assembly: add quillmoor-belly as a part, or name one of its parts (brisket-brine)',
    ]);
    assert.deepEqual(errors(brisket, { formula: 'brisket-rub', on: 'brisket-rub', pct: 1 }), [
      'components.1.on: brisket-rub cannot go on itself: name another part of this assembly',
    ]);
  });

  it('should refuse parts applied to each other in a circle, at each of their lines', () => {
    assert.deepEqual(
      errors(
        { formula: 'brisket-brine', on: 'quillmoor-belly', pct: 10, thickness: '5 cm' },
        { formula: 'quillmoor-belly', on: 'brisket-brine', pct: 10, thickness: '4 cm' },
      ),
      [
        'components.0.on: brisket-brine → quillmoor-belly → brisket-brine goes round in a circle: a part cannot go on a part that goes on it',
        'components.1.on: quillmoor-belly → brisket-brine → quillmoor-belly goes round in a circle: a part cannot go on a part that goes on it',
      ],
    );
  });
});
