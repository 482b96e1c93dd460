import type { Transaction } from 'sequelize';
import type { Formula, RawBatchOptions } from '../../shared/index.ts';
import type { Batch } from '../../shared/api/batch-record.ts';
import type { PlannedCalculation, StartRequest } from '../../shared/api/process-record.ts';
import { appendChange } from '../audit/append-change.ts';
import type { AuditRepository } from '../audit/audit-repository.ts';
import type { Database } from '../db/database.ts';
import { formulaAtRevision } from '../formulas/formula-at-revision.ts';
import type { FormulaHistory } from '../formulas/formula-history.ts';
import { conflict, notFound } from '../http/app-error.ts';
import { recordedBatch, type RecordedBatch } from '../process/recorded-batch.ts';
import { keepingRefusals } from '../process/refusals.ts';
import type { ChangeOptions, NewBatch } from './batch.ts';
import type { BatchRepository } from './batch-repository.ts';
import { prepareBatch } from './prepare-batch.ts';
import { dayWords } from '../../shared/presentation/date-words.ts';

/** What starting a batch works with. */
export interface StartDeps {
  readonly db: Database;
  readonly audit: AuditRepository;
  readonly history: FormulaHistory;
  readonly batches: BatchRepository;
}

/** A started batch, and what the cook should know about the start. */
export interface StartAnswer {
  readonly batch: Batch;
  readonly warnings: string[];
}

/**
 * The formula a planned batch is started on: the revision it was planned with, so that what was
 * planned (and perhaps reviewed) is what is made, only on the quantities really there. When the
 * file has changed since, the cook is told; when that revision is no longer kept at all, the
 * formula as it is now, with a warning.
 */
async function startFormula(
  history: FormulaHistory,
  batch: RecordedBatch,
): Promise<{ formula: Formula; revision: string; warnings: string[] }> {
  const planned = await formulaAtRevision(history, batch.formulaId, batch.formulaRevision);
  if (planned && planned.current) return { ...planned, warnings: [] };
  if (planned)
    return {
      ...planned,
      warnings: [
        'The formula has changed since this batch was planned. It was started on the formula as it was planned; to make it by the formula as it is now, discard this plan and record a new batch.',
      ],
    };
  const now = await history.current(batch.formulaId);
  return {
    formula: now.formula,
    revision: now.revision,
    warnings: [
      'The formula as it was when this batch was planned is no longer kept, so it was started on the formula as it is now.',
    ],
  };
}

/** Whole days from one ISO day to another. */
function daysBetween(from: string, to: string): number {
  return Math.round((Date.parse(to) - Date.parse(from)) / 86_400_000);
}

/** Words for a start on another day than planned; none when it is the planned day. */
function startDayWarning(planned: string, started: string, readyOn: string | null): string[] {
  const days = daysBetween(planned, started);
  if (days === 0) return [];
  const span = `${Math.abs(days)} day${Math.abs(days) === 1 ? '' : 's'}`;
  const ready = readyOn ? ` It is now ready on ${dayWords(readyOn)}.` : '';
  const when = days > 0 ? 'later' : 'earlier';
  return [
    `Started on ${dayWords(started)}, ${span} ${when} than planned (${dayWords(planned)}).${ready}`,
  ];
}

/**
 * Starts a planned batch on what is really there: the batch is calculated again from the request's
 * options (the green weight, thickness or heaviest piece, the start day, today when not given) on
 * the formula revision it was planned with. Over a critical limit it is refused (422
 * 'critical-limit') and the refusal recorded. Otherwise the batch keeps its lot code and carries
 * the new calculation; the planned one is kept beside it (planned_calculation), with who planned
 * and who started it, a status event and a 'batch-start' audit entry, in one write.
 * @throws RecordsError 'critical-limit'; AppError 404, 409 'not-planned', the workflow rules'
 */
export async function startBatch(
  lot: string,
  request: StartRequest,
  today: string,
  deps: StartDeps,
  by: ChangeOptions,
): Promise<StartAnswer> {
  const seen = await recordedBatch(deps.db, lot);
  if (seen.status !== 'planned')
    throw conflict(
      'not-planned',
      `batch ${seen.lotCode} is ${seen.status}: only a planned batch is started`,
    );
  const { formula, revision, warnings } = await startFormula(deps.history, seen);
  const library = formula.kind === 'assembly' ? await deps.history.library(by.formulas) : undefined;
  const inputs: RawBatchOptions = { start: today, ...request.batch };
  const started = await keepingRefusals(
    deps,
    { formula: seen.formulaId, revision, inputs, lotCode: seen.lotCode },
    by,
    () =>
      prepareBatch(
        { formula, revision },
        { formula: seen.formulaId, batch: inputs, units: seen.result.units, status: 'in-progress' },
        seen.operatorId,
        today,
        library,
      ),
  );
  warnings.push(...startDayWarning(seen.startedOn, started.startedOn, started.readyOn));
  const batch = await deps.db.write(async (t) => {
    const current = await recordedBatch(deps.db, seen.lotCode, t);
    if (current.status !== 'planned' || current.formulaRevision !== seen.formulaRevision)
      throw conflict('batch-changed', `batch ${seen.lotCode} changed meanwhile; start it again`);
    await deps.batches.writes.mayMove(t, seen.lotCode, 'in-progress', null, by);
    await writeStart(deps.db, t, current, started, by);
    await deps.batches.writes.event(t, current.id, by.at ?? new Date().toISOString(), by, {
      type: 'status',
      from: 'planned',
      to: 'in-progress',
      reason: startReason(current, started),
    });
    await appendChange(deps.audit, t, by, 'batch-start', current.lotCode, {
      revision: started.formula.revision,
      plannedRevision: current.formulaRevision,
      inputs: started.inputs,
      plannedInputs: current.inputs,
      ...(started.nitritePpm === null
        ? {}
        : { nitritePpm: started.nitritePpm, plannedNitritePpm: current.nitritePpm }),
      ...(warnings.length ? { warnings } : {}),
    });
    const read = await deps.batches.get(current.lotCode, t);
    if (!read) throw notFound(`no batch with lot code ${current.lotCode}`);
    return read;
  });
  return { batch, warnings };
}

/** The batch event's words: what the start changed. */
function startReason(planned: RecordedBatch, started: NewBatch): string {
  const keys = Object.keys({ ...planned.inputs, ...started.inputs }) as (keyof RawBatchOptions)[];
  const changed = keys
    .filter((key) => planned.inputs[key] !== started.inputs[key])
    .map((key) => `${key} ${planned.inputs[key] ?? '—'} → ${started.inputs[key] ?? '—'}`);
  return changed.length
    ? `started on what was really there: ${changed.join(', ')}`
    : 'started as planned';
}

async function writeStart(
  db: Database,
  t: Transaction,
  planned: RecordedBatch,
  started: NewBatch,
  by: ChangeOptions,
): Promise<void> {
  const at = by.at ?? new Date().toISOString();
  const kept: PlannedCalculation = {
    revision: planned.formulaRevision,
    startedOn: planned.startedOn,
    readyOn: planned.readyOn,
    inputs: planned.inputs,
    nitritePpm: planned.nitritePpm,
    checksPassed: planned.checksPassed,
    result: planned.result,
  };
  await db.sequelize.query(
    `UPDATE batches SET status = 'in-progress', formula_revision = ?, started_on = ?, ready_on = ?,
       inputs = ?, result = ?, checks_passed = ?, nitrite_ppm = ?, planned_calculation = ?,
       planned_by = COALESCE(planned_by, operator_id), started_by = ?, started_at = ?, updated_at = ?
     WHERE id = ? AND planned_calculation IS NULL`,
    {
      replacements: [
        started.formula.revision,
        started.startedOn,
        started.readyOn,
        JSON.stringify(started.inputs),
        JSON.stringify(started.result),
        started.checksPassed ? 1 : 0,
        started.nitritePpm,
        JSON.stringify(kept),
        by.actor.id,
        at,
        at,
        planned.id,
      ],
      transaction: t,
    },
  );
}
