import { randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler } from 'express';
import { AppError } from '../http/app-error.ts';
import { changesState } from '../http/changes-state.ts';

/** A fresh token for a session. */
export function newCsrfToken(): string {
  return randomBytes(32).toString('base64url');
}

/**
 * Whether a request shows its session's CSRF token in X-CSRF-Token. Compared as UTF-8 bytes in
 * constant time: a header may hold any characters, and a token as long as the real one in
 * characters can still differ in bytes.
 */
export function showsCsrfToken(req: Request): boolean {
  const expected = req.session?.csrfToken;
  const given = req.get('x-csrf-token');
  if (expected === undefined || given === undefined) return false;
  const givenBytes = Buffer.from(given, 'utf8');
  const expectedBytes = Buffer.from(expected, 'utf8');
  return givenBytes.length === expectedBytes.length && timingSafeEqual(givenBytes, expectedBytes);
}

/** The answer to a cookie-signed change without its session's token. */
export function wrongCsrfToken(): AppError {
  return new AppError(403, 'csrf', 'missing or wrong X-CSRF-Token header; reload the console');
}

/**
 * Cross-site request forgery guard for cookie sign-ins: every state-changing request must echo
 * the session's token in X-CSRF-Token (a page on another site cannot read it). Basic-auth
 * requests carry no cookie and answer to their own rule instead (basic-writes.ts).
 */
export const requireCsrfToken: RequestHandler = (req, _res, next) => {
  if (!changesState(req) || req.authVia !== 'session') return next();
  if (!showsCsrfToken(req)) return next(wrongCsrfToken());
  next();
};
