/**
 * A line diff of two formula revisions, as GET /api/formulas/:id/diff answers: one definition for
 * the server that works it out and the console that shows it. Types only.
 */

/** One line of a diff: the same on both sides, only in the old text, or only in the new. */
export interface DiffLine {
  readonly kind: 'same' | 'added' | 'removed';
  readonly text: string;
  /** 1-based line in the old text; null for an added line. */
  readonly oldLine: number | null;
  /** 1-based line in the new text; null for a removed line. */
  readonly newLine: number | null;
}

/** A run of changes with the unchanged lines around them, as in a unified diff. */
export interface DiffHunk {
  /** First old line shown (1-based; 0 when the old side shows no line). */
  readonly oldStart: number;
  readonly oldLines: number;
  readonly newStart: number;
  readonly newLines: number;
  readonly lines: readonly DiffLine[];
}

/** GET /api/formulas/:id/diff. */
export interface FormulaDiff {
  readonly id: string;
  readonly from: { readonly revision: string; readonly yaml: string };
  readonly to: { readonly revision: string; readonly yaml: string; readonly current: boolean };
  /** Whether the two texts differ at all. */
  readonly changed: boolean;
  readonly added: number;
  readonly removed: number;
  readonly lines: readonly DiffLine[];
  readonly hunks: readonly DiffHunk[];
}
