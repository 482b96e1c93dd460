import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { REPO_ROOT, runLarder, showRun } from '../helpers/run-larder.ts';

/**
 * The README shows what the command prints. Each example is marked in the README by a comment
 * `<!-- output of: larder ARGS -->` just before its ```text block; this runs ARGS on the demo
 * formulas and checks that every line of the block is printed, in order. A line "..." stands
 * for lines left out. Dates are the day the README was written, so any ISO date matches any.
 */
interface Example {
  readonly args: string[];
  readonly lines: string[];
}

const MARKER = /<!-- output of: larder (.+?) -->\s*```text\n([\s\S]*?)```/g;
const ISO_DATE = /\d{4}-\d{2}-\d{2}/g;

function readmeExamples(): Example[] {
  const readme = readFileSync(path.join(REPO_ROOT, 'README.md'), 'utf8');
  return [...readme.matchAll(MARKER)].map(([, command, block]) => ({
    args: command.split(/\s+/),
    lines: block
      .split('\n')
      .map((line) => line.trimEnd())
      .filter((line) => line !== '' && line !== '...'),
  }));
}

const normalise = (line: string): string => line.trimEnd().replace(ISO_DATE, 'DATE');

describe('the README examples print what the README says', () => {
  const examples = readmeExamples();

  it('finds the marked examples', () => {
    // The quick start's batch sheet and the check of the demo folder, at least.
    assert.ok(examples.length >= 2, `marked examples in README.md: ${examples.length}`);
  });

  for (const example of examples) {
    it(`larder ${example.args.join(' ')}`, async () => {
      const run = await runLarder(example.args);
      const printed = run.stdout.split('\n').map(normalise);
      let from = 0;
      for (const line of example.lines) {
        const at = printed.indexOf(normalise(line), from);
        assert.ok(at >= 0, `README line not printed (in order): "${line}"\n${showRun(run)}`);
        from = at + 1;
      }
    });
  }
});
