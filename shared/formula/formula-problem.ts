/** Where in a formula a problem is: keys and list positions from the top, e.g. ['ingredients', 2, 'pct']. */
export type FormulaPath = readonly (string | number)[];

/** A problem found in a formula's content, before any file position is known. */
export interface ContentProblem {
  readonly path: FormulaPath;
  readonly message: string;
  /** error: the formula cannot be used; warning: it can, but someone should look. */
  readonly severity: 'error' | 'warning';
  /** Set when the formula's own levels fail a critical limit: every batch of it is refused. */
  readonly criticalLimit?: true;
}

/** A problem located in a file: what callers print as "file:line:column: message". */
export interface FormulaProblem extends ContentProblem {
  readonly file: string;
  /** 1-based line; 0 when the problem concerns the whole file. */
  readonly line: number;
  /** 1-based column; 0 when the problem concerns the whole file. */
  readonly column: number;
}

/** Shorthand for an error at a path. */
export function contentError(path: FormulaPath, message: string): ContentProblem {
  return { path, message, severity: 'error' };
}

/** Shorthand for a warning at a path. */
export function contentWarning(path: FormulaPath, message: string): ContentProblem {
  return { path, message, severity: 'warning' };
}
