import type { RequestHandler } from 'express';
import { AppError } from '../http/app-error.ts';
import { changesState } from '../http/changes-state.ts';
import './request-person.ts';

/** The header a script names itself with when its change has no JSON body (an upload, a sign-off). */
export const CLIENT_HEADER = 'x-larder-client';

/**
 * A change signed with HTTP Basic must show it was not sent by a plain web form: a JSON body, or
 * the X-Larder-Client header. A browser that remembered the credentials would send them with a
 * form another site submits, but a form can send neither, and a page script cannot add them
 * across sites without the server's consent, which this API never gives. The console signs in
 * with a session and its CSRF token instead.
 */
export const requireScriptWrite: RequestHandler = (req, _res, next) => {
  if (!changesState(req) || req.authVia !== 'basic') return next();
  // The header itself, not req.is(): a body-less request (a sign-off) has no body to type.
  const json = /^application\/json\s*(;|$)/i.test(req.get('content-type') ?? '');
  if (json || req.get(CLIENT_HEADER)) return next();
  next(
    new AppError(
      403,
      'not-a-script',
      'a change signed with a password must send a JSON body (Content-Type: application/json) or the header X-Larder-Client naming the script',
    ),
  );
};
