import type { RequestHandler } from 'express';
import { AppError } from './app-error.ts';

/**
 * Refuses a request body that is not JSON (415), rather than letting a route treat an unread
 * text or form body as empty. Uploads, which are multipart, are let through.
 */
export const requireJsonBody: RequestHandler = (req, _res, next) => {
  const hasBody =
    Number(req.headers['content-length'] ?? 0) > 0 ||
    req.headers['transfer-encoding'] !== undefined;
  if (!hasBody || req.is('application/json') || req.is('multipart/form-data')) return next();
  next(
    new AppError(
      415,
      'unsupported-media-type',
      'send the request body as JSON (Content-Type: application/json)',
    ),
  );
};

/**
 * Refuses query parameters a list does not know, or that are given twice, so a typo never
 * silently returns everything.
 */
export function allowQuery(...known: string[]): RequestHandler {
  return (req, _res, next) => {
    const problems = Object.entries(req.query).flatMap(([key, value]) =>
      !known.includes(key)
        ? [{ field: key, message: `is not a parameter here; use ${known.join(', ') || 'none'}` }]
        : Array.isArray(value) || typeof value === 'object'
          ? [{ field: key, message: 'must be given once' }]
          : [],
    );
    if (problems.length === 0) return next();
    next(
      new AppError(
        400,
        'bad-request',
        `the query is not valid: ${problems.map((p) => `${p.field} ${p.message}`).join('; ')}`,
        problems,
      ),
    );
  };
}
