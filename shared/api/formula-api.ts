/**
 * The formulas API's answers (/api/formulas): one definition for the server that sends them and
 * the console that reads them. Types only, so the console imports them without the core.
 */
import type { FormulaProblem } from '../formula/formula-problem.ts';
import type { Formula, FormulaKind } from '../formula/formula-types.ts';
import type { PresentedResult } from '../presentation/presented-result.ts';

/** How a revision came to be: through the API, or found on disk (a git pull, an editor). */
export type RevisionSource = 'save' | 'upload' | 'disk' | 'create' | 'delete';

/** Who made a revision through the API. */
export interface RevisionAuthor {
  readonly id: number;
  readonly username: string;
  readonly displayName: string;
}

/** Who last changed a formula, when and how; all null before its history has an entry. */
export interface LastChange {
  readonly lastChangedBy: string | null;
  readonly lastChangedAt: string | null;
  readonly lastChangeSource: RevisionSource | null;
}

/** One formula file in GET /api/formulas. */
export interface FormulaSummary extends LastChange {
  /** The formula's id; null when the file cannot be read far enough to find one. */
  readonly id: string | null;
  readonly title: string | null;
  readonly kind: FormulaKind | null;
  readonly file: string;
  /** sha-256 of the file text. */
  readonly revision: string;
  /** Whether the formula reads cleanly and can be calculated. */
  readonly valid: boolean;
  readonly problemCount: number;
  readonly errorCount: number;
  /** Whether another file already claims this id (the API uses the first). */
  readonly duplicate: boolean;
}

/** GET /api/formulas/:id. */
export interface FormulaDetail extends LastChange {
  readonly id: string;
  readonly file: string;
  readonly revision: string;
  readonly yaml: string;
  /** The formula as read from the YAML; null when it has errors. */
  readonly formula: Formula | null;
  readonly valid: boolean;
  readonly problems: readonly FormulaProblem[];
}

/** POST /api/formulas/validate. */
export interface FormulaValidation {
  /** Whether the text reads as a formula that can be calculated. */
  readonly usable: boolean;
  readonly id: string | null;
  readonly title: string | null;
  readonly kind: FormulaKind | null;
  readonly revision: string;
  readonly problems: readonly FormulaProblem[];
}

/** POST /api/formulas/:id/preview. */
export interface FormulaPreview {
  readonly id: string;
  /** Whether the saved formula was calculated (no YAML sent). */
  readonly saved: boolean;
  readonly revision: string;
  readonly result: PresentedResult;
}

/** One entry of a formula's history, as the API shows it (without the YAML). */
export interface FormulaRevision {
  /** sha-256 of the YAML text. */
  readonly revision: string;
  readonly source: RevisionSource;
  readonly message: string;
  readonly title: string | null;
  readonly kind: string | null;
  /** null for a revision found on disk. */
  readonly author: RevisionAuthor | null;
  readonly at: string;
  /** The git commit that recorded it, when the formulas folder is a git work tree. */
  readonly commit: string | null;
  /** Whether this is the revision on disk now. */
  readonly current: boolean;
}

/** GET /api/formulas/:id/revisions, newest first. */
export interface FormulaRevisions {
  readonly id: string;
  readonly currentRevision: string | null;
  readonly revisions: readonly FormulaRevision[];
}

/** What a save, create or upload did. */
export interface WriteOutcome {
  readonly id: string;
  readonly file: string;
  readonly revision: string;
  /** The revision replaced; null for a new formula. */
  readonly previousRevision: string | null;
  readonly created: boolean;
  /** False when the text sent was the text already on disk: nothing was written. */
  readonly changed: boolean;
  /** The git commit, when the formulas folder is a git work tree and the commit worked. */
  readonly commit: string | null;
  /** Things that went wrong without undoing the save, e.g. a failed git commit. */
  readonly warnings: readonly string[];
  /** Warnings about the formula itself (it has no errors, or it would not be saved). */
  readonly problems: readonly FormulaProblem[];
}
