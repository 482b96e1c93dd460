import { Router } from 'express';
import { FORMULA_ID_PATTERN, type RawBatchOptions, type UnitSystem } from '../../shared/index.ts';
import type { AppContext } from '../app-context.ts';
import { YAML_TEXT } from '../formulas/formula-http.ts';
import { sendJsonAnswer } from '../http/json-answer.ts';
import { validateBody } from '../http/validate-body.ts';
import { serverToday } from '../server-today.ts';
import {
  BATCH_OPTIONS_SCHEMA,
  UNITS_SCHEMA,
  calculateBatch,
  formulaFromText,
} from './calc-request.ts';

const CALC_BODY = {
  type: 'object',
  additionalProperties: false,
  required: ['formula', 'batch'],
  properties: {
    formula: {
      oneOf: [
        { type: 'string', pattern: FORMULA_ID_PATTERN },
        {
          type: 'object',
          additionalProperties: false,
          required: ['yaml'],
          properties: { yaml: YAML_TEXT },
        },
      ],
    },
    batch: BATCH_OPTIONS_SCHEMA,
    units: UNITS_SCHEMA,
  },
} as const;

interface CalcBody {
  formula: string | { yaml: string };
  batch: RawBatchOptions;
  units?: UnitSystem;
}

/**
 * POST /api/calc: a stateless calculation of any formula (by id, or YAML sent inline) — the same
 * JSON `larder calc --json` prints. A refused batch comes back with critical: true and no amounts.
 */
export function calcRouter(context: AppContext): Router {
  const router = Router();
  router.post('/', validateBody(CALC_BODY), async (req, res) => {
    const body = req.body as CalcBody;
    const formula =
      typeof body.formula === 'string'
        ? (await context.formulas.current(body.formula)).formula
        : formulaFromText(body.formula.yaml, 'inline formula');
    const library = formula.kind === 'assembly' ? await context.formulas.library() : undefined;
    sendJsonAnswer(
      res,
      calculateBatch(formula, body.batch, body.units ?? 'metric', serverToday(context), library),
    );
  });
  return router;
}
