import { Router } from 'express';
import { presentPlan } from '../../shared/index.ts';
import type { AppContext } from '../app-context.ts';
import { requireRole } from '../auth/authenticate.ts';
import { changeBy, siteOf } from '../auth/request-person.ts';
import { validateBody } from '../http/validate-body.ts';
import { RECORDING_ROLES, planSheetPdf } from '../records/records.ts';
import { serverToday } from '../server-today.ts';
import type { PlanList } from '../../shared/api/plan-record.ts';
import { sendPdf } from '../http/send-pdf.ts';
import { allowQuery } from '../http/require-json.ts';
import type { PlanWithStock } from '../../shared/api/plan-record.ts';
import {
  PLAN_BODY,
  RECORD_BODY,
  planFromQuery,
  planFromStore,
  planWithFormulas,
  type PlanRequest,
} from './plan-request.ts';
import { catalogueBeside } from './plan-stock-check.ts';
import { formulaSiteOf } from '../formulas/formula-site.ts';

/**
 * /api/plans: the plans made (every signed-in role), plan N units of an assembly for a service
 * day with its pull list against the lots on hand (every signed-in role; GET /pull-list the same
 * without noting the plan as made), and record the plan's batches as planned (admins and cooks). A plan
 * that cannot be made is 422 with the reason, naming the formula; nothing is recorded. A plan
 * whose menu item and day already have batches recorded is 409 with those batches, unless the
 * body says `again: true`.
 */
export function plansRouter(context: AppContext): Router {
  const { formulas, records } = context;
  const router = Router();

  // The plans made, newest first, recorded or not.
  router.get('/', async (req, res) => {
    res.json({ plans: await records.listPlans(siteOf(req)) } satisfies PlanList);
  });

  // A plan worked out is noted as made (once per menu item, count and day), for the list; it
  // comes with its pull list against the lots on hand.
  router.post('/', validateBody(PLAN_BODY), async (req, res) => {
    const request = req.body as PlanRequest;
    const { plan, formulas: library } = await planWithFormulas(
      formulas,
      request,
      serverToday(context),
      formulaSiteOf(req),
    );
    await records.planMade(plan, changeBy(req, context));
    const units = request.units ?? 'metric';
    const stock = await records.planStock(
      plan,
      library,
      await catalogueBeside(formulas.folder),
      units,
      siteOf(req),
    );
    res.json({ ...presentPlan(plan, units), stock } satisfies PlanWithStock);
  });

  // The same plan and its pull list against the lots on hand, read only: nothing is noted.
  router.get(
    '/pull-list',
    allowQuery('assembly', 'count', 'for', 'units'),
    planFromQuery,
    validateBody(PLAN_BODY),
    async (req, res) => {
      const request = req.body as PlanRequest;
      const { plan, formulas: library } = await planWithFormulas(
        formulas,
        request,
        serverToday(context),
        formulaSiteOf(req),
      );
      const units = request.units ?? 'metric';
      const catalogue = await catalogueBeside(formulas.folder);
      res.json({
        ...presentPlan(plan, units),
        stock: await records.planStock(plan, library, catalogue, units, siteOf(req)),
      } satisfies PlanWithStock);
    },
  );

  // The plan on paper: an overview, then one production sheet per start day.
  router.post('/sheet.pdf', validateBody(PLAN_BODY), async (req, res) => {
    const request = req.body as PlanRequest;
    const plan = presentPlan(
      await planFromStore(formulas, request, serverToday(context), formulaSiteOf(req)),
      request.units ?? 'metric',
    );
    // pdfkit loads on the first sheet, not at start.
    const pdf = await planSheetPdf(plan);
    sendPdf(res, pdf, `plan-${plan.assembly.id}-${plan.serviceDate}.pdf`);
  });

  router.post(
    '/record',
    requireRole(...RECORDING_ROLES),
    validateBody(RECORD_BODY),
    async (req, res) => {
      const { again, ...request } = req.body as PlanRequest & { again?: boolean };
      const plan = await planFromStore(formulas, request, serverToday(context), formulaSiteOf(req));
      const units = request.units ?? 'metric';
      const recorded = await records.recordPlan(plan, units, {
        ...changeBy(req, context),
        again: again === true,
      });
      res.status(201).json({ plan: presentPlan(plan, units), batches: recorded });
    },
  );

  return router;
}
