import { readFormula, type Formula } from '../../shared/index.ts';
import type { FormulaHistory } from './formula-history.ts';

/** A formula as it was at one revision, and whether that is still its revision on disk. */
export interface FormulaAt {
  readonly formula: Formula;
  readonly revision: string;
  /** The file on disk is still this revision. */
  readonly current: boolean;
}

/**
 * The formula a batch was calculated from: its text at that revision from the formula's history,
 * or the file on disk when it is still that revision. Undefined when neither has it (a revision
 * never noted, whose file has since changed).
 */
export async function formulaAtRevision(
  history: FormulaHistory,
  id: string,
  revision: string,
): Promise<FormulaAt | undefined> {
  const now = await history.current(id).catch(() => undefined);
  if (now?.revision === revision) return { formula: now.formula, revision, current: true };
  const kept = await history.find(id, revision);
  const formula = kept ? readFormula(kept.yaml, `${id}.yaml`).formula : undefined;
  return formula ? { formula, revision, current: false } : undefined;
}
