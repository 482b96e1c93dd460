import { QueryTypes, type Transaction } from 'sequelize';
import { BatchError, type Formula } from '../../shared/index.ts';
import { AppError } from '../http/app-error.ts';
import type { Deviation, Weighing } from '../../shared/api/process-record.ts';
import { checkProblem } from '../../shared/presentation/check-figures.ts';
import { formatPpm } from '../../shared/presentation/format-figure.ts';
import type { PumpReached } from '../../shared/process/weighing-stages.ts';
import type { ResolvedControl } from '../../shared/process/control-types.ts';
import { resolveControl } from '../../shared/process/resolve-control.ts';
import { judgeWeights, type WeightsVerdict } from '../../shared/process/weights-as-weighed.ts';
import type { AuditRepository } from '../audit/audit-repository.ts';
import type { ChangeOptions } from '../batches/batch.ts';
import type { Database } from '../db/database.ts';
import { openDeviation, type DeviationToOpen } from './deviation-writes.ts';
import type { RecordedBatch } from './recorded-batch.ts';
import { standingWeighings, standingWeights } from './weighing-rows.ts';

/** What the standing weights of a batch say, and the deviations they opened just now. */
export interface WeightsOutcome {
  readonly verdict: WeightsVerdict;
  readonly deviations: Deviation[];
  /** In a cook's words, deviations first: the figure, the limit, what to do. */
  readonly messages: string[];
}

/**
 * The weights judged; weights that cannot be so (a pumped weight not above the green weight) are
 * refused with the core's words, naming the stage weight.
 */
function judged(
  formula: Formula,
  batch: RecordedBatch,
  weighings: readonly Weighing[],
): WeightsVerdict {
  try {
    return judgeWeights(formula, batch.result, standingWeights(weighings));
  } catch (error) {
    if (!(error instanceof BatchError)) throw error;
    throw new AppError(422, 'bad-weighing', error.message, [
      { field: 'stage.weight', message: error.message },
    ]);
  }
}

/**
 * The formula's controls whose rule relies on a least ingoing nitrite (the cured cooling option
 * of FSIS Appendix B) that the weights as weighed fall short of: the formula's own figure is
 * checked by `larder check`, but only the weights say what this batch really took.
 */
function coolingNeedingNitrite(formula: Formula, verdict: WeightsVerdict): ResolvedControl[] {
  const ppm = verdict.actualNitritePpm;
  if (!ppm) return [];
  return (formula.controls ?? [])
    .map(resolveControl)
    .filter(
      (control) => control.minNitritePpm !== undefined && ppm.lessThan(control.minNitritePpm),
    );
}

/** A percent as a cook reads it beside its target: one decimal, more when one would not tell. */
function pumpFigure(pump: PumpReached): string {
  const shown = pump.percent.toDecimalPlaces(1);
  const figure = shown.greaterThan(pump.targetPct) ? shown.toFixed(1) : pump.percent.toFixed(3);
  return `${figure} %`;
}

/** The words of a pump over its target, as the deviation and the answer say them. */
export function pumpWords(pump: PumpReached): string {
  return `Pumped to ${pumpFigure(pump)}, target ${pump.targetPct.toString()} %: drain and re-weigh, or divert.`;
}

/**
 * Judges a batch's standing weighings against its calculation inside the caller's write, and
 * opens a deviation for each critical check the actual weights fail ('nitrite', once per check
 * and figure) and for a pumped weight over its target ('pump', once per pumped weighing). Never
 * refuses: what was weighed is recorded, and a deviation holds the batch.
 */
export async function judgeWeighings(
  deps: { db: Database; audit: AuditRepository },
  t: Transaction,
  batch: RecordedBatch,
  formula: Formula,
  weighings: readonly Weighing[],
  by: ChangeOptions,
): Promise<WeightsOutcome> {
  const verdict = judged(formula, batch, weighings);
  const opened: Deviation[] = [];
  const messages: string[] = [];
  const [person] = await deps.db.sequelize.query<{ display_name: string }>(
    'SELECT display_name FROM people WHERE id = ?',
    { replacements: [by.actor.id], type: QueryTypes.SELECT, transaction: t },
  );
  const openedBy = { id: by.actor.id, displayName: person?.display_name ?? by.actor.username };
  const open = async (deviation: Omit<DeviationToOpen, 'batchId' | 'subject' | 'control'>) => {
    const full = { ...deviation, batchId: batch.id, subject: batch.lotCode, control: null };
    const id = await openDeviation(deps.db, deps.audit, t, full, by);
    messages.push(
      id === null
        ? `${deviation.what} (a deviation is already open for it).`
        : `${deviation.what} A deviation is open: the batch is held until a corrective action is recorded.`,
    );
    if (id !== null)
      opened.push({
        id,
        control: null,
        kind: deviation.kind,
        what: deviation.what,
        openedAt: by.at ?? new Date().toISOString(),
        openedBy,
        action: null,
        earlierActions: [],
      });
  };
  for (const check of verdict.failed)
    await open({
      kind: 'nitrite',
      what: `On the weights as weighed, ${checkProblem(check)}.`,
      key: `batch ${batch.id}/nitrite/${check.id} ${check.value.toString()}`,
    });
  for (const control of coolingNeedingNitrite(formula, verdict))
    await open({
      kind: 'nitrite',
      what:
        `${control.title} relies on at least ${control.minNitritePpm} ppm ingoing sodium nitrite; ` +
        `the weights as weighed give ${formatPpm(verdict.actualNitritePpm!)}. Cool this batch by a ` +
        `rule made for uncured product, or hold it for review.`,
      key: `batch ${batch.id}/min-nitrite/${control.id} ${verdict.actualNitritePpm!.toString()}`,
    });
  const pumped = standingWeighings(weighings).find(
    (w) => w.kind === 'stage' && w.name === 'pumped',
  );
  if (verdict.pump?.over && pumped)
    await open({
      kind: 'pump',
      what: pumpWords(verdict.pump),
      key: `batch ${batch.id}/pump/weighing ${pumped.id}`,
    });
  if (verdict.actualNitritePpm && verdict.failed.length === 0) {
    const limit = verdict.checks.find((check) => check.id === 'nitrite-max')?.limit;
    messages.push(
      `Ingoing sodium nitrite on the weights as weighed: ${formatPpm(verdict.actualNitritePpm)}${limit ? `, within ${limit.toString()} ppm` : ''}.`,
    );
  }
  return { verdict, deviations: opened, messages };
}
