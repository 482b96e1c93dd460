import assert from 'node:assert/strict';
import { existsSync, mkdirSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import type { PresentedResult } from '../../shared/index.ts';
import {
  assertCleanFailure,
  assertExit,
  assertNoStackTrace,
  runLarder,
  stdoutJson,
  type CheckReport,
} from '../helpers/run-larder.ts';
import { makeTempDir, writeText } from '../helpers/temp-files.ts';

describe('larder new', () => {
  it('writes a cure that check accepts and calc can use', async (t) => {
    const out = path.join(makeTempDir(t), 'smoked-jowl.yaml');
    const run = await runLarder(['new', 'cure', '--id', 'smoked-jowl', '--out', out]);
    assertExit(run, 0);
    assert.equal(run.stdout, `Wrote ${out} (cure). Edit it, then run: larder check ${out}\n`);
    assert.match(readFileSync(out, 'utf8'), /^id: smoked-jowl$/m);

    const check = await runLarder(['check', out, '--json']);
    assertExit(check, 0);
    const report = stdoutJson<CheckReport>(check);
    assert.deepEqual(report.summary, { files: 1, ok: 1, failed: 0, warnings: 0 });
    assert.equal(report.files[0].id, 'smoked-jowl');
    assert.equal(report.files[0].kind, 'cure');

    const calc = await runLarder(['calc', out, '--meat', '2kg', '--thickness', '3cm', '--json']);
    assertExit(calc, 0);
    const result = stdoutJson<PresentedResult>(calc);
    // The dry starter has 0.25 % curing salt at 6.25 % nitrite on bacon: 156.25 ppm ≤ 200 ppm.
    // source: shared/formula/starters/cure-starters.ts; limit 9 CFR 424.22(b); formula FSIS Directive 7620.3, ch. 3
    assert.equal(result.checks.find((c) => c.id === 'nitrite-max')?.exact, '156.25');
    assert.equal(result.critical, false);
  });

  it('refuses to overwrite a file without --force, and overwrites it with --force', async (t) => {
    const out = writeText(makeTempDir(t), 'smoked-jowl.yaml', '# the kitchen’s own edits\n');
    const refused = await runLarder(['new', 'cure', '--id', 'smoked-jowl', '--out', out]);
    assertCleanFailure(refused, 2, /already exists; choose another --out or add --force/, {
      oneLine: true,
    });
    assert.equal(readFileSync(out, 'utf8'), '# the kitchen’s own edits\n', 'the file is untouched');

    const forced = await runLarder(['new', 'cure', '--id', 'smoked-jowl', '--out', out, '--force']);
    assertExit(forced, 0);
    assert.match(readFileSync(out, 'utf8'), /^id: smoked-jowl$/m);
    assert.deepEqual(
      readdirSync(path.dirname(out)),
      ['smoked-jowl.yaml'],
      'no temporary file is left behind',
    );
  });

  it('prints the starter to stdout with --out - and writes no file', async (t) => {
    const dir = makeTempDir(t);
    const run = await runLarder(['new', 'dough', '--out', '-'], { cwd: dir });
    assertExit(run, 0);
    assert.equal(run.stderr, '');
    assert.match(run.stdout, /^# yaml-language-server: \$schema=/);
    assert.match(run.stdout, /^kind: dough$/m);
    assert.match(run.stdout, /^id: new-dough$/m);
    assert.deepEqual(readdirSync(dir), [], 'nothing written');

    // What was printed is itself a valid formula.
    const saved = writeText(dir, 'from-stdout.yaml', run.stdout);
    assertExit(await runLarder(['check', saved]), 0);
  });

  it('writes ID.yaml in the current folder by default', async (t) => {
    const dir = makeTempDir(t);
    const run = await runLarder(['new', 'mix', '--json'], { cwd: dir });
    assertExit(run, 0);
    assert.deepEqual(stdoutJson<{ file: string; id: string; kind: string }>(run), {
      file: 'new-mix.yaml',
      id: 'new-mix',
      kind: 'mix',
    });
    assert.ok(existsSync(path.join(dir, 'new-mix.yaml')));
  });

  it('refuses an id that is not lower-case letters, digits and dashes', async (t) => {
    const dir = makeTempDir(t);
    const run = await runLarder([
      'new',
      'cure',
      '--id',
      'Smoked_Jowl',
      '--out',
      path.join(dir, 'x.yaml'),
    ]);
    assertCleanFailure(
      run,
      2,
      /--id "Smoked_Jowl" may hold only lower-case letters, digits and dashes/,
    );
    assert.deepEqual(readdirSync(dir), [], 'nothing written');
  });

  it('refuses --method on anything but a cure', async () => {
    const run = await runLarder(['new', 'dough', '--method', 'pump', '--out', '-']);
    assertCleanFailure(run, 2, /--method applies only to cure formulas/);
  });

  it('refuses a kind it does not know', async () => {
    const run = await runLarder(['new', 'pie']);
    assertCleanFailure(run, 2, /'pie' is invalid .*Allowed choices are cure, dough, blend, mix/);
  });

  it('writing into a folder that does not exist is a clear error, not a crash', async (t) => {
    const out = path.join(makeTempDir(t), 'no-such-folder', 'smoked-jowl.yaml');
    const run = await runLarder(['new', 'cure', '--id', 'smoked-jowl', '--out', out]);
    assertNoStackTrace(run);
    assert.ok(run.code === 2 || run.code === 3, `exit ${run.code}`);
  });

  it('--force onto a folder is a clear error and leaves no temporary file', async (t) => {
    const dir = makeTempDir(t);
    const folder = path.join(dir, 'formulas');
    mkdirSync(folder);
    writeFileSync(path.join(folder, 'keep.yaml'), '');
    const run = await runLarder(['new', 'cure', '--id', 'smoked-jowl', '--out', folder, '--force']);
    assertNoStackTrace(run);
    assert.equal(run.code, 2);
    assert.deepEqual(readdirSync(dir), ['formulas']);
  });
});
