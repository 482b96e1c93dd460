import type { DiffLine } from '../formula-api-types';

/** One side of a row of a side-by-side diff. */
export interface DiffCell {
  readonly line: number | null;
  readonly text: string;
  /** `none` where the other side has a line and this one has not. */
  readonly kind: 'same' | 'removed' | 'added' | 'none';
}

/** One row of a side-by-side diff: the old line on the left, the new one on the right. */
export interface DiffRow {
  readonly left: DiffCell;
  readonly right: DiffCell;
}

const NONE: DiffCell = { line: null, text: '', kind: 'none' };

/**
 * Lays the lines of a diff side by side: unchanged lines on both sides, and each run of removed
 * lines beside the run of added lines that replaced it, padded where one run is longer.
 */
export function sideBySide(lines: readonly DiffLine[]): DiffRow[] {
  const rows: DiffRow[] = [];
  let removed: DiffLine[] = [];
  let added: DiffLine[] = [];
  const flush = (): void => {
    for (let i = 0; i < Math.max(removed.length, added.length); i++) {
      const old = removed[i];
      const next = added[i];
      rows.push({
        left: old ? { line: old.oldLine, text: old.text, kind: 'removed' } : NONE,
        right: next ? { line: next.newLine, text: next.text, kind: 'added' } : NONE,
      });
    }
    removed = [];
    added = [];
  };
  for (const line of lines) {
    if (line.kind === 'removed') {
      // A removal after additions starts a new change.
      if (added.length > 0) flush();
      removed.push(line);
    } else if (line.kind === 'added') {
      added.push(line);
    } else {
      flush();
      rows.push({
        left: { line: line.oldLine, text: line.text, kind: 'same' },
        right: { line: line.newLine, text: line.text, kind: 'same' },
      });
    }
  }
  flush();
  return rows;
}
