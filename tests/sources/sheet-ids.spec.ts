// Every source the repository gives must be one a reader can find: the published work itself, or
// "common practice, no source" / "from memory". Ids of a reference sheet kept outside the
// repository ("WE-8", "check-values S-5", "D-9") name nothing a reader has, so none may appear.
import assert from 'node:assert/strict';
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { REPO_ROOT } from '../helpers/run-larder.ts';

/** The outside sheet's name, and its ids: WE-n worked examples, and U, C, F, B, D, S, T, P rows. */
const SHEET_ID = /check-values|\b(?:WE|[UCFBDSTP])-\d{1,2}\b/g;

/** Where sources are written: code, tests, scripts, demo formulas, deployment files. */
const FOLDERS = [
  'shared',
  'cli',
  'server',
  'src',
  'tests',
  'scripts',
  'bench',
  'formulas',
  'deploy',
];
const TEXT_FILE = /\.(?:ts|js|mjs|html|ya?ml|md)$/;
const SELF = path.relative(REPO_ROOT, import.meta.filename);

/** Each line that cites a sheet id, as `file:line: text`. */
function sheetIdsIn(file: string, text: string): string[] {
  return text
    .split('\n')
    .map((line, index) => ({ line, number: index + 1 }))
    .filter(({ line }) => line.match(SHEET_ID))
    .map(({ line, number }) => `${file}:${number}: ${line.trim()}`);
}

/** The repository's own text files: the folders above and the documents at the root. */
function textFiles(): string[] {
  const inFolders = FOLDERS.flatMap((folder) =>
    readdirSync(path.join(REPO_ROOT, folder), { recursive: true, encoding: 'utf8' })
      .filter((name) => TEXT_FILE.test(name) && !name.includes('node_modules'))
      .map((name) => path.join(folder, name)),
  );
  const atRoot = readdirSync(REPO_ROOT).filter((name) => name.endsWith('.md'));
  return [...atRoot, ...inFolders].filter((file) => file !== SELF);
}

describe('sources name what a reader can find', () => {
  it('should find a bare sheet id in a source comment, so the check can fail', () => {
    const planted = "    assert.equal(salt, '116.00'); // source: WE-8\n";
    assert.deepEqual(sheetIdsIn('planted.ts', planted), [
      "planted.ts:1: assert.equal(salt, '116.00'); // source: WE-8",
    ]);
    assert.equal(sheetIdsIn('planted.ts', '// source: check-values S-5').length, 1);
    assert.equal(
      sheetIdsIn('planted.ts', '// source: 9 CFR 319.15(a), at most 30 % fat').length,
      0,
    );
  });

  it('should cite no id of the outside reference sheet anywhere in the repository', () => {
    const files = textFiles();
    assert.ok(files.length > 100, `only ${files.length} files read`);
    const found = files.flatMap((file) =>
      sheetIdsIn(file, readFileSync(path.join(REPO_ROOT, file), 'utf8')),
    );
    assert.deepEqual(
      found,
      [],
      'name the published source itself, or say common practice / from memory',
    );
  });
});
