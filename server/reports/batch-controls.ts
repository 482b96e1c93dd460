import type { Sequelize } from 'sequelize';
import { readFormula } from '../../shared/formula/read-formula.ts';
import type { FormulaControl, ResolvedControl } from '../../shared/process/control-types.ts';
import { resolveControl } from '../../shared/process/resolve-control.ts';
import { readRow } from '../db/read-row.ts';

/** The controls of the formula revision a batch was made from. */
export type BatchControls = (
  formulaId: string,
  revision: string,
) => Promise<readonly ResolvedControl[]>;

/**
 * The controls of a batch's formula as it was when the batch was made: the revision's text is
 * kept in formula_revisions, so a formula changed since does not change an old batch's limits.
 * Each revision is read once per report.
 */
export function revisionControls(sequelize: Sequelize): BatchControls {
  const cache = new Map<string, Promise<readonly ResolvedControl[]>>();
  return (formulaId, revision) => {
    const key = `${formulaId}@${revision}`;
    let controls = cache.get(key);
    if (!controls) {
      controls = (async () => {
        const row = await readRow<{ yaml: string }>(
          sequelize,
          'SELECT yaml FROM formula_revisions WHERE formula_id = ? AND revision = ? ORDER BY id DESC LIMIT 1',
          [formulaId, revision],
        );
        if (!row) return [];
        const formula = readFormula(row.yaml, `${formulaId}.yaml`).formula as
          { controls?: FormulaControl[] } | undefined;
        return (formula?.controls ?? []).map(resolveControl);
      })();
      cache.set(key, controls);
    }
    return controls;
  };
}
