// Every relative link of our Markdown leads to a file of the repository, and every #anchor to a
// heading of the file it names, as GitHub renders them: a moved section shows here first.
import assert from 'node:assert/strict';
import { existsSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { anchorsOf, headingAnchor, linksOf, markdownFiles } from '../helpers/markdown.ts';
import { REPO_ROOT } from '../helpers/run-larder.ts';

/** A scheme (`https:`, `mailto:`) or `//`: a link off the repository, not checked here. */
const ELSEWHERE = /^(?:[a-z][a-z0-9+.-]*:|\/\/)/i;
/** GitHub's anchor for lines of a source file, the only anchor a file other than Markdown has. */
const LINE_ANCHOR = /^L\d+(?:-L\d+)?$/;

const anchorsByFile = new Map<string, Set<string>>();
function anchorsIn(file: string): Set<string> {
  let anchors = anchorsByFile.get(file);
  if (anchors === undefined) {
    anchors = anchorsOf(readFileSync(path.join(REPO_ROOT, file), 'utf8'));
    anchorsByFile.set(file, anchors);
  }
  return anchors;
}

/** What is wrong with one relative link of `from` (a path from the root), or undefined. */
function brokenBecause(from: string, target: string): string | undefined {
  const hash = target.indexOf('#');
  const filePart = decodeURIComponent(hash < 0 ? target : target.slice(0, hash));
  const anchor = hash < 0 ? undefined : decodeURIComponent(target.slice(hash + 1));
  const resolved =
    filePart === ''
      ? path.join(REPO_ROOT, from)
      : filePart.startsWith('/')
        ? path.join(REPO_ROOT, filePart)
        : path.resolve(REPO_ROOT, path.dirname(from), filePart);
  const file = path.relative(REPO_ROOT, resolved).split(path.sep).join('/');
  if (file.startsWith('..')) return 'leads out of the repository';
  if (!existsSync(resolved)) return `${file || '.'} does not exist`;
  if (anchor === undefined) return undefined;
  if (file.endsWith('.md')) {
    return anchorsIn(file).has(anchor) ? undefined : `${file} has no heading #${anchor}`;
  }
  if (statSync(resolved).isFile() && LINE_ANCHOR.test(anchor)) return undefined;
  return `#${anchor} cannot be checked in ${file || '.'}`;
}

describe('heading anchors as GitHub makes them', () => {
  // source: the anchors GitHub renders for these headings (github-slugger)
  it('should drop code marks and punctuation and turn each space into a dash', () => {
    assert.equal(headingAnchor('Quick start'), 'quick-start');
    assert.equal(headingAnchor('`larder calc FORMULA [options]`'), 'larder-calc-formula-options');
    assert.equal(headingAnchor('`larder check [PATHS…]`'), 'larder-check-paths');
    assert.equal(
      headingAnchor('`larder calc … --record`, `larder batches`, `larder users`'),
      'larder-calc----record-larder-batches-larder-users',
    );
  });

  it('should keep underscores, dashes and letters beyond ASCII', () => {
    assert.equal(
      headingAnchor('`lead_days` (cure, dough, blend, mix)'),
      'lead_days-cure-dough-blend-mix',
    );
    assert.equal(headingAnchor('E-mail and reminders'), 'e-mail-and-reminders');
    assert.equal(headingAnchor('Température à cœur'), 'température-à-cœur');
  });

  it('should number a repeated heading and skip headings in code blocks', () => {
    const anchors = anchorsOf('# Notes\n\n```sh\n# not a heading\n```\n\n## Notes\n');
    assert.deepEqual([...anchors], ['notes', 'notes-1']);
  });
});

describe('the links of our Markdown files', () => {
  const files = markdownFiles();

  it('should find the Markdown files beside what they describe', () => {
    for (const file of ['README.md', 'DEVELOPERS.md', 'cli/README.md', 'formulas/README.md']) {
      assert.ok(files.includes(file), `${file} among ${files.join(', ')}`);
    }
  });

  it('should find the links of the README, not only those of code spans', () => {
    const links = linksOf(readFileSync(path.join(REPO_ROOT, 'README.md'), 'utf8'));
    assert.ok(links.filter((link) => !ELSEWHERE.test(link.target)).length >= 5);
    assert.deepEqual(linksOf('`[not](a-link.md)` and [one](b.md)'), [{ target: 'b.md', line: 1 }]);
  });

  for (const file of files) {
    it(`${file}: every relative link and #anchor leads somewhere`, () => {
      const broken = linksOf(readFileSync(path.join(REPO_ROOT, file), 'utf8'))
        .filter((link) => !ELSEWHERE.test(link.target))
        .map((link) => {
          const reason = brokenBecause(file, link.target);
          return reason && `${file}:${link.line}: (${link.target}) ${reason}`;
        })
        .filter((problem) => problem !== undefined);
      assert.deepEqual(broken, []);
    });
  }
});
