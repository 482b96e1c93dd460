/**
 * The formulas API's shapes, declared once in shared/api/ (types only) for the server and the
 * console alike, and what the console adds to them.
 */
import type { FormulaProblem } from '../../../shared/formula/formula-problem.ts';
import type { Formula, FormulaKind } from '../../../shared/formula/formula-types.ts';
import type { PresentedResult } from '../../../shared/presentation/presented-result.ts';

export type { Formula, FormulaKind, FormulaProblem, PresentedResult };
export type {
  FormulaDetail,
  FormulaPreview,
  FormulaRevision,
  FormulaRevisions,
  FormulaSummary,
  FormulaValidation,
  LastChange,
  RevisionAuthor,
  RevisionSource,
  WriteOutcome,
} from '../../../shared/api/formula-api.ts';
export type { DiffHunk, DiffLine, FormulaDiff } from '../../../shared/api/revision-diff.ts';

/** Metric or US units on a batch sheet. */
export type UnitSystem = 'metric' | 'us';

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

/** The first eight characters of a revision or commit, as people compare them. */
export function shortRevision(revision: string | null | undefined): string {
  return revision ? revision.slice(0, 8) : '';
}
