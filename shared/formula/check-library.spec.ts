import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { checkLibrary, formulaLibrary } from './check-library.ts';
import { formatProblem, readFormula } from './read-formula.ts';

const SAUCE = `formula: 1
id: house-sauce
title: Sauce
kind: mix
ingredients:
  - { name: mayonnaise, pct: 100, base: true }
`;

const PLATE = `formula: 1
id: plate
title: Plate
kind: assembly
components:
  - { formula: house-sauce, amount: 20 g }
  - { formula: house-sauce, portions: 2 }
  - formula: pit-bun
    pieces: 1
`;

function read(files: Record<string, string>) {
  const list = Object.entries(files).map(([file, text]) => ({
    file,
    reading: readFormula(text, file),
  }));
  return { list, checked: checkLibrary(list, (file) => files[file]) };
}

describe('checkLibrary: the formulas of a folder against each other', () => {
  it('should place each cross-file problem at its component, by line and column', () => {
    const { checked } = read({ 'house-sauce.yaml': SAUCE, 'plate.yaml': PLATE });
    assert.deepEqual(checked[0].problems, []);
    assert.deepEqual(checked[1].problems.map(formatProblem), [
      'plate.yaml:7:7: warning: house-sauce is named twice; the plan adds the two together (at components[2].formula)',
      'plate.yaml:7:29: error: house-sauce is a mix: portions are for a blend; give amount (at components[2].portions)',
      'plate.yaml:8:5: error: no formula "pit-bun" among the formulas (or its file has errors) (at components[3].formula)',
    ]);
  });

  it('should take the formula away from an assembly with cross-file errors, as from any file with errors', () => {
    const { list, checked } = read({ 'house-sauce.yaml': SAUCE, 'plate.yaml': PLATE });
    assert.ok(list[1].reading.formula);
    assert.equal(checked[1].formula, undefined);
  });

  it('should leave a clean assembly as it was read', () => {
    const clean = PLATE.split('\n').slice(0, 6).join('\n') + '\n';
    const { list, checked } = read({ 'house-sauce.yaml': SAUCE, 'plate.yaml': clean });
    assert.equal(checked[1], list[1].reading);
  });

  it('should build the library from the formulas that read cleanly, the first file of an id winning', () => {
    const { list } = read({
      'a.yaml': SAUCE,
      'b.yaml': SAUCE.replace('title: Sauce', 'title: Second'),
      'c.yaml': 'kind: nonsense\n',
    });
    const library = formulaLibrary(list);
    assert.deepEqual([...library.keys()], ['house-sauce']);
    assert.equal(library.get('house-sauce')?.title, 'Sauce');
  });
});

describe('the assembly schema', () => {
  it('should refuse an unknown key in a component, a lead_days out of range and a bad formula id', () => {
    const reading = readFormula(
      `${PLATE.split('\n').slice(0, 5).join('\n')}
  - { formula: House_Sauce, amount: 20 g, spoons: 2 }
`,
      'plate.yaml',
    );
    assert.deepEqual(reading.problems.map(formatProblem), [
      'plate.yaml:6:7: error: "formula" must be a formula id: lower-case letters, digits and dashes, e.g. "chuck-grind", not "House_Sauce" (at components[1].formula)',
      'plate.yaml:6:43: error: unknown key "spoons" (allowed here: formula, portions, pieces, slices, slice, amount, units, on, pct, thickness, largest_piece) (at components[1].spoons)',
    ]);
    const late = readFormula(`${SAUCE}lead_days: 61\n`, 'house-sauce.yaml');
    assert.deepEqual(late.problems.map(formatProblem), [
      'house-sauce.yaml:7:1: error: "lead_days" must be at most 60, not 61 (at lead_days)',
    ]);
  });
});
