import { readFormula } from '../../shared/formula/read-formula.ts';
import type { ResolvedControl } from '../../shared/process/control-types.ts';
import { resolveControl } from '../../shared/process/resolve-control.ts';
import type { FormulaHistory } from '../formulas/formula-history.ts';

/** The most revisions whose controls are kept in memory; a kitchen uses a few dozen. */
const CACHED = 500;

/**
 * The process controls of the formula revision a batch was recorded with: the controls a batch
 * is held to never change after it is recorded, even when the formula file does. A revision's
 * text never changes (it is its own sha-256), so its resolved controls are kept once read.
 */
export class FormulaControls {
  private readonly cache = new Map<string, readonly ResolvedControl[]>();

  /** @param history the formulas' history, which the weights' records read revisions from too */
  constructor(readonly history: FormulaHistory) {}

  /** The resolved controls of one revision, in the formula's order; none when it has none. */
  async of(formulaId: string, revision: string): Promise<readonly ResolvedControl[]> {
    const key = `${formulaId}@${revision}`;
    const cached = this.cache.get(key);
    if (cached) return cached;
    const stored = await this.history.find(formulaId, revision);
    // A batch is recorded only from a revision the history holds; none means no controls known.
    const formula = stored ? readFormula(stored.yaml, `${formulaId}.yaml`).formula : undefined;
    const controls = (formula?.controls ?? []).map(resolveControl);
    if (this.cache.size >= CACHED) this.cache.delete(this.cache.keys().next().value as string);
    this.cache.set(key, controls);
    return controls;
  }
}
