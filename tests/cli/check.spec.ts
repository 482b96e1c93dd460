import assert from 'node:assert/strict';
import { readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import {
  REPO_ROOT,
  assertCleanFailure,
  assertExit,
  assertNoStackTrace,
  escapeRegExp,
  runLarder,
  stdoutJson,
  type CheckReport,
} from '../helpers/run-larder.ts';
import {
  DRY_BACON,
  dryBaconWith,
  makeTempDir,
  writeMix,
  writeText,
} from '../helpers/temp-files.ts';
import { isFormulaFileName } from '../../shared/index.ts';

const demoFiles = readdirSync(path.join(REPO_ROOT, 'formulas')).filter(isFormulaFileName);

/**
 * DRY_BACON with 0.4 % curing salt: 0.4 % × 6.25 % × 1 000 000 = 250 ppm ingoing nitrite, over the
 * 200 ppm limit for dry-cured bacon. source: 9 CFR 424.22(b); formula of USDA FSIS Directive 7620.3, ch. 3
 */
const OVER_LIMIT = dryBaconWith('pct: 0.25', 'pct: 0.4');

describe('larder check on the demo formulas', () => {
  it('passes ./formulas by default and prints a summary', async () => {
    const run = await runLarder(['check']);
    assertExit(run, 0);
    assert.equal(
      run.stdout,
      // The formulas and the catalogue of materials beside them.
      `Checked ${demoFiles.length} formula file(s) and the catalogue: ${demoFiles.length + 1} ok, 0 with errors, 0 warning(s).\n`,
    );
    assert.equal(run.stderr, '');
  });

  it('gives summary counts and one entry per file with --json', async () => {
    const run = await runLarder(['check', 'formulas', '--json']);
    assertExit(run, 0);
    const report = stdoutJson<CheckReport>(run);
    assert.deepEqual(report.summary, {
      files: demoFiles.length + 1,
      ok: demoFiles.length + 1,
      failed: 0,
      warnings: 0,
    });
    const [catalogue, ...formulas] = report.files;
    assert.deepEqual(
      { ...catalogue, file: path.basename(catalogue.file) },
      { file: 'catalogue.yaml', kind: 'catalogue', ok: true, problems: [] },
    );
    assert.deepEqual(formulas.map((f) => path.basename(f.file)).sort(), [...demoFiles].sort());
    for (const file of formulas) {
      assert.equal(file.ok, true, file.file);
      assert.deepEqual(file.problems, [], file.file);
      assert.equal(
        `${file.id}.yaml`,
        path.basename(file.file),
        'each demo file is named for its id',
      );
      assert.ok(['cure', 'dough', 'blend', 'mix', 'assembly'].includes(file.kind ?? ''), file.file);
    }
  });
});

describe('larder check on files with problems', () => {
  it('fails a formula over its critical limit with exit 3', async (t) => {
    const file = writeText(makeTempDir(t), 'over.yaml', OVER_LIMIT);
    const run = await runLarder(['check', file]);
    assertExit(run, 3);
    assertNoStackTrace(run);
    assert.match(run.stdout, /critical limit exceeded/);
    // source: 9 CFR 424.22(b) (200 ppm, dry-cured bacon); 250 ppm derived above
    assert.match(run.stdout, /250\.0 ppm is over 200 ppm for dry-cured bacon/);
    // The problem points at the ingredients, line 7 of the file. own example, derived
    assert.match(run.stdout, new RegExp(`^${escapeRegExp(file)}:7:1: error: `, 'm'));
    assert.match(
      run.stdout,
      /^Checked 1 formula file\(s\): 0 ok, 1 with errors, 0 warning\(s\)\.$/m,
    );
  });

  it('fails pumped bacon without its required erythorbate with exit 3, as an error', async (t) => {
    const maple = readFileSync(path.join(REPO_ROOT, 'formulas', 'maple-pump-belly.yaml'), 'utf8');
    const without = maple.replace(/^ {2}- \{ name: sodium erythorbate.*\n/m, '');
    assert.notEqual(without, maple);
    const file = writeText(makeTempDir(t), 'maple.yaml', without);
    const run = await runLarder(['check', file]);
    assertExit(run, 3);
    // source: 9 CFR 424.22(b), 550 ppm ascorbate or erythorbate required in pumped bacon
    assert.match(
      run.stdout,
      /error: critical limit not met: sodium ascorbate or erythorbate 0\.0 ppm is under the 550 ppm required for pumped bacon/,
    );
    assert.match(
      run.stdout,
      /^Checked 1 formula file\(s\): 0 ok, 1 with errors, 0 warning\(s\)\.$/m,
    );
  });

  it('names the bad file with line and column in a folder with one good and one bad file', async (t) => {
    const dir = makeTempDir(t);
    const good = writeText(dir, 'a-good.yaml', DRY_BACON);
    const bad = writeText(
      dir,
      'b-bad.yaml',
      dryBaconWith('id: test-bacon', 'id: other-bacon').replace('pct: 1.2', 'pct: lots'),
    );
    const run = await runLarder(['check', dir]);
    assertExit(run, 3);
    // source: own example, derived (the value of pct is at line 10, column 26)
    assert.match(
      run.stdout,
      new RegExp(`^${escapeRegExp(bad)}:10:26: error: "pct" should be a number`, 'm'),
    );
    assert.ok(!run.stdout.includes(good), 'the good file is not named');
    assert.match(
      run.stdout,
      /^Checked 2 formula file\(s\): 1 ok, 1 with errors, 0 warning\(s\)\.$/m,
    );
  });

  it('refuses fish declared without its species, at its line, saying how to name it', async (t) => {
    const file = writeMix(t, 'sauce', [
      '  - { name: mayonnaise, pct: 100, base: true, allergens: [egg] }',
      '  - { name: Worcestershire sauce, pct: 3, allergens: [fish] }',
    ]);
    const run = await runLarder(['check', file]);
    assertExit(run, 3);
    assertNoStackTrace(run);
    // source: 21 U.S.C. 343(w)(2) (the label names the species of fish). The word fish is on
    // line 7, column 55 of the file. own example, derived
    assert.match(
      run.stdout,
      new RegExp(`^${escapeRegExp(file)}:7:55: error: name the fish.*fish \\(anchovy\\)`, 'm'),
    );
  });

  it('counts the good and the bad file in --json', async (t) => {
    const dir = makeTempDir(t);
    writeText(dir, 'a-good.yaml', DRY_BACON);
    const bad = writeText(
      dir,
      'b-bad.yaml',
      'formula: 1\nid: broken\ntitle: Broken\nkind: cure\nmethod: dry\nproduct: bacon\ningredients: [\n',
    );
    const run = await runLarder(['check', dir, '--json']);
    assertExit(run, 3);
    const report = stdoutJson<CheckReport>(run);
    assert.deepEqual(report.summary, { files: 2, ok: 1, failed: 1, warnings: 0 });
    const entry = report.files.find((f) => f.file === bad);
    assert.ok(entry);
    assert.equal(entry.ok, false);
    assert.ok(entry.problems.length > 0);
    assert.ok(
      entry.problems.every((p) => p.line > 0 && p.column > 0 && p.severity === 'error'),
      JSON.stringify(entry.problems),
    );
  });

  it('never checks a save’s left-over temporary file in a folder, nor a file of the same id in it', async (t) => {
    const dir = makeTempDir(t);
    writeText(dir, 'a-good.yaml', DRY_BACON);
    // What a save killed mid-way leaves: ".NAME.yaml.<hex>.tmp", half written.
    writeText(dir, '.a-good.yaml.123.tmp', DRY_BACON.slice(0, 40));
    writeText(dir, '.x.yaml.0a1b2c3d4e5f.tmp', DRY_BACON);
    const run = await runLarder(['check', dir, '--json']);
    assertExit(run, 0);
    const report = stdoutJson<CheckReport>(run);
    assert.deepEqual(report.summary, { files: 1, ok: 1, failed: 0, warnings: 0 });
    assert.deepEqual(
      report.files.map((f) => path.basename(f.file)),
      ['a-good.yaml'],
    );
  });

  it('refuses two files with the same id', async (t) => {
    const dir = makeTempDir(t);
    const first = writeText(dir, 'a.yaml', DRY_BACON);
    const second = writeText(
      dir,
      'b.yaml',
      DRY_BACON.replace('title: Test bacon', 'title: Test bacon, again'),
    );
    const run = await runLarder(['check', dir]);
    assertExit(run, 3);
    assert.match(
      run.stdout,
      new RegExp(
        `^${escapeRegExp(second)}: error: the id "test-bacon" is already used by ${escapeRegExp(first)}`,
        'm',
      ),
    );
    assert.match(run.stdout, /1 ok, 1 with errors/);
  });

  it('the same file named twice is not a duplicate id', async () => {
    const run = await runLarder(['check', 'formulas/quillmoor-belly.yaml', 'formulas']);
    assertExit(run, 0);
  });

  it('exits 3 for a path that does not exist', async () => {
    const run = await runLarder(['check', 'no-such-folder']);
    assertCleanFailure(run, 3, /^larder: no-such-folder: no such file or folder$/m, {
      oneLine: true,
    });
  });

  it('exits 3 where there is no formulas folder and no path is given', async (t) => {
    const run = await runLarder(['check'], { cwd: makeTempDir(t) });
    assertCleanFailure(run, 3, /^larder: formulas: no such file or folder$/m, { oneLine: true });
  });

  it('exits 3 for a folder with no formula files, so a mistyped CI path cannot pass', async (t) => {
    const dir = makeTempDir(t);
    const run = await runLarder(['check', dir]);
    assertCleanFailure(run, 3, /no formula files \(\*\.yaml, \*\.yml\) in /, { oneLine: true });
  });
});
