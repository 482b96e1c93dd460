import {
  BATCH_OPTION_NAMES,
  BatchError,
  calculate,
  parseBatchOptions,
  presentResult,
  readFormula,
  type Formula,
  type FormulaLibrary,
  type PresentedResult,
  type RawBatchOptions,
  type UnitSystem,
} from '../../shared/index.ts';
import { refuseOverLimit } from '../formulas/formula-checks.ts';
import { AppError } from '../http/app-error.ts';

/** The batch part of a calculation request: options as the CLI takes them, values as strings. */
export const BATCH_OPTIONS_SCHEMA = {
  type: 'object',
  additionalProperties: false,
  properties: Object.fromEntries(
    BATCH_OPTION_NAMES.map((key) => [
      key,
      // Up to five KEY=VALUE entries for on hand and fat tests (a blend has up to five trimmings).
      { type: 'string', minLength: 1, maxLength: key === 'onHand' || key === 'fatTest' ? 300 : 60 },
    ]),
  ),
} as const;

export const UNITS_SCHEMA = { enum: ['metric', 'us'] } as const;

/**
 * Reads formula YAML sent in a request; 422 with every problem (line, column) when it cannot be
 * used, 413 or 422 from refuseOverLimit when it is larger or deeper than a formula can be.
 */
export function formulaFromText(yaml: string, name: string): Formula {
  const reading = readFormula(yaml, name);
  refuseOverLimit(reading);
  if (!reading.formula) {
    throw new AppError(
      422,
      'invalid-formula',
      `the formula has ${reading.problems.filter((p) => p.severity === 'error').length} error(s)`,
      reading.problems,
    );
  }
  return reading.formula;
}

/**
 * Calculates and presents one batch, turning batch-input mistakes into 400s that name the option.
 * @param today the server's today, YYYY-MM-DD: the start day when none is given, and the middle
 *   of the days a start may lie in
 * @param library the formulas an assembly's parts are made from (only an assembly needs it)
 */
export function calculateBatch(
  formula: Formula,
  raw: RawBatchOptions,
  units: UnitSystem,
  today: string,
  library?: FormulaLibrary,
): PresentedResult {
  try {
    const input = parseBatchOptions({ start: today, ...raw }, formula, { today });
    return presentResult(calculate(formula, input, library), units);
  } catch (error) {
    if (error instanceof BatchError)
      throw new AppError(
        400,
        'bad-batch',
        error.message,
        error.option ? [{ option: error.option }] : [],
      );
    throw error;
  }
}
