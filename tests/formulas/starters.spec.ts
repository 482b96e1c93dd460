import assert from 'node:assert/strict';
import { readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { starterParts, type LibraryEntry } from '../../shared/formula/starters/assembly-starter.ts';
import {
  calculate,
  checkLibrary,
  failsCriticalLimit,
  formatProblem,
  formulaLibrary,
  isFormulaFileName,
  LIBRARY_SCHEMA_PATH,
  parseBatchOptions,
  planAssembly,
  readFormula,
  starterFormula,
  type BatchKind,
  type CureMethod,
  type RawBatchOptions,
} from '../../shared/index.ts';
import {
  assertExit,
  REPO_ROOT,
  runLarder,
  stdoutJson,
  type CheckReport,
} from '../helpers/run-larder.ts';
import { makeTempDir } from '../helpers/temp-files.ts';

/** Every starter `larder new` and the console's new-formula dialog offer, but the assembly. */
const CHOICES: readonly { id: string; kind: BatchKind; method?: CureMethod }[] = [
  { id: 'cure-dry', kind: 'cure', method: 'dry' },
  { id: 'cure-brine', kind: 'cure', method: 'brine' },
  { id: 'cure-pump', kind: 'cure', method: 'pump' },
  { id: 'a-dough', kind: 'dough' },
  { id: 'a-blend', kind: 'blend' },
  { id: 'a-mix', kind: 'mix' },
];
// A colon and a hash: the title must stay one YAML string on both sides.
const TITLE = 'Starter: #1';

/** A small batch of each kind, so every starter is also calculated. */
const SAMPLE: Record<BatchKind, RawBatchOptions> = {
  cure: { meat: '2 kg', thickness: '3 cm', largestPiece: '1 kg', start: '2026-12-02' },
  dough: { pieces: '24', room: '20 C', flourTemp: '19 C', tap: '12 C' },
  blend: { total: '5 kg' },
  mix: { total: '1 kg' },
};

const SCHEMA = path.join(REPO_ROOT, 'shared', 'schema', 'formula.schema.json');
const FOLDER = path.join(REPO_ROOT, 'formulas');
const DEMO = readdirSync(FOLDER)
  .filter(isFormulaFileName)
  .map((name) => ({ file: name, text: readFileSync(path.join(FOLDER, name), 'utf8') }));

/** The demo formulas as the list of formulas gives them. */
function demoLibrary(): LibraryEntry[] {
  return DEMO.map(({ file, text }) => {
    const formula = readFormula(text, file).formula;
    return { id: formula?.id ?? null, kind: formula?.kind ?? null, valid: !!formula };
  });
}

/** A starter assembly made from `library`, as the console writes it. */
function starterAssembly(library: readonly LibraryEntry[]): string {
  return starterFormula('assembly', {
    id: 'staff-lunch',
    title: 'Staff lunch: a plate',
    schemaPath: LIBRARY_SCHEMA_PATH,
    library,
  });
}

/** The problems of a starter assembly made from `library`, checked against the demo formulas. */
function starterProblems(library: readonly LibraryEntry[]): unknown[] {
  const text = starterAssembly(library);
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

describe('the formula starters', () => {
  for (const { id, kind, method } of CHOICES) {
    describe(id, () => {
      const text = starterFormula(kind, {
        id,
        title: TITLE,
        method,
        schemaPath: LIBRARY_SCHEMA_PATH,
      });
      const reading = readFormula(text, `${id}.yaml`);

      it('should pass every check without errors or warnings', () => {
        assert.deepEqual(reading.problems.map(formatProblem), []);
        assert.equal(reading.formula?.id, id);
        assert.equal(reading.formula?.title, TITLE);
        assert.equal(reading.formula?.kind, kind);
        if (reading.formula?.kind === 'cure') assert.equal(reading.formula.method, method);
      });

      it('should calculate a sample batch inside every critical limit', () => {
        const formula = reading.formula;
        assert.ok(formula);
        const result = calculate(
          formula,
          parseBatchOptions(SAMPLE[kind], formula, { today: '2026-12-02' }),
        );
        assert.equal(failsCriticalLimit(result), false);
        assert.ok(result.groups.length > 0);
      });
    });
  }

  it('should give the console, writing into the library folder, what larder new writes there', () => {
    // The console cannot ask where the schema is; it writes the path larder new would write for
    // a file in formulas/, the folder the server keeps the library in.
    assert.equal(path.relative(FOLDER, SCHEMA), LIBRARY_SCHEMA_PATH);
  });

  it('should be what larder new writes for the same choice, which check accepts', async (t) => {
    const dir = makeTempDir(t);
    for (const { id, kind, method } of CHOICES) {
      const out = path.join(dir, `${id}.yaml`);
      const run = await runLarder([
        'new',
        kind,
        ...(method ? ['--method', method] : []),
        '--id',
        id,
        '--title',
        TITLE,
        '--out',
        out,
      ]);
      assertExit(run, 0);
      assert.equal(
        readFileSync(out, 'utf8'),
        starterFormula(kind, { id, title: TITLE, method, schemaPath: path.relative(dir, SCHEMA) }),
        id,
      );
    }
    const check = await runLarder(['check', dir, '--json']);
    assertExit(check, 0);
    const report = stdoutJson<CheckReport>(check);
    assert.deepEqual(report.summary, { files: 6, ok: 6, failed: 0, warnings: 0 });
    assert.deepEqual(report.files.map((f) => [f.id, f.kind]).sort(), [
      ['a-blend', 'blend'],
      ['a-dough', 'dough'],
      ['a-mix', 'mix'],
      ['cure-brine', 'cure'],
      ['cure-dry', 'cure'],
      ['cure-pump', 'cure'],
    ]);
  });

  it('should be a dry cure when no method is given, as larder new writes it', () => {
    const options = { id: 'new-cure', title: 'New cure formula', schemaPath: LIBRARY_SCHEMA_PATH };
    assert.equal(
      starterFormula('cure', options),
      starterFormula('cure', { ...options, method: 'dry' }),
    );
  });
});

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

  it('should plan 10 units from the demo library inside every critical limit', () => {
    const reading = readFormula(starterAssembly(demoLibrary()), 'staff-lunch.yaml');
    assert.deepEqual(reading.problems.map(formatProblem), []);
    assert.equal(reading.formula?.kind, 'assembly');
    const library = formulaLibrary(
      DEMO.map(({ file, text }) => ({ file, reading: readFormula(text, file) })),
    );
    const plan = planAssembly(reading.formula, library, {
      count: 10,
      serviceDate: '2026-12-20',
      today: '2026-12-01',
    });
    assert.equal(plan.batches.length, 3);
    for (const batch of plan.batches) assert.equal(failsCriticalLimit(batch.result), false);
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
