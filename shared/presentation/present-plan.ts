import { allergenName } from '../calculation/allergens.ts';
import type { AppliedPart, PlanBatch, PlanResult } from '../calculation/plan/plan-types.ts';
import type { UnitSystem } from '../units/scale-amount.ts';
import { formatMass } from './format-figure.ts';
import { presentResult, roundingNote } from './present-result.ts';
import type { PresentedPlan } from './presented-plan.ts';

/** The parts applied to one batch: every batch that goes on it, with the day it goes on. */
function partsOn(batches: readonly PlanBatch[], id: string): AppliedPart[] {
  return batches.flatMap((batch) =>
    (batch.goesOn ?? [])
      .filter((on) => on.formula.id === id)
      .map((on) => ({
        formula: { id: batch.formula.id, title: batch.formula.title },
        date: on.date,
      })),
  );
}

/**
 * Rounds and formats a plan for printing or JSON: each batch's result as presentResult gives it,
 * with the parts it goes on and the parts that go on it, the pull list rounded as a batch sheet
 * rounds (exact grams beside every amount).
 */
export function presentPlan(plan: PlanResult, system: UnitSystem): PresentedPlan {
  return {
    assembly: plan.assembly,
    count: plan.count,
    serviceDate: plan.serviceDate,
    today: plan.today,
    units: system,
    batches: plan.batches.map((batch) => {
      const gets = partsOn(plan.batches, batch.formula.id);
      return {
        formula: batch.formula,
        purposes: batch.purposes,
        batch: batch.batch,
        start: batch.start,
        ready: batch.ready,
        holdDays: batch.holdDays,
        leadDays: batch.leadDays,
        rule: batch.rule,
        ...(batch.goesOn ? { goesOn: batch.goesOn } : {}),
        ...(gets.length ? { gets } : {}),
        result: presentResult(batch.result, system),
      };
    }),
    days: plan.days.map((day) => ({
      date: day.date,
      formulas: day.batches.map((batch) => batch.formula.id),
    })),
    pullList: plan.pullList.map((item) => ({
      name: item.name,
      amount: formatMass(item.grams, system),
      grams: item.grams.toString(),
      ...(item.beforeTrimGrams
        ? {
            beforeTrim: {
              amount: formatMass(item.beforeTrimGrams, system),
              grams: item.beforeTrimGrams.toString(),
            },
          }
        : {}),
      usedBy: item.usedBy,
    })),
    allergens: plan.allergens.map(allergenName),
    cautions: plan.cautions,
    warnings: plan.warnings,
    rounding: `${roundingNote(system)} The pull list is rounded the same way; weigh from each batch's sheet.`,
  };
}
