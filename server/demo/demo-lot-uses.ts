import { QueryTypes } from 'sequelize';
import type { AppContext } from '../app-context.ts';
import { FormulaHistory } from '../formulas/formula-history.ts';
import { AppError } from '../http/app-error.ts';
import type { LotUsesDeps } from '../lot-uses/batch-lots.ts';
import { recordLotUses } from '../lot-uses/record-lot-uses.ts';
import { RecordsError } from '../records/records-error.ts';

/** Why a demo batch is passed over rather than given lots: nothing on hand, or not to be. */
const PASSED_OVER = new Set([
  'nothing-to-record',
  'lots-recorded',
  'not-started',
  'formula-unavailable',
]);

/**
 * Gives the demo kitchen's batches the lots they were made from, first to expire first, from
 * whatever lots were received: each batch under way or finished, the earliest started first (so
 * an earlier batch draws on the stock before a later one does), accepts its suggestion as a cook
 * would. A batch with nothing on hand for it is passed over. Demo history: no audit entries.
 * Call it after the demo's deliveries are seeded and before anything else draws on them.
 * @returns how many batches were given lots
 */
export async function seedDemoLotUses(context: AppContext): Promise<number> {
  const tobin = await context.people.findByUsername('tobin');
  if (!tobin) return 0;
  const deps: LotUsesDeps = {
    db: context.db,
    audit: context.audit,
    history: new FormulaHistory(context.formulas, context.db, context.audit),
    folder: context.formulas.folder,
  };
  const batches = await context.db.sequelize.query<{ lot_code: string; started_on: string }>(
    `SELECT lot_code, started_on FROM batches WHERE status <> 'planned'
     ORDER BY started_on, id`,
    { type: QueryTypes.SELECT },
  );
  let given = 0;
  for (const batch of batches) {
    try {
      await recordLotUses(
        deps,
        batch.lot_code,
        { accept: true },
        { actor: tobin, at: `${batch.started_on}T08:00:00Z`, audit: false },
      );
      given++;
    } catch (error) {
      const code =
        error instanceof AppError || error instanceof RecordsError ? error.code : undefined;
      if (code === undefined || !PASSED_OVER.has(code)) throw error;
    }
  }
  return given;
}
