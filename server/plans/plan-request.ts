import type { RequestHandler } from 'express';
import {
  FORMULA_ID_PATTERN,
  FORMULA_REFUSALS,
  PlanError,
  formulaLibrary,
  planAssembly,
  type FormulaLibrary,
  type PlanResult,
} from '../../shared/index.ts';
import { filesById } from '../formulas/formula-files.ts';
import type { FormulaStore } from '../formulas/formula-store.ts';
import { AppError, badRequest, notFound } from '../http/app-error.ts';
import type { FormulaSite } from '../formulas/formula-site.ts';

/** What POST /api/plans and /api/plans/record take. */
export interface PlanRequest {
  /** The assembly's formula id. */
  readonly assembly: string;
  /** Units to serve. */
  readonly count: number;
  /** The day of service, YYYY-MM-DD. */
  readonly for: string;
  readonly units?: 'metric' | 'us';
}

/** The body of POST /api/plans and /api/plans/record. */
export const PLAN_BODY = {
  type: 'object',
  additionalProperties: false,
  required: ['assembly', 'count', 'for'],
  properties: {
    assembly: { type: 'string', pattern: FORMULA_ID_PATTERN },
    count: { type: 'integer', minimum: 1, maximum: 100000 },
    for: { type: 'string', pattern: '^\\d{4}-\\d{2}-\\d{2}$' },
    units: { enum: ['metric', 'us'] },
  },
} as const;

/**
 * GET /api/plans/pull-list's query as the body POST /api/plans takes, for the same schema to
 * check: a count of digits becomes a number; anything else is left for the schema to refuse.
 */
export const planFromQuery: RequestHandler = (req, _res, next) => {
  const { count, ...rest } = req.query as Record<string, string | undefined>;
  req.body = {
    ...Object.fromEntries(Object.entries(rest).filter(([, value]) => value !== undefined)),
    ...(count === undefined ? {} : { count: /^\d{1,6}$/.test(count) ? Number(count) : count }),
  };
  next();
};

/** The body of POST /api/plans/record: a plan, and `again` to record it although it was before. */
export const RECORD_BODY = {
  ...PLAN_BODY,
  properties: { ...PLAN_BODY.properties, again: { type: 'boolean' } },
} as const;

/**
 * A refused plan as the API answers it: 400 for a count or date that cannot be used, 422
 * 'critical-limit' for a batch over its limit (as POST /api/batches), 422 'plan-refused' for any
 * other reason (a start day already past, a missing or unfitting formula…), with the reason code
 * and the formula at fault in the details.
 */
export function planRefusal(error: PlanError): AppError {
  const details = [
    {
      reason: error.reason,
      formula: error.formula ?? null,
      formulaProblem: FORMULA_REFUSALS.includes(error.reason),
    },
  ];
  if (error.reason === 'bad-input') return badRequest(error.message, details);
  const code = error.reason === 'critical-limit' ? 'critical-limit' : 'plan-refused';
  return new AppError(422, code, error.message, details);
}

/**
 * Plans an assembly from the formulas folder as it is now (every file read fresh, assemblies
 * checked against the others).
 * @param today the day the plan is made, YYYY-MM-DD: nothing may start before it
 * @param at the site planning: it plans with the formulas it sees only (filesAtSite)
 * @throws AppError 404 no such formula; 422 'invalid-formula' when its file has errors,
 *   'not-an-assembly' for a batch formula, and see planRefusal for a plan that cannot be made
 */
export async function planFromStore(
  store: FormulaStore,
  request: PlanRequest,
  today: string,
  at?: FormulaSite,
): Promise<PlanResult> {
  return (await planWithFormulas(store, request, today, at)).plan;
}

/**
 * As {@link planFromStore}, with the formulas the plan was made from, by id (what the pull list
 * needs to link the plan's lines to the catalogue of materials).
 */
export async function planWithFormulas(
  store: FormulaStore,
  request: PlanRequest,
  today: string,
  at?: FormulaSite,
): Promise<{ plan: PlanResult; formulas: FormulaLibrary }> {
  const files = await store.files(at);
  const file = filesById(files).get(request.assembly);
  if (!file) throw notFound(`no formula "${request.assembly}"`);
  const formula = file.reading.formula;
  if (!formula) {
    throw new AppError(
      422,
      'invalid-formula',
      `the formula file ${file.name} has errors`,
      file.reading.problems,
    );
  }
  if (formula.kind !== 'assembly') {
    throw new AppError(
      422,
      'not-an-assembly',
      `${formula.id} is a ${formula.kind}, not an assembly: record a batch of it instead`,
    );
  }
  const library = formulaLibrary(files.map((f) => ({ file: f.name, reading: f.reading })));
  try {
    const plan = planAssembly(formula, library, {
      count: request.count,
      serviceDate: request.for,
      today,
    });
    return { plan, formulas: library };
  } catch (error) {
    if (error instanceof PlanError) throw planRefusal(error);
    throw error;
  }
}
