import type { Formula } from '../formula/formula-types.ts';
import { CAUTIONS } from '../reference/cautions.ts';
import { calculateBlend } from './blend/calculate-blend.ts';
import { assemblyIsPlanned } from './batch-error.ts';
import type { BatchInput } from './batch-input.ts';
import type { CalcResult, Caution } from './calc-result.ts';
import { calculateCure } from './cure/calculate-cure.ts';
import { calculateDough } from './dough/calculate-dough.ts';
import { calculateMix } from './mix/calculate-mix.ts';

function byKind(formula: Formula, batch: BatchInput): CalcResult {
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
      throw assemblyIsPlanned(formula.id);
  }
}

/**
 * Calculates one batch of any formula. The formula's own cautions are printed with the standard
 * ones, before the reminder that local codes come first.
 * @throws BatchError when the batch input cannot make a batch, or the formula is an assembly
 *   (planned with planAssembly, not calculated)
 */
export function calculate(formula: Formula, batch: BatchInput): CalcResult {
  const result = byKind(formula, batch);
  const own: Caution[] = (formula.cautions ?? []).map((text, i) => ({
    id: `formula-${i + 1}`,
    text,
    source: 'this formula',
  }));
  const standard = result.cautions.filter((caution) => caution.id !== CAUTIONS.localCodes.id);
  return { ...result, cautions: [...standard, ...own, CAUTIONS.localCodes] };
}
