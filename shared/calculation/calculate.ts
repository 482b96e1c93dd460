import type { Formula } from '../formula/formula-types.ts';
import { CAUTIONS } from '../reference/cautions.ts';
import { calculateAssembly } from './assembly/calculate-assembly.ts';
import { calculateBlend } from './blend/calculate-blend.ts';
import type { BatchInput } from './batch-input.ts';
import type { CalcResult, Caution } from './calc-result.ts';
import { calculateCure } from './cure/calculate-cure.ts';
import { calculateDough } from './dough/calculate-dough.ts';
import { calculateMix } from './mix/calculate-mix.ts';
import type { FormulaLibrary } from './plan/check-assembly-library.ts';

function byKind(formula: Formula, batch: BatchInput, library: FormulaLibrary): CalcResult {
  switch (formula.kind) {
    case 'cure':
      return calculateCure(formula, batch);
    case 'dough':
      return calculateDough(formula, batch);
    case 'blend':
      return calculateBlend(formula, batch);
    case 'mix':
      return calculateMix(formula, batch);
    case 'assembly':
      return calculateAssembly(formula, library, batch);
  }
}

/**
 * Calculates one batch of any formula. The formula's own cautions are printed with the standard
 * ones, before the reminder that local codes come first.
 * @param library the formulas an assembly's parts are made from, by id (only an assembly needs it)
 * @throws BatchError when the batch input cannot make a batch, or an assembly's parts cannot be
 *   worked out from the library
 */
export function calculate(
  formula: Formula,
  batch: BatchInput,
  library: FormulaLibrary = new Map(),
): CalcResult {
  const result = byKind(formula, batch, library);
  const own: Caution[] = (formula.cautions ?? []).map((text, i) => ({
    id: `formula-${i + 1}`,
    text,
    source: 'this formula',
  }));
  const standard = result.cautions.filter((caution) => caution.id !== CAUTIONS.localCodes.id);
  return { ...result, cautions: [...standard, ...own, CAUTIONS.localCodes] };
}
