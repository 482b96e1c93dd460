import type { Transaction } from 'sequelize';
import { sourceUseBy } from '../../shared/stock/source-use-by.ts';
import type { Database } from '../db/database.ts';
import { keptFormula } from '../formulas/formula-at-revision.ts';
import type { FormulaHistory } from '../formulas/formula-history.ts';
import { sourceRowsById, type SourceRow } from './lot-use-rows.ts';

/** A batch that may be drawn on, with its use-by or why it has none. */
export type DatedSource = SourceRow & {
  /** Why it has no use-by, in a cook's words; undefined when it has one. */
  readonly noUseBy?: string;
};

/**
 * Gives each batch its use-by (sourceUseBy), from its formula at the revision it was made from
 * (read from the formula history without writing, so inside a write too) and the day it was
 * marked done.
 */
export async function datedSources(
  history: FormulaHistory,
  rows: readonly SourceRow[],
): Promise<DatedSource[]> {
  const dated: DatedSource[] = [];
  for (const row of rows) {
    const formula = await keptFormula(history, row.formulaId, row.formulaRevision);
    const { useBy, none } = sourceUseBy(formula, row.finishedOn);
    dated.push({ ...row, ...(useBy ? { useBy } : {}), ...(none ? { noUseBy: none } : {}) });
  }
  return dated;
}

/** The batches of these ids, dated, by id. */
export async function datedSourcesById(
  db: Database,
  history: FormulaHistory,
  ids: readonly number[],
  t?: Transaction,
): Promise<Map<number, DatedSource>> {
  const dated = await datedSources(history, await sourceRowsById(db, ids, t));
  return new Map(dated.map((source) => [source.id, source]));
}
