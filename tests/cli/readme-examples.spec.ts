import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { markdownFiles } from '../helpers/markdown.ts';
import { REPO_ROOT, runLarder, showRun } from '../helpers/run-larder.ts';

/**
 * The documentation shows what the command prints. Each example is marked, in any Markdown file
 * of the repository, by a comment `<!-- output of: larder ARGS -->` just before its ```text block;
 * this runs ARGS on the demo formulas and checks that every line of the block is printed, in
 * order. A line "..." stands for lines left out. Dates are the day the example was written, so
 * any ISO date matches any.
 */
interface Example {
  readonly file: string;
  readonly args: string[];
  readonly lines: string[];
}

const MARKER = /<!-- output of: larder (.+?) -->\s*```text\n([\s\S]*?)```/g;
const ISO_DATE = /\d{4}-\d{2}-\d{2}/g;

function markedExamples(file: string): Example[] {
  const text = readFileSync(path.join(REPO_ROOT, file), 'utf8');
  return [...text.matchAll(MARKER)].map(([, command, block]) => ({
    file,
    args: command.split(/\s+/),
    lines: block
      .split('\n')
      .map((line) => line.trimEnd())
      .filter((line) => line !== '' && line !== '...'),
  }));
}

const normalise = (line: string): string => line.trimEnd().replace(ISO_DATE, 'DATE');

describe('the examples in the documentation print what it says', () => {
  const examples = markdownFiles().flatMap(markedExamples);

  it('finds the marked examples', () => {
    // The quick start's batch sheet in the README; with the check of the demo folder (cli/) and
    // the hot links and the ham (formulas/), at least four in all.
    const inReadme = examples.filter((example) => example.file === 'README.md');
    assert.ok(inReadme.length >= 1, `marked examples in README.md: ${inReadme.length}`);
    assert.ok(examples.length >= 4, `marked examples in all: ${examples.length}`);
  });

  it('reads every marker: none stands anywhere but just before a text block', () => {
    for (const file of markdownFiles()) {
      const text = readFileSync(path.join(REPO_ROOT, file), 'utf8');
      // A marker is a line of its own; prose may name one in a code span.
      const markers = text.match(/^<!-- output of:/gm)?.length ?? 0;
      assert.equal(markedExamples(file).length, markers, `examples read in ${file}`);
    }
  });

  for (const example of examples) {
    it(`${example.file}: larder ${example.args.join(' ')}`, async () => {
      const run = await runLarder(example.args);
      const printed = run.stdout.split('\n').map(normalise);
      let from = 0;
      for (const line of example.lines) {
        const at = printed.indexOf(normalise(line), from);
        assert.ok(
          at >= 0,
          `${example.file} line not printed (in order): "${line}"\n${showRun(run)}`,
        );
        from = at + 1;
      }
    });
  }
});
