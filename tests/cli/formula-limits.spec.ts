import assert from 'node:assert/strict';
import { performance } from 'node:perf_hooks';
import { describe, it } from 'node:test';
import {
  assertCleanFailure,
  assertExit,
  assertNoStackTrace,
  escapeRegExp,
  runLarder,
} from '../helpers/run-larder.ts';
import { makeTempDir, writeText } from '../helpers/temp-files.ts';

/** The reported attack as a file: notes that open 127,000 lists and close them again (254 kB). */
const DEEP = `formula: 1\nid: deep-sauce\ntitle: Deep sauce\nkind: mix\nnotes: ${'['.repeat(127_000)}${']'.repeat(127_000)}\n`;

// "notes: " is 7 characters, so the first "[" of line 5 is column 8; the keys are level 1, so
// the 32nd "[" (column 8 + 31) opens level 33, one past the limit.
const WHERE = ':5:39: error: the file nests lists and sets of keys more than 32 levels deep here';

// The command starts, finds the limit passed and exits: well under the 5 s a shared machine may
// take to start it several times over (CI runs the browser suites beside these); unguarded, the
// parse alone ran until the heap ran out. common practice, no source
const MAX_MS = 5_000;

describe('larder with a formula file nested beyond reason', () => {
  it('check exits 3 at once, naming the line and column where the nesting passes the limit', async (t) => {
    const file = writeText(makeTempDir(t), 'deep-sauce.yaml', DEEP);
    const start = performance.now();
    const run = await runLarder(['check', file]);
    const ms = performance.now() - start;
    assertExit(run, 3);
    assertNoStackTrace(run);
    assert.match(run.stdout, new RegExp(`^${escapeRegExp(file + WHERE)}`, 'm'));
    assert.ok(ms < MAX_MS, `larder check took ${ms.toFixed(0)} ms`);
  });

  it('calc exits 3 at once with the same problem', async (t) => {
    const file = writeText(makeTempDir(t), 'deep-sauce.yaml', DEEP);
    const start = performance.now();
    const run = await runLarder(['calc', file, '--base', '1kg']);
    const ms = performance.now() - start;
    assertCleanFailure(run, 3, new RegExp(`^${escapeRegExp(file + WHERE)}`, 'm'));
    assert.ok(ms < MAX_MS, `larder calc took ${ms.toFixed(0)} ms`);
  });

  it('check refuses a file with more values than any formula, at the first one too many', async (t) => {
    // 6,000 list items on line 5, with their commas 12,000 counted: the limit is passed on
    // that line (where exactly is the unit spec's business, shared/formula/yaml-limits.spec.ts).
    const text = `formula: 1\nid: many\ntitle: Many\nkind: mix\nsteps: [${Array(6000).fill('a').join(',')}]\n`;
    const file = writeText(makeTempDir(t), 'many.yaml', text);
    const run = await runLarder(['check', file]);
    assertExit(run, 3);
    assert.match(
      run.stdout,
      new RegExp(`^${escapeRegExp(file)}:5:\\d+: error: the file holds more than 5,000 keys`, 'm'),
    );
  });
});
