import assert from 'node:assert/strict';
import { readFileSync, readdirSync } from 'node:fs';
import { describe, it } from 'node:test';
import { checkLibrary } from '../../../shared/formula/check-library.ts';
import { readFormula } from '../../../shared/formula/read-formula.ts';
import { starterParts, starterYaml, type LibraryEntry } from './formula-starters.ts';

const FOLDER = new URL('../../../formulas/', import.meta.url);
const DEMO = readdirSync(FOLDER)
  .filter((name) => name.endsWith('.yaml'))
  .map((name) => ({ file: name, text: readFileSync(new URL(name, FOLDER), 'utf8') }));

/** The demo formulas as the list of formulas gives them. */
function demoLibrary(): LibraryEntry[] {
  return DEMO.map(({ file, text }) => {
    const formula = readFormula(text, file).formula;
    return { id: formula?.id ?? null, kind: formula?.kind ?? null, valid: !!formula };
  });
}

/** The problems of a starter assembly made from `library`, checked against the demo formulas. */
function starterProblems(library: readonly LibraryEntry[]): unknown[] {
  const text = starterYaml('assembly', 'staff-lunch', 'Staff lunch: a plate', library);
  const reading = readFormula(text, 'staff-lunch.yaml');
  assert.equal(reading.formula?.kind, 'assembly', JSON.stringify(reading.problems));
  const files = [
    ...DEMO.map(({ file, text }) => ({ file, reading: readFormula(text, file) })),
    { file: 'staff-lunch.yaml', reading },
  ];
  const checked = checkLibrary(files, (file) =>
    file === 'staff-lunch.yaml' ? text : (DEMO.find((d) => d.file === file)?.text ?? ''),
  );
  return [...(checked.at(-1)?.problems ?? [])];
}

describe('the starter of a new assembly', () => {
  it('should name a blend, a dough and a mix the library has, by finished weight', () => {
    assert.equal(
      starterParts(demoLibrary()),
      [
        '  - { formula: chuck-grind, amount: 150 g }',
        '  - { formula: pit-bun, amount: 90 g }',
        '  - { formula: brisket-rub, amount: 20 g }',
        '',
      ].join('\n'),
    );
  });

  it('should read as an assembly whose parts all exist and fit in the demo library', () => {
    assert.deepEqual(starterProblems(demoLibrary()), []);
  });

  it('should size a cure for its hold when the library has only cures', () => {
    const parts = starterParts([
      { id: 'quillmoor-belly', kind: 'cure', valid: true },
      { id: 'broken-mix', kind: 'mix', valid: false },
    ]);
    assert.equal(
      parts,
      '  - { formula: quillmoor-belly, amount: 50 g, thickness: 4 cm, largest_piece: 2 kg }\n',
    );
    assert.deepEqual(starterProblems([{ id: 'quillmoor-belly', kind: 'cure', valid: true }]), []);
  });

  it('should name a demo formula, said to be replaced, when the library has nothing usable', () => {
    assert.match(starterParts([]), /Replace chuck-grind with a formula of your library/);
  });
});
