import { Router, type Request } from 'express';
import type { AppContext } from '../app-context.ts';
import { requireRole } from '../auth/authenticate.ts';
import { changeBy } from '../auth/request-person.ts';
import { BATCH_OPTIONS_SCHEMA } from '../calc/calc-request.ts';
import { validateBody } from '../http/validate-body.ts';
import { RECORDING_ROLES, type StartRequest } from '../records/records.ts';
import { serverToday } from '../server-today.ts';

const START_BODY = {
  type: 'object',
  additionalProperties: false,
  required: ['batch'],
  properties: { batch: BATCH_OPTIONS_SCHEMA },
} as const;

/**
 * POST /api/batches/:lot/start: a planned batch started on what is really there, by those who
 * record batches. 200 with the batch and warnings; 422 'critical-limit' when refused.
 */
export function startRouter(context: AppContext): Router {
  const router = Router();
  router.post(
    '/:lot/start',
    requireRole(...RECORDING_ROLES),
    validateBody(START_BODY),
    async (req: Request, res) => {
      const answer = await context.records.startBatch(
        String(req.params.lot),
        req.body as StartRequest,
        serverToday(context),
        changeBy(req, context),
      );
      res.json(answer);
    },
  );
  return router;
}
