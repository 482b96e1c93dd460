import type { RequestHandler } from 'express';
import { AppError } from './app-error.ts';

/** Where a parsed JSON value holds a NUL character (in a string, key or value), or undefined. */
function nulAt(body: unknown): string | undefined {
  // A loop, not recursion: half a megabyte of nested brackets must not overflow the stack.
  const pending: [string, unknown][] = [['(body)', body]];
  for (let next = pending.pop(); next; next = pending.pop()) {
    const [where, value] = next;
    if (typeof value === 'string') {
      if (value.includes('\0')) return where;
    } else if (value !== null && typeof value === 'object') {
      for (const [key, item] of Object.entries(value)) {
        const field = where === '(body)' ? key : `${where}.${key}`;
        if (key.includes('\0')) return field;
        pending.push([field, item]);
      }
    }
  }
  return undefined;
}

/**
 * Refuses a request body that is not JSON (415), rather than letting a route treat an unread
 * text or form body as empty. Uploads, which are multipart, are let through. Text holding a NUL
 * character (JSON's \u0000) is refused with 400: no field of ours can hold one, and SQLite would
 * cut a statement short at it.
 */
export const requireJsonBody: RequestHandler = (req, _res, next) => {
  const hasBody =
    Number(req.headers['content-length'] ?? 0) > 0 ||
    req.headers['transfer-encoding'] !== undefined;
  // Asked once: each req.is parses the Content-Type header again.
  const json = Boolean(req.is('application/json'));
  const nul = json ? nulAt(req.body) : undefined;
  if (nul !== undefined)
    return next(
      new AppError(400, 'bad-request', `${nul} holds a NUL character (U+0000); delete it`, [
        { field: nul },
      ]),
    );
  // A string body was read as text by a route's own parser (a logger's CSV, server/app.ts).
  if (!hasBody || json || req.is('multipart/form-data')) return next();
  if (typeof req.body === 'string' && req.is('text/csv')) return next();
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
