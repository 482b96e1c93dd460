import { Ajv2020, type ErrorObject } from 'ajv/dist/2020.js';
import type { RequestHandler } from 'express';
import { AppError } from './app-error.ts';

// One ajv instance for request bodies; each route's schema is compiled once, when the route is built.
const ajv = new Ajv2020({ allErrors: true, strict: true });

function describe(error: ErrorObject): { field: string; message: string } {
  const field = error.instancePath.slice(1).replace(/\//g, '.') || '(body)';
  if (error.keyword === 'additionalProperties') {
    return { field, message: `unknown field "${String(error.params.additionalProperty)}"` };
  }
  if (error.keyword === 'required')
    return { field, message: `"${String(error.params.missingProperty)}" is missing` };
  return { field, message: error.message ?? 'is not valid' };
}

/** Checks a JSON body against a schema before the handler runs; 400 lists every field at fault. */
export function validateBody(schema: object): RequestHandler {
  const validate = ajv.compile(schema);
  return (req, _res, next) => {
    if (validate(req.body)) return next();
    const details = (validate.errors ?? []).map(describe);
    next(
      new AppError(
        400,
        'bad-request',
        `the request body is not valid: ${details.map((d) => `${d.field} ${d.message}`).join('; ')}`,
        details,
      ),
    );
  };
}
