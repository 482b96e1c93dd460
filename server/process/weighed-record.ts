import { QueryTypes, type Transaction } from 'sequelize';
import { BatchError, type PresentedResult } from '../../shared/index.ts';
import type {
  PlannedCalculation,
  ProcessRecord,
  Weighing,
} from '../../shared/api/process-record.ts';
import { judgeWeights } from '../../shared/process/weights-as-weighed.ts';
import type { Database } from '../db/database.ts';
import { keptFormula } from '../formulas/formula-at-revision.ts';
import type { FormulaHistory } from '../formulas/formula-history.ts';
import { standingWeighings, standingWeights } from './weighing-rows.ts';

/** The weights' part of a process record. */
export type WeighedPart = Pick<ProcessRecord, 'actualNitritePpm' | 'actualYields' | 'planned'>;

interface Row {
  formula_id: string;
  formula_revision: string;
  result: string;
  planned_calculation: string | null;
}

/**
 * What a batch's weighings say, for its process record: the ingoing nitrite on the actual
 * weights, the actual yields beside the formula's, and the calculation it was planned with when
 * it has been started since. Reads only, so it may run inside a write transaction.
 */
export async function weighedPart(
  db: Database,
  history: FormulaHistory,
  batchId: number,
  weighings: readonly Weighing[],
  t?: Transaction,
): Promise<WeighedPart> {
  const [row] = await db.sequelize.query<Row>(
    'SELECT formula_id, formula_revision, result, planned_calculation FROM batches WHERE id = ?',
    { replacements: [batchId], type: QueryTypes.SELECT, ...(t ? { transaction: t } : {}) },
  );
  const planned = row?.planned_calculation
    ? (JSON.parse(row.planned_calculation) as PlannedCalculation)
    : null;
  const standing = standingWeighings(weighings);
  const formula =
    row && standing.length
      ? await keptFormula(history, row.formula_id, row.formula_revision)
      : undefined;
  if (!row || !formula) return { actualNitritePpm: null, actualYields: [], planned };
  let verdict;
  try {
    verdict = judgeWeights(
      formula,
      JSON.parse(row.result) as PresentedResult,
      standingWeights(weighings),
    );
  } catch (error) {
    // Weights the core cannot judge were refused when weighed; none stand to be judged here.
    if (error instanceof BatchError) return { actualNitritePpm: null, actualYields: [], planned };
    throw error;
  }
  return {
    actualNitritePpm: verdict.actualNitritePpm?.toString() ?? null,
    actualYields: [...verdict.yields],
    planned,
  };
}
