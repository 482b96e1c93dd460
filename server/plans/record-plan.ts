import type { PlanResult, UnitSystem } from '../../shared/index.ts';
import { dayWords } from '../../shared/presentation/date-words.ts';
import type { Batch } from '../../shared/api/batch-record.ts';
import type { PlanAlreadyRecorded } from '../../shared/api/plan-record.ts';
import type { ChangeOptions } from '../batches/batch.ts';
import type { BatchRepository } from '../batches/batch-repository.ts';
import { prepareBatch } from '../batches/prepare-batch.ts';
import type { FormulaHistory } from '../formulas/formula-history.ts';
import { AppError } from '../http/app-error.ts';
import type { PlanRepository } from './plan-repository.ts';

/** The note every batch of a plan is recorded with: "plan: smokehouse-burger ×120 for 2026-12-18". */
export function planNote(plan: PlanResult): string {
  return `plan: ${plan.assembly.id} ×${plan.count} for ${plan.serviceDate}`;
}

/**
 * Records every batch of a plan as a 'planned' batch starting on its start day, and the menu
 * item's own batch (the count, put together from those batches) planned for the day of service,
 * so that a trace forward from any lot reaches the day it was served. Always: a plan is made for
 * a service, and the service is what a recall must find. Through the same path as POST
 * /api/batches: each formula's current revision (noted in its history first), then
 * prepareBatch, which calculates the batch again and refuses it over a critical limit; then all
 * of them in one write transaction, so either every batch is recorded or none is.
 * Batches already recorded from a plan for the same menu item and day of service (any count, not
 * discarded) refuse it, in that same write, unless `again` says the cook means to record more.
 * @returns the recorded batches, earliest start first: the menu item's own last
 * @throws AppError 409 'plan-already-recorded' with {@link PlanAlreadyRecorded} as its detail
 */
export async function recordPlan(
  plan: PlanResult,
  units: UnitSystem,
  operatorId: number,
  deps: { history: FormulaHistory; batches: BatchRepository; plans: PlanRepository },
  options: ChangeOptions & { readonly again?: boolean },
): Promise<Batch[]> {
  const { history, batches, plans } = deps;
  const notes = planNote(plan);
  const prepared = [];
  for (const batch of plan.batches) {
    const current = await history.current(batch.formula.id, options.formulas);
    prepared.push(
      prepareBatch(
        current,
        { formula: batch.formula.id, batch: batch.batch, units, status: 'planned', notes },
        operatorId,
        plan.today,
      ),
    );
  }
  const assembly = await history.current(plan.assembly.id, options.formulas);
  prepared.push(
    prepareBatch(
      assembly,
      {
        formula: plan.assembly.id,
        batch: { count: String(plan.count), start: plan.serviceDate },
        units,
        status: 'planned',
        notes,
      },
      operatorId,
      plan.today,
      await history.library(options.formulas),
    ),
  );
  const again = options.again === true;
  return batches.recordAll(prepared, options, {
    before: async (t) => {
      if (again) return;
      const already = await plans.batchesOf(plan.assembly.id, plan.serviceDate, t, options.site);
      if (already.length > 0) throw alreadyRecorded(plan, already);
    },
    after: (t, recorded) =>
      plans.recorded(
        t,
        plan,
        recorded.map((b) => b.lotCode),
        again,
        options,
      ),
  });
}

function alreadyRecorded(plan: PlanResult, batches: PlanAlreadyRecorded['batches']): AppError {
  const detail: PlanAlreadyRecorded = {
    assembly: plan.assembly.id,
    serviceDate: plan.serviceDate,
    batches,
  };
  const n = batches.length;
  return new AppError(
    409,
    'plan-already-recorded',
    `${n} ${n === 1 ? 'batch is' : 'batches are'} already recorded for ${plan.assembly.title} on ${dayWords(plan.serviceDate)}: record again only to make more`,
    [detail],
  );
}
