import type { Request, RequestParamHandler, Response } from 'express';
import { AppError, badRequest } from '../http/app-error.ts';
import { isFormulaId } from '../../shared/index.ts';

/**
 * Formula YAML in a request body (schema for validateBody). Its size is not limited here: every
 * route refuses a text larger than a formula may be with 413 too-large (refuseOverLimit), in
 * bytes, as the command line does; the JSON body limit bounds what is read at all.
 */
export const YAML_TEXT = { type: 'string', minLength: 1 } as const;

/** A revision: the sha-256 of a formula text, in lower-case hex. */
export const REVISION = /^[0-9a-f]{64}$/;

/** Router.param handler: a formula id in a URL must be a well-formed id, or the answer is 400. */
export const checkIdParam: RequestParamHandler = (_req, _res, next, value: unknown) => {
  if (!isFormulaId(value)) {
    next(
      badRequest(
        'a formula id is 2 to 63 lower-case letters, digits and dashes, starting with a letter or digit',
        [{ field: 'id' }],
      ),
    );
    return;
  }
  next();
};

/** Router.param handler for a revision in a URL. */
export const checkRevisionParam: RequestParamHandler = (_req, _res, next, value: unknown) => {
  if (typeof value !== 'string' || !REVISION.test(value)) {
    next(
      badRequest('a revision is 64 hex digits (the ETag of the formula)', [{ field: 'revision' }]),
    );
    return;
  }
  next();
};

/** The route's formula id, already checked by checkIdParam. */
export function idOf(req: Request): string {
  return String(req.params.id);
}

/** Sends a formula's revision as its ETag (quoted, as HTTP wants it). */
export function setRevision(res: Response, revision: string): void {
  res.setHeader('ETag', `"${revision}"`);
  // Always ask again: a file can change on disk at any time.
  res.setHeader('Cache-Control', 'no-cache');
}

/**
 * The revision in the If-Match header ("REV", REV or W/"REV"), or undefined when there is none.
 * @throws AppError 428 for "*" (a change must name the revision it was made on)
 * @throws AppError 400 for a value that is not one revision
 */
export function ifMatchOf(req: Request): string | undefined {
  const header = req.get('if-match');
  if (header === undefined || header.trim() === '') return undefined;
  const value = header.trim();
  if (value === '*') throw preconditionRequired();
  const revision = value.replace(/^W\//, '').replace(/^"(.*)"$/, '$1');
  if (!REVISION.test(revision))
    throw badRequest('If-Match must hold one revision: the ETag from GET /api/formulas/ID', [
      { header: 'If-Match' },
    ]);
  return revision;
}

/**
 * The If-Match revision a change must carry.
 * @throws AppError 428 when it is missing
 */
export function requireIfMatch(req: Request): string {
  const revision = ifMatchOf(req);
  if (revision === undefined) throw preconditionRequired();
  return revision;
}

function preconditionRequired(): AppError {
  return new AppError(
    428,
    'precondition-required',
    'send If-Match with the revision you changed (the ETag of GET /api/formulas/ID), so no one else’s change is overwritten',
    [{ header: 'If-Match' }],
  );
}
