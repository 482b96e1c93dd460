import { Router } from 'express';
import { presentPlan } from '../../shared/index.ts';
import type { AppContext } from '../app-context.ts';
import { requireRole } from '../auth/authenticate.ts';
import { changeBy } from '../auth/request-person.ts';
import { validateBody } from '../http/validate-body.ts';
import { RECORDING_ROLES, planSheetPdf } from '../records/records.ts';
import { serverToday } from '../server-today.ts';
import { PLAN_BODY, planFromStore, type PlanRequest } from './plan-request.ts';

/**
 * /api/plans: plan N units of an assembly for a service day (every signed-in role), and record
 * the plan's batches as planned (admins and cooks). A plan that cannot be made is 422 with the
 * reason, naming the formula; nothing is recorded.
 */
export function plansRouter(context: AppContext): Router {
  const { formulas, records } = context;
  const router = Router();

  router.post('/', validateBody(PLAN_BODY), async (req, res) => {
    const request = req.body as PlanRequest;
    const plan = await planFromStore(formulas, request, serverToday(context));
    res.json(presentPlan(plan, request.units ?? 'metric'));
  });

  // The plan on paper: an overview, then one production sheet per start day.
  router.post('/sheet.pdf', validateBody(PLAN_BODY), async (req, res) => {
    const request = req.body as PlanRequest;
    const plan = presentPlan(
      await planFromStore(formulas, request, serverToday(context)),
      request.units ?? 'metric',
    );
    // pdfkit loads on the first sheet, not at start.
    const pdf = await planSheetPdf(plan);
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader(
      'Content-Disposition',
      `attachment; filename="plan-${plan.assembly.id}-${plan.serviceDate}.pdf"`,
    );
    res.setHeader('Cache-Control', 'no-store');
    res.send(pdf);
  });

  router.post(
    '/record',
    requireRole(...RECORDING_ROLES),
    validateBody(PLAN_BODY),
    async (req, res) => {
      const request = req.body as PlanRequest;
      const plan = await planFromStore(formulas, request, serverToday(context));
      const units = request.units ?? 'metric';
      const recorded = await records.recordPlan(plan, units, changeBy(req, context));
      res.status(201).json({ plan: presentPlan(plan, units), batches: recorded });
    },
  );

  return router;
}
