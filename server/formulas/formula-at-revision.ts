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

/** Formulas read from kept revisions: a revision's text never changes (it is its own sha-256). */
const kept = new Map<string, Formula | null>();

/** The most kept revisions held read; a kitchen uses a few dozen. */
const KEPT = 500;

/**
 * The formula at a revision the history keeps, read without writing anything (so it may be
 * called inside a write transaction); undefined when the history does not keep it.
 */
export async function keptFormula(
  history: FormulaHistory,
  id: string,
  revision: string,
): Promise<Formula | undefined> {
  const key = `${id}@${revision}`;
  if (!kept.has(key)) {
    const stored = await history.find(id, revision);
    const formula = stored ? readFormula(stored.yaml, `${id}.yaml`).formula : undefined;
    if (kept.size >= KEPT) kept.delete(kept.keys().next().value as string);
    // A revision not kept yet may be noted later: only what was found is remembered.
    if (!formula) return undefined;
    kept.set(key, formula);
  }
  return kept.get(key) ?? undefined;
}
