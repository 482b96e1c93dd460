import type { FormulaKind } from './batch-types';

/** A formula's kind as a batch page, its sheet and the batch log name it. */
export const FORMULA_KIND_WORDS: Readonly<Record<FormulaKind, string>> = {
  cure: 'Cure',
  dough: 'Dough',
  blend: 'Blend',
  mix: 'Mix',
  assembly: 'Assembly',
};
