import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { DiffLine } from '../formula-api-types.ts';
import { sideBySide } from './side-by-side.ts';

const same = (text: string, oldLine: number, newLine: number): DiffLine => ({
  kind: 'same',
  text,
  oldLine,
  newLine,
});
const removed = (text: string, oldLine: number): DiffLine => ({
  kind: 'removed',
  text,
  oldLine,
  newLine: null,
});
const added = (text: string, newLine: number): DiffLine => ({
  kind: 'added',
  text,
  oldLine: null,
  newLine,
});

describe('sideBySide', () => {
  it('should put a changed line beside the line that replaced it', () => {
    const rows = sideBySide([same('a', 1, 1), removed('b', 2), added('B', 2), same('c', 3, 3)]);
    assert.equal(rows.length, 3);
    assert.deepEqual(rows[1], {
      left: { line: 2, text: 'b', kind: 'removed' },
      right: { line: 2, text: 'B', kind: 'added' },
    });
  });

  it('should pad the shorter side of a change with empty cells', () => {
    const rows = sideBySide([removed('a', 1), added('A', 1), added('A2', 2)]);
    assert.equal(rows.length, 2);
    assert.equal(rows[1].left.kind, 'none');
    assert.equal(rows[1].right.text, 'A2');
  });

  it('should keep a removal that follows additions on a row of its own', () => {
    const rows = sideBySide([added('x', 1), removed('y', 1)]);
    assert.deepEqual(
      rows.map((row) => [row.left.kind, row.right.kind]),
      [
        ['none', 'added'],
        ['removed', 'none'],
      ],
    );
  });
});
