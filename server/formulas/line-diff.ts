import type { DiffHunk, DiffLine } from '../../shared/api/revision-diff.ts';

/**
 * Most cells of the longest-common-subsequence table we fill (about 16 MB); beyond that the
 * changed middle is shown as all removed, then all added. Formulas are a few hundred lines.
 */
const MAX_CELLS = 4_000_000;

/** The lines of a text; a final newline does not start another line. */
export function splitLines(text: string): string[] {
  if (text === '') return [];
  const lines = text.split(/\r?\n/);
  if (lines[lines.length - 1] === '') lines.pop();
  return lines;
}

/**
 * A line diff of two texts by longest common subsequence, after setting aside the lines they
 * share at the start and the end. Where a line changed, its removal comes before the addition.
 */
export function diffLines(oldText: string, newText: string): DiffLine[] {
  const a = splitLines(oldText);
  const b = splitLines(newText);
  let start = 0;
  while (start < a.length && start < b.length && a[start] === b[start]) start++;
  let endA = a.length;
  let endB = b.length;
  while (endA > start && endB > start && a[endA - 1] === b[endB - 1]) {
    endA--;
    endB--;
  }

  const lines: DiffLine[] = [];
  const same = (i: number, j: number): void => {
    lines.push({ kind: 'same', text: a[i], oldLine: i + 1, newLine: j + 1 });
  };
  const removed = (i: number): void => {
    lines.push({ kind: 'removed', text: a[i], oldLine: i + 1, newLine: null });
  };
  const added = (j: number): void => {
    lines.push({ kind: 'added', text: b[j], oldLine: null, newLine: j + 1 });
  };

  for (let i = 0; i < start; i++) same(i, i);
  const n = endA - start;
  const m = endB - start;
  if (n * m > MAX_CELLS) {
    for (let i = start; i < endA; i++) removed(i);
    for (let j = start; j < endB; j++) added(j);
  } else {
    // table[i * (m + 1) + j]: length of the longest common subsequence of a[start + i..] and b[start + j..].
    const width = m + 1;
    const table = new Uint32Array((n + 1) * width);
    for (let i = n - 1; i >= 0; i--) {
      for (let j = m - 1; j >= 0; j--) {
        table[i * width + j] =
          a[start + i] === b[start + j]
            ? table[(i + 1) * width + j + 1] + 1
            : Math.max(table[(i + 1) * width + j], table[i * width + j + 1]);
      }
    }
    let i = 0;
    let j = 0;
    while (i < n || j < m) {
      if (i < n && j < m && a[start + i] === b[start + j]) {
        same(start + i++, start + j++);
      } else if (j >= m || (i < n && table[(i + 1) * width + j] >= table[i * width + j + 1])) {
        removed(start + i++);
      } else {
        added(start + j++);
      }
    }
  }
  for (let i = endA, j = endB; i < a.length; i++, j++) same(i, j);
  return lines;
}

/** Groups a diff's changes into hunks with `context` unchanged lines either side. */
export function diffHunks(lines: readonly DiffLine[], context = 3): DiffHunk[] {
  const hunks: DiffHunk[] = [];
  let index = 0;
  while (index < lines.length) {
    if (lines[index].kind === 'same') {
      index++;
      continue;
    }
    const from = Math.max(0, index - context);
    let to = index;
    // Extend over changes and over gaps of unchanged lines short enough to share context.
    for (;;) {
      while (to < lines.length && lines[to].kind !== 'same') to++;
      let gap = to;
      while (gap < lines.length && lines[gap].kind === 'same') gap++;
      if (gap < lines.length && gap - to <= 2 * context) to = gap;
      else break;
    }
    const end = Math.min(lines.length, to + context);
    const shown = lines.slice(from, end);
    hunks.push({
      oldStart: firstNumber(shown, 'oldLine', lines, from),
      oldLines: shown.filter((line) => line.kind !== 'added').length,
      newStart: firstNumber(shown, 'newLine', lines, from),
      newLines: shown.filter((line) => line.kind !== 'removed').length,
      lines: shown,
    });
    index = end;
  }
  return hunks;
}

// The first line number a hunk shows on one side; for a side that shows no line, the line
// before the hunk (0 at the very start), as unified diffs count it.
function firstNumber(
  shown: readonly DiffLine[],
  side: 'oldLine' | 'newLine',
  all: readonly DiffLine[],
  from: number,
): number {
  const first = shown.find((line) => line[side] !== null)?.[side];
  if (first !== undefined && first !== null) return first;
  for (let k = from - 1; k >= 0; k--) {
    const value = all[k][side];
    if (value !== null) return value;
  }
  return 0;
}
