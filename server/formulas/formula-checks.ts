import { LineCounter, isMap, isScalar } from 'yaml';
import {
  isFormulaId,
  parseYamlWithinLimits,
  readFormula,
  type Formula,
  type FormulaProblem,
  type FormulaReading,
} from '../../shared/index.ts';
import { AppError, conflict } from '../http/app-error.ts';

/** 409 for a write based on a revision that is no longer the one on disk. */
export function staleRevision(current: string | null): AppError {
  return conflict(
    'stale-revision',
    current === null
      ? 'the formula is no longer on disk; reload it'
      : 'the formula has changed since you loaded it (saved by someone else, or on disk); reload it and make your change again',
    [{ currentRevision: current }],
  );
}

/** 422 with every problem of a formula text, each with its line and column. */
export function invalidFormula(problems: readonly FormulaProblem[]): AppError {
  const errors = problems.filter((problem) => problem.severity === 'error').length;
  return new AppError(422, 'invalid-formula', `the formula has ${errors} error(s)`, problems);
}

/**
 * Refuses a reading of formula YAML that was stopped at a limit (larger, deeper or fuller than
 * any formula): 413 too-large past the size ceiling, 422 too-complex past the nesting or node
 * limit, with the one problem, at the line and column where the limit is passed, as details.
 * @throws AppError when the reading passed a limit
 */
export function refuseOverLimit(reading: FormulaReading): void {
  if (reading.limit === undefined) return;
  const [problem] = reading.problems;
  throw reading.limit === 'size'
    ? new AppError(413, 'too-large', problem.message, reading.problems)
    : new AppError(422, 'too-complex', problem.message, reading.problems);
}

/**
 * Reads a formula text that is about to be written: it must read cleanly and carry `id`.
 * @throws AppError 422 with the problems (line, column) when it does not; 413 or 422 from
 *   refuseOverLimit
 */
export function usableFormula(
  text: string,
  fileName: string,
  id?: string,
): { formula: Formula; problems: readonly FormulaProblem[] } {
  const reading = readFormula(text, fileName);
  refuseOverLimit(reading);
  if (!reading.formula) throw invalidFormula(reading.problems);
  if (id !== undefined && reading.formula.id !== id) {
    throw new AppError(
      422,
      'id-mismatch',
      `the formula's id is "${reading.formula.id}", but this is the formula "${id}"; a formula keeps its id`,
      [
        {
          file: fileName,
          ...idPosition(text),
          path: ['id'],
          message: `the id must be "${id}"`,
          severity: 'error',
        },
      ],
    );
  }
  return { formula: reading.formula, problems: reading.problems };
}

/**
 * Reads the text of a new formula, whose file will be named by the id inside it.
 * @throws AppError 400 bad-id when the id is not a well-formed id (such as "../x"): nothing is
 *   ever named by it; 413 or 422 from refuseOverLimit; 422 for any other problem
 */
export function newFormula(text: string, fileName: string): Formula {
  const reading = readFormula(text, fileName);
  refuseOverLimit(reading);
  const parsed = parseYamlWithinLimits(text);
  const top = parsed.ok ? parsed.document.contents : undefined;
  const id = isMap(top) ? top.get('id') : undefined;
  if (id !== undefined && !isFormulaId(id)) {
    throw new AppError(
      400,
      'bad-id',
      'a formula id is 2 to 63 lower-case letters, digits and dashes; the file is named by it',
      reading.problems,
    );
  }
  if (!reading.formula) throw invalidFormula(reading.problems);
  return reading.formula;
}

function idPosition(text: string): { line: number; column: number } {
  const lineCounter = new LineCounter();
  const parsed = parseYamlWithinLimits(text, { lineCounter });
  const top = parsed.ok ? parsed.document.contents : undefined;
  const value = isMap(top) ? top.get('id', true) : undefined;
  const offset = isScalar(value) ? value.range?.[0] : undefined;
  if (offset === undefined) return { line: 0, column: 0 };
  const { line, col } = lineCounter.linePos(offset);
  return { line, column: col };
}
