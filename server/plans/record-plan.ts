import type { PlanResult, UnitSystem } from '../../shared/index.ts';
import type { Batch } from '../../shared/api/batch-record.ts';
import type { ChangeOptions } from '../batches/batch.ts';
import type { BatchRepository } from '../batches/batch-repository.ts';
import { prepareBatch } from '../batches/prepare-batch.ts';
import type { FormulaHistory } from '../formulas/formula-history.ts';

/** The note every batch of a plan is recorded with: "plan: smokehouse-burger ×120 for 2026-12-18". */
export function planNote(plan: PlanResult): string {
  return `plan: ${plan.assembly.id} ×${plan.count} for ${plan.serviceDate}`;
}

/**
 * Records every batch of a plan as a 'planned' batch starting on its start day, through the same
 * path as POST /api/batches: each formula's current revision (noted in its history first), then
 * prepareBatch, which calculates the batch again and refuses it over a critical limit; then all
 * of them in one write transaction, so either every batch is recorded or none is.
 * @returns the recorded batches, earliest start first
 */
export async function recordPlan(
  plan: PlanResult,
  units: UnitSystem,
  operatorId: number,
  { history, batches }: { history: FormulaHistory; batches: BatchRepository },
  options: ChangeOptions,
): Promise<Batch[]> {
  const notes = planNote(plan);
  const prepared = [];
  for (const batch of plan.batches) {
    const current = await history.current(batch.formula.id);
    prepared.push(
      prepareBatch(
        current,
        { formula: batch.formula.id, batch: batch.batch, units, status: 'planned', notes },
        operatorId,
        plan.today,
      ),
    );
  }
  return batches.recordAll(prepared, options);
}
