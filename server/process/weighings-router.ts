import { Router, type Request } from 'express';
import type { AppContext } from '../app-context.ts';
import { requireRole } from '../auth/authenticate.ts';
import { changeBy } from '../auth/request-person.ts';
import { notFound } from '../http/app-error.ts';
import { validateBody } from '../http/validate-body.ts';
import type { Role } from '../../shared/api/person.ts';
import type { WeighingRequest } from '../../shared/api/process-record.ts';
import { STAGE_NAMES } from '../../shared/process/weighing-stages.ts';
import type { WeighingCorrection } from '../records/records.ts';

/** Who records weights as weighed: the people at the bench and the reviewer checking them. */
export const WEIGHING_ROLES: readonly Role[] = ['admin', 'cook', 'reviewer'];

const WEIGHT = { type: 'string', minLength: 1, maxLength: 60 } as const;

const WEIGHINGS_BODY = {
  type: 'object',
  additionalProperties: false,
  properties: {
    lines: {
      type: 'array',
      minItems: 1,
      maxItems: 60,
      items: {
        type: 'object',
        additionalProperties: false,
        required: ['name', 'weight'],
        properties: { name: { type: 'string', minLength: 1, maxLength: 200 }, weight: WEIGHT },
      },
    },
    stage: {
      type: 'object',
      additionalProperties: false,
      required: ['name', 'weight'],
      properties: {
        name: { enum: STAGE_NAMES },
        weight: WEIGHT,
        at: { type: 'string', minLength: 1, maxLength: 40 },
      },
    },
  },
} as const;

const CORRECTION_BODY = {
  type: 'object',
  additionalProperties: false,
  required: ['weight', 'reason'],
  properties: {
    weight: WEIGHT,
    reason: { type: 'string', minLength: 1, maxLength: 500, pattern: '\\S' },
  },
} as const;

/** POST /api/batches/:lot/weighings: lines and a stage weight as weighed. */
export function batchWeighingsRouter(context: AppContext): Router {
  const router = Router();
  router.post(
    '/:lot/weighings',
    requireRole(...WEIGHING_ROLES),
    validateBody(WEIGHINGS_BODY),
    async (req: Request, res) => {
      const answer = await context.records.addWeighings(
        String(req.params.lot),
        req.body as WeighingRequest,
        changeBy(req, context),
      );
      res.status(201).json(answer);
    },
  );
  return router;
}

/** POST /api/weighings/:id/correction: a weighing corrected by a new one, the old kept. */
export function weighingsRouter(context: AppContext): Router {
  const router = Router();
  router.post(
    '/:id/correction',
    requireRole(...WEIGHING_ROLES),
    validateBody(CORRECTION_BODY),
    async (req: Request, res) => {
      const id = String(req.params.id);
      if (!/^[1-9]\d{0,15}$/.test(id)) throw notFound(`no weighing ${id}`);
      const answer = await context.records.correctWeighing(
        Number(id),
        req.body as WeighingCorrection,
        changeBy(req, context),
      );
      res.status(201).json(answer);
    },
  );
  return router;
}
