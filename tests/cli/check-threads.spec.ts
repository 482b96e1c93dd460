import assert from 'node:assert/strict';
import { readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import {
  REPO_ROOT,
  assertCleanFailure,
  assertExit,
  escapeRegExp,
  runLarder,
  stdoutJson,
  type CheckReport,
  type JsonFailure,
} from '../helpers/run-larder.ts';
import { DRY_BACON, dryBaconWith, makeTempDir, writeText } from '../helpers/temp-files.ts';
import { isFormulaFileName } from '../../shared/index.ts';

const DEMO_FOLDER = path.join(REPO_ROOT, 'formulas');
// The formulas only: the copies are checked without the catalogue of materials.
const demoNames = readdirSync(DEMO_FOLDER).filter(isFormulaFileName);
const demoText = (name: string): string => readFileSync(path.join(DEMO_FOLDER, name), 'utf8');

/** Copies of the demo formulas with ids of their own: 320 files, seven batches of 50 or fewer. */
const COPIES = 320;

/** What one bad file must be reported with. */
interface Expected {
  readonly line: number;
  readonly column: number;
  readonly message: RegExp;
}

/**
 * Bad files among the copies, spread over the batches so that different threads read them, with
 * the one problem each must get. Line and column: own examples, derived from the text written.
 */
const BAD: Readonly<Record<string, { text: string; problem: Expected }>> = {
  // A quote never closed on line 3, which opens at column 8 (`title: "`).
  'f00003.yaml': {
    text: dryBaconWith('title: Test bacon', 'title: "Test bacon').replace('test-bacon', 'bad-a'),
    problem: { line: 3, column: 8, message: /^YAML: something is missing here/ },
  },
  // The sugar's pct (line 10, column 26) is a word: a schema error.
  'f00077.yaml': {
    text: dryBaconWith('pct: 1.2', 'pct: lots').replace('test-bacon', 'bad-b'),
    problem: { line: 10, column: 26, message: /^"pct" should be a number/ },
  },
  // 0.4 % curing salt × 6.25 % nitrite × 1 000 000 = 250 ppm ingoing, over 200 ppm for dry-cured
  // bacon; reported at `ingredients:`, line 7.
  // source: 9 CFR 424.22(b); formula of USDA FSIS Directive 7620.3, ch. 3
  'f00151.yaml': {
    text: dryBaconWith('pct: 0.25', 'pct: 0.4').replace('test-bacon', 'bad-c'),
    problem: { line: 7, column: 1, message: /250\.0 ppm is over 200 ppm for dry-cured bacon/ },
  },
  // An assembly whose second component (line 11, under its comment; its `formula:` key at column
  // 7) names no formula of the folder: found by the library check, after the readings are gathered.
  'f00301.yaml': {
    text: demoText('corned-beef-sandwich.yaml')
      .replace('id: corned-beef-sandwich', 'id: bad-sandwich')
      .replace('formula: brisket-rub', 'formula: no-such-rub'),
    problem: { line: 11, column: 7, message: /^no formula "no-such-rub" among the formulas/ },
  },
};

/** Two files with one id: the second is reported, naming the first. */
const TWIN_FIRST = 'f00205.yaml';
const TWIN_SECOND = 'f00288.yaml';

/**
 * A folder of the demo formulas as they are (so that their assemblies find their parts), copies
 * of the others with ids of their own, the bad files and the twins; returns the folder.
 */
function writeFolder(dir: string): string {
  for (const name of demoNames) writeText(dir, name, demoText(name));
  const parts = demoNames.map(demoText).filter((text) => !/^kind: assembly$/m.test(text));
  for (let i = 0; i < COPIES; i++) {
    const name = `f${String(i).padStart(5, '0')}.yaml`;
    const text =
      BAD[name]?.text ??
      ([TWIN_FIRST, TWIN_SECOND].includes(name)
        ? DRY_BACON.replace('test-bacon', 'twin-bacon')
        : parts[i % parts.length].replace(/^id: (.+)$/m, `id: $1-${i}`));
    writeText(dir, name, text);
  }
  return dir;
}

describe('larder check on worker threads', () => {
  it('reports a folder of 331 files the same on one thread and on three, each problem at its file and line', async (t) => {
    const dir = writeFolder(makeTempDir(t));
    const runs = await Promise.all(
      ['1', '3'].flatMap((threads) =>
        [
          ['check', dir, '--json'],
          ['check', dir],
        ].map((args) => runLarder(args, { env: { LARDER_CHECK_THREADS: threads } })),
      ),
    );
    const [jsonOne, textOne, jsonThree, textThree] = runs;
    for (const run of runs) {
      assertExit(run, 3);
      // A worker that failed would say so here.
      assert.equal(run.stderr, '', run.stderr);
    }
    assert.equal(jsonThree.stdout, jsonOne.stdout, 'the --json report is the same');
    assert.equal(textThree.stdout, textOne.stdout, 'the text report is the same');

    const report = stdoutJson<CheckReport>(jsonThree);
    const names = readdirSync(dir).sort((a, b) => a.localeCompare(b));
    assert.equal(names.length, demoNames.length + COPIES);
    assert.deepEqual(
      report.files.map((entry) => path.basename(entry.file)),
      names,
      'one entry per file, in the order of the folder',
    );
    const failing = [...Object.keys(BAD), TWIN_SECOND];
    assert.deepEqual(report.summary, {
      files: names.length,
      ok: names.length - failing.length,
      failed: failing.length,
      warnings: 0,
    });
    for (const entry of report.files) {
      const name = path.basename(entry.file);
      assert.equal(entry.file, path.join(dir, name));
      if (failing.includes(name)) continue;
      assert.deepEqual([entry.ok, entry.problems], [true, []], name);
    }
    for (const [name, { problem }] of Object.entries(BAD)) {
      const entry = report.files.find((f) => f.file === path.join(dir, name));
      assert.ok(entry, name);
      assert.equal(entry.ok, false, name);
      assert.equal(entry.problems.length, 1, `${name}: ${JSON.stringify(entry.problems)}`);
      const [found] = entry.problems;
      assert.deepEqual(
        [found.file, found.line, found.column, found.severity],
        [entry.file, problem.line, problem.column, 'error'],
        name,
      );
      assert.match(found.message, problem.message, name);
      assert.ok(
        textThree.stdout.includes(`${entry.file}:${problem.line}:${problem.column}: error: `),
        `${name} in the text report`,
      );
    }
    const twin = report.files.find((f) => f.file === path.join(dir, TWIN_SECOND));
    assert.deepEqual(
      twin?.problems.map((p) => [p.line, p.message]),
      [
        [
          0,
          `the id "twin-bacon" is already used by ${path.join(dir, TWIN_FIRST)}; every formula needs its own id`,
        ],
      ],
    );
  });

  for (const value of ['0', 'two', '-1', '1.5', '3 threads']) {
    it(`refuses LARDER_CHECK_THREADS=${value} with exit 2`, async () => {
      const run = await runLarder(['check', 'formulas/quillmoor-belly.yaml'], {
        env: { LARDER_CHECK_THREADS: value },
      });
      assertCleanFailure(
        run,
        2,
        new RegExp(
          `^larder: LARDER_CHECK_THREADS takes a whole number of threads, 1 or more .*, not "${escapeRegExp(value)}"$`,
          'm',
        ),
        { oneLine: true },
      );
    });
  }

  it('says why LARDER_CHECK_THREADS is refused in the JSON of --json', async () => {
    const run = await runLarder(['check', 'formulas', '--json'], {
      env: { LARDER_CHECK_THREADS: 'many' },
    });
    assertExit(run, 2);
    const { error } = stdoutJson<JsonFailure>(run);
    assert.equal(error.exitCode, 2);
    assert.match(error.message, /^LARDER_CHECK_THREADS takes a whole number of threads/);
  });
});
