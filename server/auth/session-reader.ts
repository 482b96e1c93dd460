import { createHmac, timingSafeEqual } from 'node:crypto';
import type { Request } from 'express';
import type { Session, SessionData, Store } from 'express-session';
import type { SessionPerson } from '../people/people-repository.ts';
import './request-person.ts';

/** How many proved cookie values a process remembers before it starts over. */
const PROVED_COOKIES = 10_000;

/**
 * The session id a signed cookie value (`s:ID.SIGNATURE`, as express-session writes it through
 * cookie-signature) carries, or undefined when the signature is not the secret's. The same
 * HMAC-SHA256, compared in constant time.
 */
export function unsignSessionCookie(value: string, secret: string): string | undefined {
  if (!value.startsWith('s:')) return undefined;
  const signed = value.slice(2);
  const id = signed.slice(0, signed.lastIndexOf('.'));
  const expected = Buffer.from(
    `${id}.${createHmac('sha256', secret).update(id).digest('base64').replace(/=+$/, '')}`,
  );
  const given = Buffer.from(signed);
  return expected.length === given.length && timingSafeEqual(expected, given) ? id : undefined;
}

/**
 * The first value of the named cookie in a Cookie header, unquoted and decoded as the cookie
 * package that express-session uses does; undefined when absent or not decodable.
 */
export function cookieValue(header: string | undefined, name: string): string | undefined {
  if (!header) return undefined;
  for (const pair of header.split(';')) {
    const equals = pair.indexOf('=');
    if (equals < 0 || pair.slice(0, equals).trim() !== name) continue;
    let value = pair.slice(equals + 1).trim();
    if (value.length > 1 && value.startsWith('"') && value.endsWith('"'))
      value = value.slice(1, -1);
    try {
      return value.includes('%') ? decodeURIComponent(value) : value;
    } catch {
      return undefined;
    }
  }
  return undefined;
}

/**
 * A session for a request that only reads it: the stored data, frozen (a route that tried to
 * change it would fail at once rather than lose the change), and destroy, which removes it from
 * the store as express-session's would.
 */
function readOnlySession(store: Store, sid: string, data: SessionData): Session {
  const session: Record<string, unknown> = {
    ...data,
    id: sid,
    destroy(done?: (error?: unknown) => void): unknown {
      store.destroy(sid, (error?: unknown) => done?.(error));
      return session;
    },
  };
  return Object.freeze(session) as unknown as Session;
}

/** A live session's data and its person (null when the person is gone). */
export interface SessionFound {
  data: SessionData;
  person: SessionPerson | null;
}

/**
 * Reads the session of a request that cannot change it, without express-session's work for a
 * session that may change (a fresh session object, hashing it before and after the route to see
 * whether it changed, wrapping the response's end): its signed cookie is proved once per process
 * (the same value always proves the same way; a changed secret is a new process), and its row
 * and its person come from `read` on every request, which must reflect every commit already
 * made (session-cache.ts), so a sign-out, an expiry, a deactivation, a role change or a new
 * password takes effect at once, whichever server process on the database made it. `read` may
 * answer at once (a kept session) or later (a query). Returns false, having done nothing, when
 * the cookie is missing or does not prove: express-session then handles the request as before.
 */
export function sessionReader(
  store: Store,
  secret: string,
  cookieName: string,
  read: (sid: string) => SessionFound | undefined | Promise<SessionFound | undefined>,
): (req: Request, next: (error?: unknown) => void) => boolean {
  const proved = new Map<string, string>();
  return (req, next) => {
    const value = cookieValue(req.headers.cookie, cookieName);
    if (value === undefined) return false;
    let sid = proved.get(value);
    if (sid === undefined) {
      sid = unsignSessionCookie(value, secret);
      if (sid === undefined) return false;
      // Bounded: a flood of distinct signed cookies can only cost the proofs again.
      if (proved.size >= PROVED_COOKIES) proved.clear();
      proved.set(value, sid);
    }
    const id = sid;
    const use = (found: SessionFound | undefined): void => {
      if (found) {
        req.session = readOnlySession(store, id, found.data) as Request['session'];
        req.sessionPerson = found.person;
      }
      next();
    };
    const found = read(id);
    if (found instanceof Promise) found.then(use, next);
    else use(found);
    return true;
  };
}
