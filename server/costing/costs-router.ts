import { Router, type Request } from 'express';
import type { AppContext } from '../app-context.ts';
import { requireRole } from '../auth/authenticate.ts';
import { siteOf } from '../auth/request-person.ts';
import { filesById } from '../formulas/formula-files.ts';
import { badRequest, notFound } from '../http/app-error.ts';
import { planFromStore } from '../plans/plan-request.ts';
import { serverToday } from '../server-today.ts';
import type {
  BatchCostRecord,
  FormulaCosts,
  PlanCostRecord,
} from '../../shared/api/cost-record.ts';
import { planCost } from '../../shared/costing/batch-cost.ts';
import type { Decimal } from '../../shared/decimal.ts';
import type { Formula } from '../../shared/formula/formula-types.ts';
import { isFormulaId } from '../../shared/formula/formula-id.ts';
import { presentResult } from '../../shared/presentation/present-result.ts';
import { parseMass } from '../../shared/units/mass.ts';
import { BatchCosting } from './batch-costing.ts';
import { catalogueNow } from './catalogue-now.ts';
import { batchCostRecord, money } from './cost-records.ts';
import { COST_POINTS, CostRepository } from './cost-repository.ts';
import { COST_ROLES } from './cost-roles.ts';
import { formulaSiteOf } from '../formulas/formula-site.ts';

const DAY = /^\d{4}-\d{2}-\d{2}$/;

/** A query parameter given once, as text. */
function queryText(value: unknown, name: string): string | undefined {
  if (value === undefined) return undefined;
  if (typeof value !== 'string') throw badRequest(`give ${name} once, as text`);
  return value;
}

/** ?portion=150 g: a portion of the finished product. */
function portionOf(value: unknown): Decimal | undefined {
  const text = queryText(value, 'portion');
  if (text === undefined) return undefined;
  let grams: Decimal;
  try {
    grams = parseMass(text);
  } catch (error) {
    throw badRequest(`the portion is not a weight: ${(error as Error).message}`);
  }
  if (!grams.greaterThan(0)) throw badRequest('a portion must weigh more than 0 g');
  return grams;
}

/** ?count=120: units served, 1 to 100 000. */
function countOf(value: unknown): number | undefined {
  const text = queryText(value, 'count');
  if (text === undefined) return undefined;
  const count = /^\d{1,6}$/.test(text) ? Number(text) : Number.NaN;
  if (!(count >= 1 && count <= 100_000))
    throw badRequest('count is a whole number from 1 to 100000');
  return count;
}

/** The count a plan's batches were recorded for: "plan: smokehouse-burger ×120 for …". */
function recordedCount(notes: string | null): number | undefined {
  const match = /^plan: \S+ ×(\d+) for /.exec(notes ?? '');
  return match ? Number(match[1]) : undefined;
}

/**
 * Costs: a batch's (GET /api/batches/:lot/cost), a plan's for a service
 * (GET /api/plans/:assembly/:serviceDate/cost) and a formula's cost per finished kilogram over
 * its batches (GET /api/formulas/:id/costs). Admins and reviewers only (cost-roles.ts).
 */
export function costsRouter(context: AppContext): Router {
  const everywhere = new CostRepository(context.db);
  // The costs of the request's site: its batches, its deliveries' prices.
  const atSite = (req: Request): CostRepository => everywhere.at(siteOf(req));
  const router = Router();
  router.use(
    ['/batches/:lot/cost', '/plans/:assembly/:day/cost', '/formulas/:id/costs'],
    requireRole(...COST_ROLES),
  );

  /** A costing for one request: the catalogue and formulas as they are now. */
  async function costing(repo: CostRepository, req: Request): Promise<BatchCosting> {
    const files = await context.formulas.files(formulaSiteOf(req));
    const formulas = new Map<string, Formula>();
    for (const [id, file] of filesById(files))
      if (file.reading.formula) formulas.set(id, file.reading.formula);
    return new BatchCosting(repo, await catalogueNow(context.formulas.folder), formulas);
  }

  router.get('/batches/:lot/cost', async (req, res) => {
    const repo = atSite(req);
    const portion = portionOf(req.query.portion);
    const row = await repo.batch(req.params.lot);
    if (!row) throw notFound(`no batch with lot code ${req.params.lot}`);
    const cost = await (await costing(repo, req)).ofBatch(row, portion);
    res.json(batchCostRecord(cost, row.lot_code, { id: row.formula_id, title: row.formula_title }));
  });

  // One point a batch: each batch used its own lots at their own prices, and a kitchen makes few
  // batches of one formula in a week, so a weekly mean would hide the batch made from a dear lot.
  router.get('/formulas/:id/costs', async (req, res) => {
    const repo = atSite(req);
    const id = req.params.id;
    if (!isFormulaId(id)) throw notFound(`no formula "${id}"`);
    const rows = await repo.formulaBatches(id);
    const shown = rows.slice(0, COST_POINTS).reverse();
    const costs = await costing(repo, req);
    const points = [];
    for (const row of shown) {
      const cost = await costs.ofBatch(row);
      const perKg = money(cost.perFinishedKg);
      points.push({
        lot: row.lot_code,
        day: row.started_on,
        perFinishedKg: perKg.exact,
        perFinishedKgText: perKg.text,
        complete: cost.complete,
      });
    }
    res.json({ formula: id, points, truncated: rows.length > COST_POINTS } satisfies FormulaCosts);
  });

  router.get('/plans/:assembly/:day/cost', async (req, res) => {
    const repo = atSite(req);
    const { assembly, day } = req.params;
    if (!isFormulaId(assembly) || !DAY.test(day))
      throw badRequest('a plan is named by its menu item and day of service, YYYY-MM-DD');
    const asked = countOf(req.query.count);
    const rows = await repo.planBatches(assembly, day);
    const costs = await costing(repo, req);
    let batches: BatchCostRecord[];
    let totals;
    const count = asked ?? recordedCount(rows[0]?.notes ?? null);
    if (rows.length > 0) {
      const each = await Promise.all(rows.map((row) => costs.ofBatch(row)));
      batches = each.map((cost, i) =>
        batchCostRecord(cost, rows[i].lot_code, {
          id: rows[i].formula_id,
          title: rows[i].formula_title,
        }),
      );
      totals = planCost(each, count ?? 1);
    } else {
      if (count === undefined)
        throw notFound(
          `no batches are recorded for ${assembly} on ${day}; give a count to price the plan`,
        );
      const today = serverToday(context);
      const plan = await planFromStore(
        context.formulas,
        { assembly, count, for: day },
        today,
        formulaSiteOf(req),
      );
      const each = await Promise.all(
        plan.batches.map((batch) =>
          costs.ofPlanned(presentResult(batch.result, 'metric'), batch.formula.id, today),
        ),
      );
      batches = each.map((cost, i) => batchCostRecord(cost, null, plan.batches[i].formula));
      totals = planCost(each, count);
    }
    const perUnit = count === undefined ? money(null) : money(totals.perUnit);
    res.json({
      assembly,
      serviceDate: day,
      count: count ?? null,
      recorded: rows.length > 0,
      batches,
      total: totals.total.toString(),
      totalText: money(totals.total).text ?? '',
      complete: totals.complete,
      perUnit: perUnit.exact,
      perUnitText: perUnit.text,
    } satisfies PlanCostRecord);
  });

  return router;
}
