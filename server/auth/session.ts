import session, { type SessionData } from 'express-session';
import connectSessionSequelize from 'connect-session-sequelize';
import type { RequestHandler } from 'express';
import type { Database } from '../db/database.ts';
import { readRow } from '../db/read-row.ts';

/** How long a console session lasts after signing in. */
export const SESSION_IDLE_MS = 12 * 60 * 60 * 1000;
/** The session cookie's name. */
export const SESSION_COOKIE = 'larder.sid';

/**
 * Sessions kept in SQLite, with an httpOnly, SameSite=Strict cookie. The table comes from our
 * migrations, so the store is never asked to create it.
 */
export function sessionMiddleware(db: Database, secret: string, secure: boolean): RequestHandler {
  const SequelizeStore = connectSessionSequelize(session.Store);
  /**
   * The library's store, but every request's read is one plain SELECT (readRow) rather than a
   * Sequelize model lookup, which cost more than the rest of a calculation request; a session
   * past its expiry is not found, even before the periodic clean-up removes it.
   */
  class SessionStore extends SequelizeStore {
    override get(sid: string, done: (error: unknown, data?: SessionData | null) => void): void {
      readRow<{ data: string | null; expires: string | null }>(
        db.sequelize,
        'SELECT data, expires FROM "Sessions" WHERE sid = ?',
        [sid],
      ).then((row) => {
        const expired = !!row?.expires && new Date(row.expires).getTime() <= Date.now();
        done(null, row?.data && !expired ? (JSON.parse(row.data) as SessionData) : null);
      }, done);
    }
  }
  // disableTouch is in the store's options but not its type declarations.
  const store = new SessionStore({
    db: db.sequelize,
    checkExpirationInterval: 15 * 60 * 1000,
    expiration: SESSION_IDLE_MS,
    // Sessions last a fixed time from sign-in; touching them would make every read a write.
    disableTouch: true,
  } as ConstructorParameters<typeof SessionStore>[0]);
  const sessions = session({
    name: SESSION_COOKIE,
    secret,
    store,
    resave: false,
    saveUninitialized: false,
    // Not rolling: touching the session on every request would make every read a write.
    rolling: false,
    cookie: { httpOnly: true, sameSite: 'strict', secure, maxAge: SESSION_IDLE_MS },
  });
  // A request without a session cookie (HTTP Basic, anonymous) would get a new session object,
  // with a random id and a hash of it, only for it to be thrown away unsaved: it gets none.
  // Signing in (POST /session, under the API's mount) is the one such request that starts one.
  const cookieName = `${SESSION_COOKIE}=`;
  return (req, res, next) => {
    if (
      req.headers.cookie?.includes(cookieName) ||
      (req.method === 'POST' && req.path === '/session')
    )
      return sessions(req, res, next);
    next();
  };
}
