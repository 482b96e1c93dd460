import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import {
  assertCleanFailure,
  assertExit,
  assertNoStackTrace,
  runLarder,
  type LarderRun,
} from '../helpers/run-larder.ts';
import {
  DRY_BACON,
  dryBaconWith,
  git,
  isolatedGitEnv,
  makeGitRepo,
  makeTempDir,
  writeText,
  type AfterHook,
} from '../helpers/temp-files.ts';

/**
 * DRY_BACON with 0.4 % curing salt: 0.4 % × 6.25 % × 1 000 000 = 250 ppm, over the 200 ppm limit
 * for dry-cured bacon. source: 9 CFR 424.22(b); formula of USDA FSIS Directive 7620.3, ch. 3
 */
const OVER_LIMIT = dryBaconWith('pct: 0.25', 'pct: 0.4');

function checkStaged(dir: string): Promise<LarderRun> {
  return runLarder(['check', '--staged'], { cwd: dir, env: isolatedGitEnv(dir) });
}

/** A repository with the good bacon formula staged as bacon.yaml. */
function repoWithGoodFormula(t: AfterHook): string {
  const dir = makeGitRepo(t);
  writeText(dir, 'bacon.yaml', DRY_BACON);
  git(dir, 'add', 'bacon.yaml');
  return dir;
}

describe('larder check --staged', () => {
  it('passes a good staged formula', async (t) => {
    const dir = repoWithGoodFormula(t);
    const run = await checkStaged(dir);
    assertExit(run, 0);
    assert.match(
      run.stdout,
      /^Checked 1 formula file\(s\): 1 ok, 0 with errors, 0 warning\(s\)\.$/m,
    );
  });

  it('fails with exit 3 once a bad formula is staged, and names it', async (t) => {
    const dir = repoWithGoodFormula(t);
    writeText(dir, 'over.yaml', OVER_LIMIT);
    git(dir, 'add', 'over.yaml');
    const run = await checkStaged(dir);
    assertExit(run, 3);
    assertNoStackTrace(run);
    // The problem points at the ingredients, line 7. own example, derived
    assert.match(run.stdout, /^over\.yaml:7:1: error: critical limit exceeded/m);
    assert.match(
      run.stdout,
      /^Checked 2 formula file\(s\): 1 ok, 1 with errors, 0 warning\(s\)\.$/m,
    );
  });

  it('checks what is staged, not a bad edit made after staging', async (t) => {
    const dir = repoWithGoodFormula(t);
    writeText(dir, 'bacon.yaml', OVER_LIMIT);
    const run = await checkStaged(dir);
    assertExit(run, 0);
  });

  it('checks what is staged, not a fix made after staging', async (t) => {
    const dir = makeGitRepo(t);
    writeText(dir, 'bacon.yaml', OVER_LIMIT);
    git(dir, 'add', 'bacon.yaml');
    writeText(dir, 'bacon.yaml', DRY_BACON);
    const run = await checkStaged(dir);
    assertExit(run, 3);
    assert.match(run.stdout, /^bacon\.yaml:7:1: error: critical limit exceeded/m);
  });

  it('ignores staged files that are not formulas', async (t) => {
    const dir = repoWithGoodFormula(t);
    writeText(dir, 'notes.txt', 'id: [not yaml at all\n');
    git(dir, 'add', 'notes.txt');
    const run = await checkStaged(dir);
    assertExit(run, 0);
    assert.match(run.stdout, /^Checked 1 formula file\(s\)/m);
  });

  it('exits 2 outside a git repository', async (t) => {
    const dir = makeTempDir(t);
    const run = await checkStaged(dir);
    assertCleanFailure(run, 2, /^larder: --staged needs a git repository/);
  });

  it('outside a git repository the message is short', async (t) => {
    const dir = makeTempDir(t);
    const run = await checkStaged(dir);
    assertExit(run, 2);
    assert.ok(run.stderr.trimEnd().split('\n').length <= 3, run.stderr);
  });
});
