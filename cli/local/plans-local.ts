import path from 'node:path';
import type { PlanResult, UnitSystem } from '../../shared/index.ts';
import { AuditRepository } from '../../server/audit/audit-repository.ts';
import type { Batch } from '../../shared/api/batch-record.ts';
import { BatchRepository } from '../../server/batches/batch-repository.ts';
import { FormulaHistory } from '../../server/formulas/formula-history.ts';
import { FormulaStore } from '../../server/formulas/formula-store.ts';
import { recordPlan } from '../../server/plans/record-plan.ts';
import { operatorFromEnvironment } from './batch-operator.ts';
import { asCliError } from './batches-local.ts';
import { withLocalDatabase } from './local-database.ts';

/**
 * Records every batch of a plan as planned in this machine's database, all or nothing, exactly
 * as POST /api/plans/record does on a server: each formula's current revision joins its history.
 * @param folder the formulas folder the plan was read from
 */
export function recordPlanLocally(
  plan: PlanResult,
  folder: string,
  units: UnitSystem,
): Promise<Batch[]> {
  return withLocalDatabase(async (db, config) => {
    const operator = await operatorFromEnvironment(db, ['admin', 'cook']);
    const audit = new AuditRepository(db);
    const history = new FormulaHistory(new FormulaStore(path.resolve(folder)), db, audit);
    try {
      return await recordPlan(
        plan,
        units,
        operator.id,
        { history, batches: new BatchRepository(db, audit, config.workflow) },
        { actor: operator },
      );
    } catch (error) {
      throw asCliError(error);
    }
  });
}
