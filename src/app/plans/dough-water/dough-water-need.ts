import type { PresentedPlanBatch } from '../plan-types';

/** The label of the dough's water temperature among a result's figures (the core's). */
const WATER = 'Water temperature';

/**
 * Whether a batch of a plan is a dough whose water temperature could not be worked out: it has a
 * desired dough temperature but no water temperature, for want of the room and flour (and
 * preferment) temperatures, which no plan knows days ahead.
 */
export function needsDoughTemperatures(batch: PresentedPlanBatch): boolean {
  const result = batch.result;
  return (
    batch.formula.kind === 'dough' &&
    result.inputs.some((row) => row.label === 'Desired dough temperature') &&
    !result.figures.some((figure) => figure.label === WATER)
  );
}

/** Whether the dough is made with a preferment (a sponge, a poolish): its temperature counts too. */
export function hasPreferment(batch: PresentedPlanBatch): boolean {
  return batch.result.groups.some((group) => /^preferment\b/i.test(group.title));
}

/**
 * The figures of a worked-out dough that say how warm its liquids go in: the liquid and water
 * temperatures, other liquids to bring to it, and any ice.
 */
export function waterFigures(
  figures: PresentedPlanBatch['result']['figures'],
): PresentedPlanBatch['result']['figures'] {
  return figures.filter((figure) => /temperature|^bring |\bice\b/i.test(figure.label));
}

/**
 * Whether a plan's warning is the one about a batch's water temperature: the core prefixes each
 * batch's warnings with its formula's title.
 */
export function isWaterWarning(warning: string, formulaTitle: string): boolean {
  return warning.startsWith(`${formulaTitle}:`) && /water temperature/i.test(warning);
}
