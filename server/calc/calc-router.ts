import { Router, type RequestHandler } from 'express';
import { FORMULA_ID_PATTERN, type RawBatchOptions, type UnitSystem } from '../../shared/index.ts';
import type { AppContext } from '../app-context.ts';
import { YAML_TEXT } from '../formulas/formula-http.ts';
import { sendJsonAnswer, sendJsonBytes } from '../http/json-answer.ts';
import { validateBody } from '../http/validate-body.ts';
import { serverToday } from '../server-today.ts';
import {
  BATCH_OPTIONS_SCHEMA,
  UNITS_SCHEMA,
  calculateBatch,
  formulaFromText,
} from './calc-request.ts';
import { calcAnswerKeyText } from './calc-answers.ts';
import { formulaSiteOf } from '../formulas/formula-site.ts';

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
 * An answer for a formula by id is kept (context.calcAnswers) under the formula file's revision,
 * the batch, the units and today, and sent again as it was for the same ones; the person is
 * still signed in and checked on every request before this route. Formulas sent inline are
 * worked out each time: each edit in the console's editor is a new text, seldom asked twice.
 */
export function calcHandlers(context: AppContext): RequestHandler[] {
  const answers = context.calcAnswers;
  const calculate: RequestHandler = async (req, res) => {
    const body = req.body as CalcBody;
    const units = body.units ?? 'metric';
    const today = serverToday(context);
    const at = formulaSiteOf(req);
    if (typeof body.formula !== 'string') {
      const formula = formulaFromText(body.formula.yaml, 'inline formula');
      const library = formula.kind === 'assembly' ? await context.formulas.library(at) : undefined;
      sendJsonAnswer(res, calculateBatch(formula, body.batch, units, today, library));
      return;
    }
    // At once while the folder is unchanged, as it nearly always is; else read first.
    const { formula, file } =
      context.formulas.currentNow(body.formula, at) ??
      (await context.formulas.current(body.formula, at));
    const library =
      formula.kind === 'assembly' ? await context.formulas.libraryWithRevision(at) : undefined;
    const key = calcAnswerKeyText({
      file: file.name,
      revision: file.revision,
      libraryRevision: library?.revision ?? '',
      units,
      today,
      batch: body.batch,
    });
    const kept = answers.get(key);
    if (kept) return sendJsonBytes(res, kept);
    // Thrown refusals (400, 404, 422) leave before this line: only a 200 answer is kept.
    const answer = Buffer.from(
      JSON.stringify(calculateBatch(formula, body.batch, units, today, library?.library)),
    );
    answers.set(key, answer);
    sendJsonBytes(res, answer);
  };
  return [validateBody(CALC_BODY), calculate];
}

/** The calculation route under its mount (/api/calc), for any spelling the direct route leaves. */
export function calcRouter(handlers: readonly RequestHandler[]): Router {
  return Router().post('/', ...handlers);
}
