import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import {
  REPO_ROOT,
  assertCleanFailure,
  assertExit,
  runLarder,
  stdoutJson,
  type CheckReport,
} from '../helpers/run-larder.ts';

const packageVersion = (
  JSON.parse(readFileSync(path.join(REPO_ROOT, 'package.json'), 'utf8')) as { version: string }
).version;

/**
 * The exit-code table every --help ends with. source: cli/cli-error.ts, cli/README.md "Exit codes"
 */
const EXIT_CODE_LINES = [
  /^\s+0\s+done$/m,
  /^\s+1\s+unexpected internal error$/m,
  /^\s+2\s+bad command line or batch input/m,
  /^\s+3\s+formula file missing, unreadable or invalid$/m,
  /^\s+4\s+critical limit failed \(over a ceiling, or short of a required level\): the batch is refused$/m,
];

function assertExitCodeTable(text: string): void {
  assert.match(text, /^Exit codes:$/m);
  for (const line of EXIT_CODE_LINES) assert.match(text, line);
}

describe('larder --version', () => {
  for (const flag of ['--version', '-V']) {
    it(`prints the version from package.json with ${flag}`, async () => {
      const run = await runLarder([flag]);
      assertExit(run, 0);
      assert.equal(run.stdout, `${packageVersion}\n`);
      assert.equal(run.stderr, '');
    });
  }
});

describe('larder --help', () => {
  it('lists every verb and the exit codes', async () => {
    const run = await runLarder(['--help']);
    assertExit(run, 0);
    for (const verb of ['calc', 'check', 'new'])
      assert.match(run.stdout, new RegExp(`^\\s+${verb} `, 'm'));
    assertExitCodeTable(run.stdout);
    assert.equal(run.stderr, '');
  });

  for (const verb of ['calc', 'check', 'new']) {
    it(`shows examples and the exit codes for ${verb} --help`, async () => {
      const run = await runLarder([verb, '--help']);
      assertExit(run, 0);
      assert.match(run.stdout, new RegExp(`^Usage: larder ${verb} `, 'm'));
      assert.match(run.stdout, /^Examples:$/m);
      assert.match(
        run.stdout,
        new RegExp(`^\\s+larder ${verb}\\b`, 'm'),
        'at least one example of the verb itself',
      );
      assertExitCodeTable(run.stdout);
      assert.equal(run.stderr, '');
    });

    it(`prints the same text for help ${verb} as for ${verb} --help`, async () => {
      const [viaHelp, viaFlag] = await Promise.all([
        runLarder(['help', verb]),
        runLarder([verb, '--help']),
      ]);
      assertExit(viaHelp, 0);
      assert.equal(viaHelp.stdout, viaFlag.stdout);
    });
  }

  it('refuses an unknown verb with exit 2 and names it', async () => {
    const run = await runLarder(['frobnicate']);
    assertCleanFailure(run, 2, /unknown command 'frobnicate'/);
  });

  it('every example in calc --help names a formula that exists', async () => {
    const [help, check] = await Promise.all([
      runLarder(['calc', '--help']),
      runLarder(['check', '--json']),
    ]);
    const ids = new Set(stdoutJson<CheckReport>(check).files.map((f) => f.id));
    const named = [...help.stdout.matchAll(/^\s+larder calc (\S+)/gm)].map((m) => m[1]);
    assert.ok(named.length > 0);
    const missing = named.filter((ref) =>
      ref.endsWith('.yaml') ? !ids.has(path.basename(ref, '.yaml')) : !ids.has(ref),
    );
    assert.deepEqual(missing, []);
  });
});
