import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { AssemblyComponent, CureFormula } from '../../formula/formula-types.ts';
import { assemblyLibraryIssues, checkAssemblyLibrary } from './check-assembly-library.ts';
import { BELLY, BUN, BURGER, GRIND, KITCHEN, assembly, libraryOf } from './plan-fixtures.ts';

/** The issues of a one-component assembly against the demo kitchen, as "reason path: message". */
function issues(component: AssemblyComponent, library = KITCHEN): string[] {
  return assemblyLibraryIssues(assembly('test-plate', [component]), library).map(
    (issue) => `${issue.reason} ${issue.path.join('.')}: ${issue.message}`,
  );
}

describe('checkAssemblyLibrary: an assembly against the other formulas', () => {
  it('should find nothing wrong with the smokehouse burger in its kitchen', () => {
    assert.deepEqual(checkAssemblyLibrary(BURGER, KITCHEN), []);
  });

  it('should want every formula named to exist', () => {
    assert.deepEqual(issues({ formula: 'chuck-grnd', portions: 2 }), [
      'missing-formula components.0.formula: no formula "chuck-grnd" among the formulas (or its file has errors); did you mean "chuck-grind"?',
    ]);
  });

  it('should want each quantity to fit the kind it names', () => {
    assert.deepEqual(issues({ formula: 'pit-bun', portions: 2 }), [
      'wrong-kind components.0.portions: pit-bun is a dough: portions are for a blend; give pieces or amount',
    ]);
    assert.deepEqual(issues({ formula: 'chuck-grind', slices: 2, slice: '30 g' }), [
      'wrong-kind components.0.slices: chuck-grind is a blend: slices are for a cure; give portions or amount',
    ]);
    assert.deepEqual(issues({ formula: 'quillmoor-belly', units: 1 }), [
      'wrong-kind components.0.units: quillmoor-belly is a cure: units are for an assembly; give slices (with slice) or amount',
    ]);
  });

  it('should want a portion weight for portions and a piece weight for pieces', () => {
    const { portion: _portion, ...noPortion } = GRIND;
    const { piece: _piece, ...noPiece } = BUN;
    assert.deepEqual(issues({ formula: 'chuck-grind', portions: 2 }, libraryOf(noPortion)), [
      'invalid-assembly components.0.portions: chuck-grind has no portion weight: add portion: to it, or give amount: here',
    ]);
    assert.deepEqual(issues({ formula: 'pit-bun', pieces: 1 }, libraryOf(noPiece)), [
      'invalid-assembly components.0.pieces: pit-bun has no piece weight: add piece: to it, or give amount: here',
    ]);
  });

  it('should want the size a cure’s hold rule goes by, and keep sizes to cures', () => {
    assert.deepEqual(issues({ formula: 'quillmoor-belly', amount: '75 g' }), [
      "needs-size components.0: quillmoor-belly's hold rule goes by thickness: give thickness: here (e.g. thickness: 4 cm)",
    ]);
    const byWeight: CureFormula = { ...BELLY, hold: { days_per_kg: 2 } };
    assert.deepEqual(
      issues(
        { formula: 'quillmoor-belly', amount: '75 g', thickness: '4 cm' },
        libraryOf(byWeight),
      ),
      [
        "needs-size components.0: quillmoor-belly's hold rule goes by the heaviest piece: give largest_piece: here (e.g. largest_piece: 2.5 kg)",
      ],
    );
    const pump: CureFormula = { ...BELLY, method: 'pump', hold: undefined };
    assert.deepEqual(issues({ formula: 'quillmoor-belly', amount: '75 g' }, libraryOf(pump)), [
      'needs-size components.0: quillmoor-belly has no hold rule, so its start day cannot be planned: add hold: to it',
    ]);
    assert.deepEqual(issues({ formula: 'house-sauce', amount: '20 g', thickness: '1 cm' }), [
      "invalid-assembly components.0.thickness: thickness is the size of a cure's pieces; house-sauce is a mix",
    ]);
  });

  it('should find a cycle through nested assemblies', () => {
    const outer = assembly('outer', [{ formula: 'middle', units: 1 }]);
    const middle = assembly('middle', [{ formula: 'inner', units: 2 }]);
    const inner = assembly('inner', [{ formula: 'outer', units: 1 }]);
    const library = libraryOf(outer, middle, inner);
    assert.deepEqual(
      checkAssemblyLibrary(outer, library).map((p) => p.message),
      ['outer → middle → inner → outer goes round in a circle: an assembly cannot contain itself'],
    );
    // A cycle that does not pass through this assembly is the other assemblies' problem.
    const top = assembly('top', [{ formula: 'middle', units: 1 }]);
    assert.deepEqual(checkAssemblyLibrary(top, library), []);
  });
});

describe('checkAssemblyLibrary: a part applied to another part', () => {
  it('should want the part it goes on to be a cure, whose green weight pct is a share of', () => {
    const plate = assembly('test-plate', [
      { formula: 'house-sauce', amount: '20 g' },
      { formula: 'chuck-grind', on: 'house-sauce', pct: 2 },
    ]);
    assert.deepEqual(
      assemblyLibraryIssues(plate, KITCHEN).map(
        (i) => `${i.reason} ${i.path.join('.')}: ${i.message}`,
      ),
      [
        "wrong-kind components.1.on: chuck-grind goes on house-sauce, a mix: pct is a share of a cure's green weight, so only a cure can take a part applied to it",
      ],
    );
  });

  it('should not let an assembly be applied to a part', () => {
    const plate = assembly('test-plate', [
      { formula: 'quillmoor-belly', amount: '20 g', thickness: '4 cm' },
      { formula: 'smokehouse-burger', on: 'quillmoor-belly', pct: 2 },
    ]);
    assert.deepEqual(
      assemblyLibraryIssues(plate, KITCHEN).map((i) => `${i.reason} ${i.path.join('.')}`),
      ['wrong-kind components.1.pct'],
    );
  });
});
