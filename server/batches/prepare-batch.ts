import { criticalFailures, type RawBatchOptions, type UnitSystem } from '../../shared/index.ts';
import { calculateBatch } from '../calc/calc-request.ts';
import type { CurrentFormula } from '../formulas/formula-store.ts';
import { RecordsError } from '../records/records-error.ts';
import type { RECORD_STATUSES } from '../../shared/workflow/batch-status.ts';
import type { NewBatch } from './batch.ts';

/** What a cook sends to record a batch: the same options as a calculation, and the status. */
export interface RecordRequest {
  /** Formula id; the batch is calculated from the formula's current revision. */
  readonly formula: string;
  /** Batch options as strings with their units, as for /api/calc and `larder calc`. */
  readonly batch: RawBatchOptions;
  readonly units?: UnitSystem;
  readonly status?: (typeof RECORD_STATUSES)[number];
  readonly notes?: string;
}

/**
 * Calculates a batch on the server from the formula as it is now and turns it into what is
 * stored. A batch that fails any critical check (a cure over its nitrite ceiling, or pumped bacon
 * short of its required erythorbate) is refused here,
 * before anything is written.
 * @param today the recorder's today, YYYY-MM-DD: the start day when the request gives none, and
 *   the middle of the days a start may lie in (a year either side)
 * @throws AppError 400 for batch options that cannot make a batch (a start day out of range among
 *   them); RecordsError 'critical-limit' when refused
 */
export function prepareBatch(
  current: Pick<CurrentFormula, 'formula' | 'revision'>,
  request: RecordRequest,
  operatorId: number,
  today: string,
): NewBatch {
  const { formula, revision } = current;
  const inputs: RawBatchOptions = { start: today, ...request.batch };
  const units = request.units ?? 'metric';
  const result = calculateBatch(formula, inputs, units, today);
  // calculateBatch has refused an assembly already (400): it is planned, never one batch.
  if (formula.kind === 'assembly') throw new Error('an assembly is not a batch');
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
    status: request.status ?? 'in-progress',
    operatorId,
    startedOn: inputs.start ?? today,
    readyOn: result.schedule?.ready ?? null,
    units,
    inputs,
    result,
    checksPassed: !result.checks.some((check) => check.status === 'fail'),
    nitritePpm: formula.kind === 'cure' ? (nitrite?.exact ?? null) : null,
    notes: request.notes?.trim() || null,
  };
}
