import {
  criticalFailures,
  type FormulaLibrary,
  type RawBatchOptions,
  type UnitSystem,
} from '../../shared/index.ts';
import { calculateBatch } from '../calc/calc-request.ts';
import type { CurrentFormula } from '../formulas/formula-store.ts';
import { AppError } from '../http/app-error.ts';
import { RecordsError } from '../records/records-error.ts';
import { recordedStatus, type RecordStatus } from '../../shared/workflow/batch-status.ts';
import type { NewBatch } from './batch.ts';

/** What a cook sends to record a batch: the same options as a calculation, and the status. */
export interface RecordRequest {
  /** Formula id; the batch is calculated from the formula's current revision. */
  readonly formula: string;
  /** Batch options as strings with their units, as for /api/calc and `larder calc`. */
  readonly batch: RawBatchOptions;
  readonly units?: UnitSystem;
  /** Planned or in progress; an assembly done (its default on its day): see recordedStatus. */
  readonly status?: RecordStatus;
  readonly notes?: string;
}

/**
 * Calculates a batch on the server from the formula as it is now and turns it into what is
 * stored. A batch that fails any critical check (a cure over its nitrite ceiling, or pumped bacon
 * short of its required erythorbate) is refused here,
 * before anything is written.
 * An assembly's batch is its parts put together: their amounts are worked out from `library`,
 * and it is ready on its day.
 * @param today the recorder's today, YYYY-MM-DD: the start day when the request gives none, and
 *   the middle of the days a start may lie in (a year either side)
 * @param library every formula as it is now, by id: what an assembly's parts are made from
 * @throws AppError 400 for batch options that cannot make a batch (a start day out of range among
 *   them, an assembly with no count or a part that cannot be worked out), 400 'bad-status' for a
 *   status the batch cannot be recorded with; RecordsError 'critical-limit' when refused
 */
export function prepareBatch(
  current: Pick<CurrentFormula, 'formula' | 'revision'>,
  request: RecordRequest,
  operatorId: number,
  today: string,
  library?: FormulaLibrary,
): NewBatch {
  const { formula, revision } = current;
  const inputs: RawBatchOptions = { start: today, ...request.batch };
  const units = request.units ?? 'metric';
  const result = calculateBatch(formula, inputs, units, today, library);
  const startedOn = inputs.start ?? today;
  const recorded = recordedStatus(formula.kind, request.status, startedOn, today);
  if ('refusal' in recorded)
    throw new AppError(400, 'bad-status', recorded.refusal, [
      { field: 'status', message: recorded.refusal },
    ]);
  if (result.critical) {
    const failed = criticalFailures(result.checks);
    throw new RecordsError(
      'refused',
      'critical-limit',
      `the batch is refused and was not recorded: ${failed.map((check) => check.sentence).join('; ')}`,
      failed.map((check) => ({
        check: check.id,
        label: check.label,
        value: check.exact,
        limit: check.limit,
        rule: check.rule,
        source: check.source,
        sentence: check.sentence,
      })),
    );
  }
  const nitrite = result.checks.find((check) => check.id === 'nitrite-max');
  return {
    formula: { id: formula.id, revision, title: formula.title },
    kind: formula.kind,
    status: recorded.status,
    operatorId,
    startedOn,
    // An assembly is put together on its day: ready then.
    readyOn: result.schedule?.ready ?? (formula.kind === 'assembly' ? startedOn : null),
    units,
    inputs,
    result,
    checksPassed: !result.checks.some((check) => check.status === 'fail'),
    nitritePpm: formula.kind === 'cure' ? (nitrite?.exact ?? null) : null,
    notes: request.notes?.trim() || null,
  };
}
