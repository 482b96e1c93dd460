import { ApiError } from '../../core/api/api-error';
import type { FormulaProblem } from '../formula-api-types';

/**
 * The formula problems an API error carries (422 invalid-formula, id-mismatch, bad-id): its
 * details that have a message and a position. Other errors carry none.
 */
export function problemsOf(error: unknown): FormulaProblem[] {
  if (!(error instanceof ApiError)) return [];
  return error.details.filter(
    (detail): detail is FormulaProblem =>
      typeof detail === 'object' &&
      detail !== null &&
      typeof (detail as Partial<FormulaProblem>).message === 'string' &&
      typeof (detail as Partial<FormulaProblem>).line === 'number',
  );
}

/** A problem as people read it: "line 9, column 1: message". */
export function problemText(problem: FormulaProblem): string {
  const where =
    problem.line > 0 ? `line ${problem.line}, column ${problem.column}` : 'the whole file';
  return `${where}: ${problem.message}`;
}
