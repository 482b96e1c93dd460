/** A kitchen's own limit in a formula's control, checked: its form, units and source. */
import type { Decimal } from '../decimal.ts';
import { contentError, type ContentProblem, type FormulaPath } from '../formula/formula-problem.ts';
import { parseDuration } from '../units/duration.ts';
import { QuantityError } from '../units/quantity-error.ts';
import type { FormulaControl } from './control-types.ts';
import { parseLimitValue } from './reading-value.ts';

/** Reads one value, pushing the problem at its path when it cannot be read. */
function reader(problems: ContentProblem[]) {
  return (read: () => Decimal, at: FormulaPath): Decimal | null => {
    try {
      return read();
    } catch (error) {
      if (error instanceof QuantityError) {
        problems.push(contentError(at, error.message));
        return null;
      }
      throw error;
    }
  };
}

function checkStages(control: FormulaControl, at: FormulaPath, problems: ContentProblem[]): void {
  const read = reader(problems);
  (control.limit?.stages ?? []).forEach((stage, i) => {
    const here: FormulaPath = [...at, 'stages', i];
    const from = read(() => parseLimitValue(stage.from, control.measure), [...here, 'from']);
    const to = read(() => parseLimitValue(stage.to, control.measure), [...here, 'to']);
    const within = read(() => parseDuration(stage.within), [...here, 'within']);
    if (from && to && !to.lessThan(from)) {
      problems.push(contentError(here, 'a cooling stage must go down: "to" below "from"'));
    }
    if (within?.isZero()) problems.push(contentError([...here, 'within'], 'the time cannot be 0'));
  });
}

/**
 * The problems of a control's own limit: one of the forms { max }, { min }, { min, max },
 * { min, hold }, { stages }; values in the measure's units; and the source it comes from.
 */
export function checkOwnLimit(control: FormulaControl, at: FormulaPath): ContentProblem[] {
  const problems: ContentProblem[] = [];
  const limit = control.limit ?? {};
  const here: FormulaPath = [...at, 'limit'];
  if (control.source === undefined) {
    problems.push(
      contentError(
        at,
        'a limit of your own needs source: the validation or published work it comes from',
      ),
    );
  }
  const hasBounds = limit.min !== undefined || limit.max !== undefined;
  if (limit.stages !== undefined) {
    if (hasBounds || limit.hold !== undefined) {
      problems.push(contentError(here, 'a cooling limit (stages) takes no min, max or hold'));
    }
    checkStages(control, here, problems);
    return problems;
  }
  if (!hasBounds) {
    problems.push(contentError(here, 'give max, min, min with hold, or stages'));
    return problems;
  }
  if (limit.hold !== undefined && (limit.min === undefined || limit.max !== undefined)) {
    problems.push(
      contentError(here, 'hold goes with min alone: stay at or above min for this long'),
    );
  }
  const read = reader(problems);
  const min =
    limit.min === undefined
      ? null
      : read(() => parseLimitValue(limit.min ?? '', control.measure), [...here, 'min']);
  const max =
    limit.max === undefined
      ? null
      : read(() => parseLimitValue(limit.max ?? '', control.measure), [...here, 'max']);
  if (min && max && min.greaterThan(max)) {
    problems.push(contentError(here, 'min is above max'));
  }
  if (limit.hold !== undefined) read(() => parseDuration(limit.hold ?? ''), [...here, 'hold']);
  return problems;
}
