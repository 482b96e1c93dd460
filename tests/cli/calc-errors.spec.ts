import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import {
  assertCleanFailure,
  assertExit,
  assertNoStackTrace,
  escapeRegExp,
  runLarder,
  showRun,
  stdoutJson,
  type JsonFailure,
} from '../helpers/run-larder.ts';
import { DRY_BACON, dryBaconWith, makeTempDir, writeText } from '../helpers/temp-files.ts';

/** A cure batch on the demo bacon, with one option to get wrong. */
function belly(...options: string[]): string[] {
  return ['calc', 'quillmoor-belly', '--thickness', '4cm', ...options];
}

describe('larder calc with a formula that cannot be used', () => {
  it('exits 3 for a file that does not exist', async () => {
    const run = await runLarder(['calc', 'formulas/no-such-formula.yaml', '--meat', '1kg']);
    assertCleanFailure(run, 3, /^larder: formulas\/no-such-formula\.yaml: no such file$/m, {
      oneLine: true,
    });
  });

  it('exits 3 for an id no formula has, and says where it looked', async () => {
    const run = await runLarder(['calc', 'no-such-formula', '--meat', '1kg']);
    assertCleanFailure(run, 3, /^larder: no formula "no-such-formula" in formulas: /m, {
      oneLine: true,
    });
  });

  it('exits 3 for a tab in the indentation, with the line and column', async (t) => {
    const file = writeText(
      makeTempDir(t),
      'tab.yaml',
      dryBaconWith('  - { name: fine sea salt', '\t- { name: fine sea salt'),
    );
    const run = await runLarder(['calc', file, '--meat', '1kg']);
    assertCleanFailure(run, 3, /the formula has \d+ error\(s\)/);
    // The tab is the first character of line 8 of DRY_BACON. source: own example, derived
    assert.match(
      run.stderr,
      new RegExp(`^${escapeRegExp(file)}:8:1: error: YAML: indent with spaces, not tabs`, 'm'),
    );
  });

  it('exits 3 for a bracket that is never closed, with the line and column', async (t) => {
    const file = writeText(
      makeTempDir(t),
      'bracket.yaml',
      dryBaconWith('  - { name: brown sugar, pct: 1.2 }', '  - [ name: brown sugar, pct: 1.2'),
    );
    const run = await runLarder(['calc', file, '--meat', '1kg']);
    assertCleanFailure(run, 3, /the formula has \d+ error\(s\)/);
    assert.match(
      run.stderr,
      new RegExp(`^${escapeRegExp(file)}:\\d+:\\d+: error: YAML: .*bracket is not closed`, 'm'),
    );
  });

  it('exits 3 for an unknown key, naming the key and where it is', async (t) => {
    const file = writeText(
      makeTempDir(t),
      'pcts.yaml',
      dryBaconWith('brown sugar, pct:', 'brown sugar, pcts:'),
    );
    const run = await runLarder(['calc', file, '--meat', '1kg']);
    assertCleanFailure(run, 3, /the formula has \d+ error\(s\)/);
    // "pcts" starts at column 26 of line 10. source: own example, derived
    assert.match(
      run.stderr,
      new RegExp(
        `^${escapeRegExp(file)}:10:26: error: unknown key "pcts"; did you mean "pct"\\?`,
        'm',
      ),
    );
  });

  it('exits 3 for a value of the wrong type', async (t) => {
    const file = writeText(makeTempDir(t), 'type.yaml', dryBaconWith('pct: 1.2', 'pct: lots'));
    const run = await runLarder(['calc', file, '--meat', '1kg']);
    assertCleanFailure(run, 3, /the formula has 1 error\(s\)/);
    // source: own example, derived (the value of pct starts at line 10, column 26)
    assert.match(
      run.stderr,
      new RegExp(`^${escapeRegExp(file)}:10:26: error: "pct" should be a number, not "lots"`, 'm'),
    );
  });

  it('exits 3 for a required key that is missing', async (t) => {
    const file = writeText(makeTempDir(t), 'no-method.yaml', dryBaconWith('method: dry\n', ''));
    const run = await runLarder(['calc', file, '--meat', '1kg']);
    assertCleanFailure(run, 3, /the formula has 1 error\(s\)/);
    assert.match(
      run.stderr,
      new RegExp(`^${escapeRegExp(file)}:\\d+:\\d+: error: "method" is missing`, 'm'),
    );
  });

  it('exits 4, refused, for a formula over its own critical limit, before any batch is worked out', async (t) => {
    const file = writeText(makeTempDir(t), 'over.yaml', dryBaconWith('pct: 0.25', 'pct: 0.4'));
    const run = await runLarder(['calc', file, '--meat', '1kg', '--thickness', '2cm']);
    // 0.4 % × 6.25 % = 250 ppm, over the 200 ppm of dry-cured bacon. source: 9 CFR 424.22(b)
    assertCleanFailure(run, 4, /critical limit exceeded/);
    assert.match(run.stderr, /REFUSED/);
  });

  it('prints a formula file error as JSON with --json, details included', async (t) => {
    const file = writeText(
      makeTempDir(t),
      'pcts.yaml',
      dryBaconWith('brown sugar, pct:', 'brown sugar, pcts:'),
    );
    const run = await runLarder(['calc', file, '--meat', '1kg', '--json']);
    assertExit(run, 3);
    assert.equal(run.stderr, '');
    const { error } = stdoutJson<JsonFailure>(run);
    assert.equal(error.exitCode, 3);
    assert.match(error.message, /the formula has \d+ error\(s\)/);
    assert.ok(
      error.details.some((line) => line.startsWith(`${file}:10:26: error: unknown key "pcts"`)),
      error.details.join('\n'),
    );
  });

  it('accepts the same formula once it is fixed', async (t) => {
    const file = writeText(makeTempDir(t), 'ok.yaml', DRY_BACON);
    const run = await runLarder(['calc', file, '--meat', '1kg', '--thickness', '2cm']);
    assertExit(run, 0);
  });
});

describe('larder calc with bad batch input', () => {
  const cases: { name: string; args: string[]; message: RegExp }[] = [
    {
      name: 'a unit it does not know (4.26kgs)',
      args: belly('--meat', '4.26kgs'),
      message: /^larder: --meat: expected a mass such as "4\.26 kg".*"kgs" is not a mass unit$/m,
    },
    {
      name: 'a weight without a unit',
      args: belly('--meat', '4.26'),
      message: /^larder: --meat: expected a mass .*a unit is missing/,
    },
    {
      name: 'a zero weight',
      args: belly('--meat', '0kg'),
      message: /^larder: --meat must be more than 0$/m,
    },
    // source: cli (parse-batch-options.ts) caps a meat weight at 1000 kg
    {
      name: 'an absurd weight (5000 kg)',
      args: belly('--meat', '5000kg'),
      message: /^larder: --meat 5000kg is more than 1000 kg; check the unit$/m,
    },
    {
      name: 'a negative weight',
      args: belly('--meat', '-1kg'),
      message: /^larder: --meat: .*a mass cannot be negative$/m,
    },
    {
      name: 'a decimal comma',
      args: belly('--meat', '4,26kg'),
      message: /^larder: --meat: .*write decimals with a point \(4\.26\), not a comma$/m,
    },
    {
      name: 'an option for another kind (--pieces on a cure)',
      args: belly('--meat', '4kg', '--pieces', '4'),
      message: /^larder: --pieces does not apply to a cure formula$/m,
    },
    {
      name: 'an option for another cure method (--pump on a dry cure)',
      args: belly('--meat', '4kg', '--pump', '12'),
      message: /^larder: --pump applies only to pump cures; this one is dry$/m,
    },
    {
      name: 'both --meat and --want',
      args: belly('--meat', '4kg', '--want', '3kg'),
      message: /^larder: give either --meat or --want, not both$/m,
    },
    {
      name: 'no meat weight at all',
      args: ['calc', 'quillmoor-belly'],
      message: /^larder: say how much meat: --meat/,
    },
    {
      name: 'a date that does not exist',
      args: belly('--meat', '4kg', '--start', '2026-02-30'),
      message: /--start takes a date written YYYY-MM-DD, not "2026-02-30"/,
    },
    {
      name: 'a thickness out of range',
      args: ['calc', 'quillmoor-belly', '--meat', '4kg', '--thickness', '0cm'],
      message: /--thickness must be between 1 and 300 mm, not 0cm/,
    },
    {
      name: 'an unknown option',
      args: belly('--meat', '4kg', '--bogus', '1'),
      message: /unknown option '--bogus'/,
    },
    {
      name: 'a unit system it does not know',
      args: belly('--meat', '4kg', '--units', 'imperial'),
      message: /argument 'imperial' is invalid\. Allowed choices are metric, us/,
    },
    { name: 'no formula', args: ['calc'], message: /missing required argument 'formula'/ },
    {
      name: 'a weight under a gram',
      args: belly('--meat', '0.5g'),
      message: /--meat 0\.5g is less than 1 g; check the unit/,
    },
    {
      name: 'an option given twice',
      args: belly('--meat', '4.26kg', '--meat', '5kg'),
      message: /--meat is given twice/,
    },
  ];

  for (const { name, args, message } of cases) {
    it(`exits 2 with one clear message for ${name}`, async () => {
      const run = await runLarder(args);
      assertCleanFailure(run, 2, message);
      // The message itself is one line; commander adds a hint line after its own errors.
      assert.ok(run.stderr.trimEnd().split('\n').length <= 2, showRun(run));
    });
  }

  it('prints a batch-input error as a JSON error object with --json', async () => {
    const run = await runLarder(belly('--meat', '4.26kgs', '--json'));
    assertExit(run, 2);
    assertNoStackTrace(run);
    assert.equal(run.stderr, '');
    const { error } = stdoutJson<JsonFailure>(run);
    assert.equal(error.exitCode, 2);
    assert.match(error.message, /^--meat: expected a mass such as/);
    assert.deepEqual(error.details, []);
  });

  it('prints a missing formula as a JSON error object with --json', async () => {
    const run = await runLarder(['calc', 'no-such-formula', '--meat', '1kg', '--json']);
    assertExit(run, 3);
    assert.equal(run.stderr, '');
    const { error } = stdoutJson<JsonFailure>(run);
    assert.equal(error.exitCode, 3);
    assert.match(error.message, /no formula "no-such-formula"/);
  });

  it('an unknown option with --json is also a JSON error object', async () => {
    const run = await runLarder(belly('--meat', '4kg', '--bogus', '1', '--json'));
    assertExit(run, 2);
    const { error } = stdoutJson<JsonFailure>(run);
    assert.equal(error.exitCode, 2);
    assert.match(error.message, /--bogus/);
  });
});
