import { randomBytes, timingSafeEqual } from 'node:crypto';
import type { RequestHandler } from 'express';
import { AppError } from '../http/app-error.ts';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/** A fresh token for a session. */
export function newCsrfToken(): string {
  return randomBytes(32).toString('base64url');
}

/**
 * Cross-site request forgery guard for cookie sign-ins: every state-changing request must echo
 * the session's token in X-CSRF-Token (a page on another site cannot read it). Basic-auth
 * requests carry no cookie, so they cannot be forged this way and are let through.
 */
export const requireCsrfToken: RequestHandler = (req, _res, next) => {
  if (SAFE_METHODS.has(req.method) || req.authVia !== 'session') return next();
  const expected = req.session.csrfToken;
  const given = req.get('x-csrf-token');
  const ok =
    expected !== undefined &&
    given !== undefined &&
    given.length === expected.length &&
    timingSafeEqual(Buffer.from(given), Buffer.from(expected));
  if (!ok)
    return next(
      new AppError(403, 'csrf', 'missing or wrong X-CSRF-Token header; reload the console'),
    );
  next();
};
