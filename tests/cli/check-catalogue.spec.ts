import assert from 'node:assert/strict';
import path from 'node:path';
import { describe, it } from 'node:test';
import {
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
  git,
  isolatedGitEnv,
  makeGitRepo,
  makeTempDir,
  writeText,
  type AfterHook,
} from '../helpers/temp-files.ts';

/**
 * The items of DRY_BACON, but for its brown sugar. Line 9 is "    nitrite: 6.25". own example
 */
const CATALOGUE = `catalogue: 1
items:
  - { key: sea-salt, name: sea salt, formula_names: [fine sea salt], kind: salt, unit: kg }
  - key: cure-1
    name: curing salt
    formula_names: [curing salt no. 1]
    kind: curing-salt
    unit: kg
    nitrite: 6.25
`;

/** A folder with DRY_BACON (as bacon.yaml, or the text given) and a catalogue. */
function folder(t: AfterHook, catalogue = CATALOGUE, bacon = DRY_BACON): string {
  const dir = makeTempDir(t);
  writeText(dir, 'bacon.yaml', bacon);
  writeText(dir, 'catalogue.yaml', catalogue);
  return dir;
}

describe('larder check with a catalogue of materials', () => {
  it('warns of an ingredient not in the catalogue, at its line, and exits 0', async (t) => {
    const dir = folder(t);
    const run = await runLarder(['check', dir]);
    assertExit(run, 0);
    // "brown sugar" is the third ingredient, line 10, column 5 of DRY_BACON. own example
    assert.equal(
      run.stdout,
      `${path.join(dir, 'bacon.yaml')}:10:5: warning: "brown sugar" is not in the catalogue (${path.join(dir, 'catalogue.yaml')}); add it there, or name its item with item: (at ingredients[3])\n` +
        'Checked 1 formula file(s) and the catalogue: 2 ok, 0 with errors, 1 warning(s).\n',
    );
  });

  it('gives the warning and the catalogue in --json, still exiting 0', async (t) => {
    const dir = folder(t);
    const run = await runLarder(['check', dir, '--json']);
    assertExit(run, 0);
    const report = stdoutJson<CheckReport>(run);
    assert.deepEqual(report.summary, { files: 2, ok: 2, failed: 0, warnings: 1 });
    assert.deepEqual(
      report.files.map((f) => [path.basename(f.file), f.kind, f.ok]),
      [
        ['catalogue.yaml', 'catalogue', true],
        ['bacon.yaml', 'cure', true],
      ],
    );
    const [warning] = report.files[1].problems;
    assert.deepEqual([warning.severity, warning.line, warning.column], ['warning', 10, 5]);
    assert.match(warning.message, /not in the catalogue/);
  });

  it('links a line by its item key', async (t) => {
    const dir = folder(
      t,
      CATALOGUE,
      dryBaconWith('name: brown sugar,', 'name: brown sugar, item: sugar,'),
    );
    writeText(
      dir,
      'catalogue.yaml',
      `${CATALOGUE}  - { key: sugar, name: brown sugar, kind: sugar, unit: kg }\n`,
    );
    const run = await runLarder(['check', dir]);
    assertExit(run, 0);
    assert.equal(
      run.stdout,
      'Checked 1 formula file(s) and the catalogue: 2 ok, 0 with errors, 0 warning(s).\n',
    );
  });

  it('refuses an item key the catalogue does not have (exit 3)', async (t) => {
    const dir = folder(
      t,
      CATALOGUE,
      dryBaconWith('name: brown sugar,', 'name: brown sugar, item: brown-sugar,'),
    );
    const run = await runLarder(['check', dir]);
    assertExit(run, 3);
    assertNoStackTrace(run);
    // "item" is the second key of line 10: column 26. own example
    assert.match(
      run.stdout,
      /bacon\.yaml:10:26: error: there is no item "brown-sugar" in the catalogue \(.*catalogue\.yaml\) \(at ingredients\[3\]\.item\)$/m,
    );
  });

  it('refuses a curing salt stronger in the formula than in the catalogue, naming both places', async (t) => {
    const dir = folder(t, CATALOGUE.replace('nitrite: 6.25', 'nitrite: 6'));
    const run = await runLarder(['check', dir]);
    assertExit(run, 3);
    // The formula's nitrite is line 9, column 43; the catalogue's, line 9, column 5. own example
    assert.match(
      run.stdout,
      new RegExp(
        `bacon\\.yaml:9:43: error: this line says 6\\.25 % sodium nitrite but the catalogue's "cure-1" says 6 % \\(${escapeRegExp(path.join(dir, 'catalogue.yaml'))}:9:5\\)`,
      ),
    );
  });

  it('places an error of the catalogue itself, and checks no links against it', async (t) => {
    const dir = folder(t, CATALOGUE.replace('kind: salt', 'kind: salts'));
    const run = await runLarder(['check', dir]);
    assertExit(run, 3);
    assert.match(
      run.stdout,
      /^.*catalogue\.yaml:3:70: error: "kind" must be one of meat, .*, not "salts"; did you mean "salt"\? \(at items\[1\]\.kind\)$/m,
    );
    assert.doesNotMatch(run.stdout, /not in the catalogue/);
    assert.match(run.stdout, /and the catalogue: 1 ok, 1 with errors, 0 warning\(s\)\.$/m);
  });

  it('places a weight per unit that does not fit its item, as an error of the catalogue', async (t) => {
    // Milk stocked by the litre weighs so much per volume; "244 g" alone says per what? Line 10,
    // column 58 is its "weighs:", the third item. own example
    const milk = `${CATALOGUE}  - { key: milk, name: whole milk, kind: dairy, unit: l, weighs: 244 g }\n`;
    const dir = folder(t, milk);
    const run = await runLarder(['check', path.join(dir, 'catalogue.yaml')]);
    assertExit(run, 3);
    assert.match(
      run.stdout,
      /^.*catalogue\.yaml:10:58: error: expected a weight per volume, such as "244 g per cup", "1\.03 kg per l", but got "244 g": this item is stocked by volume: say per how much, such as "per cup" \(at items\[3\]\.weighs\)$/m,
    );
    const fixed = folder(t, milk.replace('weighs: 244 g', 'weighs: 244 g per cup'));
    assertExit(await runLarder(['check', path.join(fixed, 'catalogue.yaml')]), 0);
  });

  it('checks the catalogue named alone', async (t) => {
    const dir = folder(t, CATALOGUE.replace('kind: salt', 'kind: salts'));
    const run = await runLarder(['check', path.join(dir, 'catalogue.yaml')]);
    assertExit(run, 3);
    assert.match(run.stdout, /catalogue\.yaml:3:70: error: "kind" must be one of/);
    assert.match(run.stdout, /^Checked the catalogue: 0 ok, 1 with errors, 0 warning\(s\)\.$/m);
  });

  it('says nothing of a catalogue a folder does not have', async (t) => {
    const dir = makeTempDir(t);
    writeText(dir, 'bacon.yaml', DRY_BACON);
    const run = await runLarder(['check', dir]);
    assertExit(run, 0);
    assert.equal(run.stdout, 'Checked 1 formula file(s): 1 ok, 0 with errors, 0 warning(s).\n');
  });

  it('checks a formula named alone against the catalogue beside it', async (t) => {
    const dir = folder(t);
    const run = await runLarder(['check', path.join(dir, 'bacon.yaml')]);
    assertExit(run, 0);
    assert.match(run.stdout, /warning: "brown sugar" is not in the catalogue/);
  });

  it('checks a staged catalogue, and staged formulas against it', async (t) => {
    const dir = makeGitRepo(t);
    writeText(dir, 'bacon.yaml', DRY_BACON);
    writeText(dir, 'catalogue.yaml', CATALOGUE.replace('nitrite: 6.25', 'nitrite: 6'));
    git(dir, 'add', 'bacon.yaml', 'catalogue.yaml');
    const run = await runLarder(['check', '--staged'], { cwd: dir, env: isolatedGitEnv(dir) });
    assertExit(run, 3);
    assert.match(run.stdout, /^bacon\.yaml:9:43: error: .*\(catalogue\.yaml:9:5\)/m);
    assert.match(
      run.stdout,
      /^Checked 1 formula file\(s\) and the catalogue: 1 ok, 1 with errors/m,
    );
  });

  it('checks the demo formulas clean against the demo catalogue', async () => {
    const run = await runLarder(['check', 'formulas']);
    assertExit(run, 0);
    assert.match(
      run.stdout,
      /^Checked \d+ formula file\(s\) and the catalogue: \d+ ok, 0 with errors, 0 warning\(s\)\.\n$/,
    );
  });
});
