import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import fc from 'fast-check';
import { diffHunks, diffLines, splitLines } from './line-diff.ts';

const text = (...lines: string[]): string => lines.map((line) => `${line}\n`).join('');

describe('diffLines', () => {
  it('should mark every line the same when nothing changed', () => {
    const lines = diffLines(text('a', 'b'), text('a', 'b'));
    assert.deepEqual(lines, [
      { kind: 'same', text: 'a', oldLine: 1, newLine: 1 },
      { kind: 'same', text: 'b', oldLine: 2, newLine: 2 },
    ]);
    assert.deepEqual(diffHunks(lines), []);
  });

  it('should show a changed line as removed, then added, with the line on each side', () => {
    assert.deepEqual(diffLines(text('a', 'b', 'c'), text('a', 'B', 'c', 'd')), [
      { kind: 'same', text: 'a', oldLine: 1, newLine: 1 },
      { kind: 'removed', text: 'b', oldLine: 2, newLine: null },
      { kind: 'added', text: 'B', oldLine: null, newLine: 2 },
      { kind: 'same', text: 'c', oldLine: 3, newLine: 3 },
      { kind: 'added', text: 'd', oldLine: null, newLine: 4 },
    ]);
  });

  it('should keep the longest run of common lines', () => {
    const kinds = diffLines(text('x', 'a', 'b', 'c'), text('a', 'b', 'c', 'x')).map((l) => l.kind);
    assert.deepEqual(kinds, ['removed', 'same', 'same', 'same', 'added']);
  });

  it('should rebuild both texts from the diff, numbering each side in order', () => {
    const lines = fc.array(fc.constantFrom('a', 'b', 'c', 'd', ''), { maxLength: 30 });
    fc.assert(
      fc.property(lines, lines, (before, after) => {
        const oldText = text(...before);
        const newText = text(...after);
        const diff = diffLines(oldText, newText);
        const oldSide = diff.filter((l) => l.kind !== 'added');
        const newSide = diff.filter((l) => l.kind !== 'removed');
        assert.deepEqual(
          oldSide.map((l) => l.text),
          splitLines(oldText),
        );
        assert.deepEqual(
          newSide.map((l) => l.text),
          splitLines(newText),
        );
        assert.deepEqual(
          oldSide.map((l) => l.oldLine),
          oldSide.map((_, i) => i + 1),
        );
        assert.deepEqual(
          newSide.map((l) => l.newLine),
          newSide.map((_, i) => i + 1),
        );
      }),
    );
  });
});

describe('diffHunks', () => {
  const many = (from: number, to: number): string[] =>
    Array.from({ length: to - from + 1 }, (_, i) => `line ${from + i}`);

  it('should make one hunk per change far from the others, with three lines of context', () => {
    const before = many(1, 20);
    const after = [...before];
    after[1] = 'changed 2';
    after[17] = 'changed 18';
    const hunks = diffHunks(diffLines(text(...before), text(...after)));
    assert.equal(hunks.length, 2);
    assert.deepEqual(
      hunks.map((h) => [h.oldStart, h.oldLines, h.newStart, h.newLines]),
      [
        [1, 5, 1, 5],
        [15, 6, 15, 6],
      ],
    );
  });

  it('should join changes whose context would overlap', () => {
    const before = many(1, 20);
    const after = [...before];
    after[5] = 'changed 6';
    after[10] = 'changed 11';
    assert.equal(diffHunks(diffLines(text(...before), text(...after))).length, 1);
  });
});
