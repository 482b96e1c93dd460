import type { FormulaProblem } from '../../../shared/formula/formula-problem.ts';
import type { Formula, FormulaKind } from '../../../shared/formula/formula-types.ts';
import type { PresentedResult } from '../../../shared/presentation/presented-result.ts';

export type { Formula, FormulaKind, FormulaProblem, PresentedResult };

/** Metric or US units on a batch sheet. */
export type UnitSystem = 'metric' | 'us';

/** How a revision came to be: saved in the console, created, uploaded, or found on disk. */
export type RevisionSource = 'save' | 'upload' | 'disk' | 'create' | 'delete';

/** One formula file in GET /api/formulas. */
export interface FormulaSummary {
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
  readonly lastChangedBy: string | null;
  readonly lastChangedAt: string | null;
  readonly lastChangeSource: RevisionSource | null;
}

/** GET /api/formulas/:id. */
export interface FormulaDetail {
  readonly id: string;
  readonly file: string;
  readonly revision: string;
  readonly yaml: string;
  /** The formula as read from the YAML; null when it has errors. */
  readonly formula: Formula | null;
  readonly valid: boolean;
  readonly problems: readonly FormulaProblem[];
  readonly lastChangedBy: string | null;
  readonly lastChangedAt: string | null;
  readonly lastChangeSource: RevisionSource | null;
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

/** A sample batch as the calculation takes it: option names of `larder calc`, values as text. */
export type BatchOptions = Partial<
  Record<
    | 'meat'
    | 'thickness'
    | 'largestPiece'
    | 'pumpedWeight'
    | 'pieces'
    | 'piece'
    | 'total'
    | 'base'
    | 'start',
    string
  >
>;

/** POST /api/formulas/:id/preview. */
export interface FormulaPreview {
  readonly id: string;
  /** Whether the saved formula was calculated (no YAML sent). */
  readonly saved: boolean;
  readonly revision: string;
  readonly result: PresentedResult;
}

/** Who made a revision in the console. */
export interface RevisionAuthor {
  readonly id: number;
  readonly username: string;
  readonly displayName: string;
}

/** One entry of a formula's history. */
export interface FormulaRevision {
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

/** One line of a diff. */
export interface DiffLine {
  readonly kind: 'same' | 'added' | 'removed';
  readonly text: string;
  /** 1-based line in the old text; null for an added line. */
  readonly oldLine: number | null;
  /** 1-based line in the new text; null for a removed line. */
  readonly newLine: number | null;
}

/** A run of changes with a few unchanged lines around it. */
export interface DiffHunk {
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

/** What a save, create or upload did. */
export interface WriteOutcome {
  readonly id: string;
  readonly file: string;
  readonly revision: string;
  readonly previousRevision: string | null;
  readonly created: boolean;
  /** False when the text sent was already the text on disk. */
  readonly changed: boolean;
  readonly commit: string | null;
  /** Things that went wrong without undoing the save, such as a failed git commit. */
  readonly warnings: readonly string[];
  /** Warnings about the formula itself. */
  readonly problems: readonly FormulaProblem[];
}

/** The first eight characters of a revision or commit, as people compare them. */
export function shortRevision(revision: string | null | undefined): string {
  return revision ? revision.slice(0, 8) : '';
}
