import { Router } from 'express';
import type { AppContext } from '../app-context.ts';
import { requireRole } from '../auth/authenticate.ts';
import { siteOf } from '../auth/request-person.ts';
import { AppError, badRequest } from '../http/app-error.ts';
import { validateBody } from '../http/validate-body.ts';
import { serverToday } from '../server-today.ts';
import type { BlendTrims } from '../../shared/api/cost-record.ts';
import { leastCostAnswer } from '../../shared/costing/least-cost-answer.ts';
import { type TrimOnHand, leastCostBlend } from '../../shared/costing/least-cost-blend.ts';
import { Decimal } from '../../shared/decimal.ts';
import { FAT_STANDARDS, type FatStandardKey } from '../../shared/reference/fat-standards.ts';
import { parseMass } from '../../shared/units/mass.ts';
import { stockTrims } from './blend-stock.ts';
import { CostRepository } from './cost-repository.ts';
import { COST_ROLES } from './cost-roles.ts';

/** The body of POST /api/blends/least-cost. */
const LEAST_COST_BODY = {
  type: 'object',
  additionalProperties: false,
  required: ['target', 'batch'],
  properties: {
    /** Fat wanted, % by weight. */
    target: { type: 'number', minimum: 0, maximum: 100 },
    /** The batch's weight: "50 kg", "110 lb". */
    batch: { type: 'string', minLength: 1, maxLength: 40 },
    standard: { enum: Object.keys(FAT_STANDARDS) },
    /** Trims typed in; without them, the trims on hand in stock. */
    trims: {
      type: 'array',
      minItems: 1,
      maxItems: 20,
      items: {
        type: 'object',
        additionalProperties: false,
        required: ['name', 'fat', 'price', 'onHand'],
        properties: {
          name: { type: 'string', minLength: 1, maxLength: 80 },
          fat: { type: 'number', minimum: 0, maximum: 100 },
          /** Price per kilogram. */
          price: { type: 'number', minimum: 0, maximum: 1_000_000 },
          onHand: { type: 'string', minLength: 1, maxLength: 40 },
          fatAsSuch: { type: 'boolean' },
        },
      },
    },
  },
} as const;

interface LeastCostRequest {
  target: number;
  batch: string;
  standard?: FatStandardKey;
  trims?: { name: string; fat: number; price: number; onHand: string; fatAsSuch?: boolean }[];
}

/** A weight typed in, or 400 saying which. */
function grams(text: string, what: string): Decimal {
  try {
    return parseMass(text);
  } catch (error) {
    throw badRequest(`${what} is not a weight: ${(error as Error).message}`);
  }
}

/**
 * /api/blends: the trims on hand (GET /trims) and the least-cost blend of them to a target fat
 * (POST /least-cost), from stock or from trims typed in. An ask that cannot be met is 422
 * 'blend-refused' with the reason in words. Admins and reviewers, as costs (cost-roles.ts).
 */
export function blendsRouter(context: AppContext): Router {
  const repo = new CostRepository(context.db);
  const router = Router();
  router.use(requireRole(...COST_ROLES));

  router.get('/trims', async (req, res) => {
    const trims = await stockTrims(
      repo.at(siteOf(req)),
      context.formulas.folder,
      serverToday(context),
    );
    res.json({ trims } satisfies BlendTrims);
  });

  router.post('/least-cost', validateBody(LEAST_COST_BODY), async (req, res) => {
    const request = req.body as LeastCostRequest;
    const batchGrams = grams(request.batch, 'the batch');
    if (!batchGrams.greaterThan(0)) throw badRequest('the batch must weigh more than 0 g');
    const trims: TrimOnHand[] = request.trims
      ? request.trims.map((trim) => ({
          name: trim.name,
          fatPercent: new Decimal(String(trim.fat)),
          pricePerKg: new Decimal(String(trim.price)),
          availableGrams: grams(trim.onHand, `what is on hand of ${trim.name}`),
          ...(trim.fatAsSuch ? { fatAsSuch: true } : {}),
        }))
      : (
          await stockTrims(repo.at(siteOf(req)), context.formulas.folder, serverToday(context))
        ).flatMap((trim) =>
          trim.pricePerKg === null
            ? []
            : [
                {
                  name: trim.name,
                  fatPercent: new Decimal(trim.fat),
                  pricePerKg: new Decimal(trim.pricePerKg),
                  availableGrams: new Decimal(trim.onHandGrams),
                  ...(trim.fatAsSuch ? { fatAsSuch: true } : {}),
                },
              ],
        );
    if (trims.length === 0) {
      throw new AppError(
        422,
        'blend-refused',
        'There are no trims on hand with a fat and a price to blend.',
        [{ reason: 'no-trims' }],
      );
    }
    const blend = leastCostBlend({
      trims,
      targetFatPercent: new Decimal(String(request.target)),
      batchGrams,
      ...(request.standard ? { standard: request.standard } : {}),
    });
    if (!blend.ok)
      throw new AppError(422, 'blend-refused', blend.message, [{ reason: blend.refusal }]);
    res.json(
      leastCostAnswer(blend, {
        targetFatPercent: new Decimal(String(request.target)),
        batchGrams,
        ...(request.standard ? { standard: request.standard } : {}),
      }),
    );
  });

  return router;
}
