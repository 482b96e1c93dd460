import session, { type SessionData } from 'express-session';
import connectSessionSequelize from 'connect-session-sequelize';
import type { Request, RequestHandler } from 'express';
import type { Database } from '../db/database.ts';
import { readRow } from '../db/read-row.ts';
import type { PeopleRepository, SessionPerson } from '../people/people-repository.ts';
import { SessionCache } from './session-cache.ts';
import { sessionReader, type SessionFound } from './session-reader.ts';

/** When a stored session ends, and what it holds (JSON), as the Sessions table keeps them. */
interface SessionRowTimes {
  data: string | null;
  expires: string | null;
}

/** A stored session as a process keeps it: its data, when it ends (ms), and its person. */
interface KeptSession {
  readonly data: SessionData | null;
  readonly endsAt: number | null;
  readonly person: SessionPerson | null;
}

/** How long a console session lasts after signing in. */
export const SESSION_IDLE_MS = 12 * 60 * 60 * 1000;
/** The session cookie's name. */
export const SESSION_COOKIE = 'larder.sid';

/**
 * A stored session's data, or null when there is none or it is past its expiry (even before the
 * periodic clean-up removes it).
 */
export function liveSessionData(row: SessionRowTimes | undefined): SessionData | null {
  const expired = !!row?.expires && new Date(row.expires).getTime() <= Date.now();
  return row?.data && !expired ? (JSON.parse(row.data) as SessionData) : null;
}

/**
 * Sessions kept in SQLite, with an httpOnly, SameSite=Strict cookie. The table comes from our
 * migrations, so the store is never asked to create it. A request that only reads its session
 * gets it, with its person, from one read (sessionReader, people.findSession); signing in and out
 * and one's own new password go through express-session.
 */
export function sessionMiddleware(
  db: Database,
  secret: string,
  secure: boolean,
  people: PeopleRepository,
): RequestHandler {
  const SequelizeStore = connectSessionSequelize(session.Store);
  /**
   * The library's store, but its read is one plain SELECT (readRow) rather than a Sequelize
   * model lookup, which cost more than the rest of a calculation request.
   */
  class SessionStore extends SequelizeStore {
    override get(sid: string, done: (error: unknown, data?: SessionData | null) => void): void {
      readRow<SessionRowTimes>(db.sequelize, 'SELECT data, expires FROM "Sessions" WHERE sid = ?', [
        sid,
      ]).then((row) => done(null, liveSessionData(row)), done);
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
  // The session is kept, read and parsed, while nothing is committed (session-cache.ts); its
  // expiry is checked on every request all the same.
  const kept = new SessionCache(db.commitMark, async (sid) => {
    const row = await people.findSession(sid);
    return (
      row && {
        data: row.data ? (JSON.parse(row.data) as SessionData) : null,
        endsAt: row.expires ? new Date(row.expires).getTime() : null,
        person: row.person ?? null,
      }
    );
  });
  const live = (session: KeptSession | undefined): SessionFound | undefined =>
    session?.data && !(session.endsAt !== null && session.endsAt <= Date.now())
      ? { data: session.data, person: session.person }
      : undefined;
  const readSession = sessionReader(store, secret, SESSION_COOKIE, (sid) => {
    const session = kept.read(sid);
    return session instanceof Promise ? session.then(live) : live(session);
  });
  return (req, res, next) => {
    if (changesSession(req)) return sessions(req, res, next);
    if (!req.headers.cookie?.includes(cookieName)) return next();
    // Every other request only reads its session: the lighter reader, when its cookie proves.
    if (!readSession(req, next)) sessions(req, res, next);
  };
}

/**
 * The requests that start, end or change their own session, under the API's mount: signing in
 * and out (/session), and one's own new password, which moves the session's sign-in time past
 * the cut-off that ends one's other sessions (people-router.ts). The session the reader gives
 * any other request is frozen, so a route that changes it without being named here fails loudly.
 */
function changesSession(req: Request): boolean {
  // As the router matches them: whatever the case, with or without a trailing slash.
  const path = req.path.toLowerCase().replace(/\/+$/, '');
  return (
    path === '/session' ||
    (path === '/people/me/password' && req.method !== 'GET' && req.method !== 'HEAD')
  );
}
