import { Router, type Request } from 'express';
import type { LotUsesRequest } from '../../shared/api/batch-lots.ts';
import type { AppContext } from '../app-context.ts';
import { requireRole } from '../auth/authenticate.ts';
import { changeBy, siteOf } from '../auth/request-person.ts';
import { FormulaHistory } from '../formulas/formula-history.ts';
import { validateBody } from '../http/validate-body.ts';
import { RECORDING_ROLES } from '../records/records.ts';
import { batchLots, type LotUsesDeps } from './batch-lots.ts';
import { recordLotUses } from './record-lot-uses.ts';

const TEXT = { type: 'string', minLength: 1, maxLength: 60 } as const;

const LOTS_BODY = {
  type: 'object',
  additionalProperties: false,
  properties: {
    accept: { const: true },
    replace: { type: 'boolean' },
    picks: {
      type: 'array',
      minItems: 1,
      maxItems: 80,
      items: {
        oneOf: [
          {
            type: 'object',
            additionalProperties: false,
            required: ['item', 'lot', 'amount'],
            properties: { item: TEXT, lot: TEXT, amount: TEXT },
          },
          {
            type: 'object',
            additionalProperties: false,
            required: ['part', 'batch', 'amount'],
            properties: { part: TEXT, batch: TEXT, amount: TEXT },
          },
        ],
      },
    },
  },
} as const;

/**
 * /api/batches/:lot/lots: what a batch was made from. Every signed-in role reads; cooks and
 * admins record the lots used.
 */
export function lotUsesRouter(context: AppContext): Router {
  const router = Router();
  const deps: LotUsesDeps = {
    db: context.db,
    audit: context.audit,
    history: new FormulaHistory(context.formulas, context.db, context.audit),
    folder: context.formulas.folder,
  };
  router.get('/:lot/lots', async (req: Request, res) => {
    res.json(await batchLots({ ...deps, site: siteOf(req) }, String(req.params.lot)));
  });
  router.post(
    '/:lot/lots',
    requireRole(...RECORDING_ROLES),
    validateBody(LOTS_BODY),
    async (req: Request, res) => {
      const lots = await recordLotUses(
        { ...deps, site: siteOf(req) },
        String(req.params.lot),
        req.body as LotUsesRequest,
        changeBy(req, context),
      );
      res.status(201).json(lots);
    },
  );
  return router;
}
