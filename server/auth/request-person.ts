import type { Request } from 'express';
import type { ChangeOptions } from '../batches/batch.ts';
import type { Person } from '../../shared/api/person.ts';
import type { SessionPerson } from '../people/people-repository.ts';
import { AppError } from '../http/app-error.ts';

declare module 'express-session' {
  interface SessionData {
    /** The signed-in person. */
    personId: number;
    /** The token state-changing requests from the console must echo in X-CSRF-Token. */
    csrfToken: string;
    /** When the person signed in (ISO); a later password reset ends the session. */
    signedInAt: string;
  }
}

declare module 'express-serve-static-core' {
  interface Request {
    /** Who made the request, once authenticated. */
    person?: Person;
    /** How they proved it: a session cookie (console) or HTTP Basic (scripts, CLI). */
    authVia?: 'session' | 'basic';
    /**
     * The session's person, read with the session itself (sessionReader); null when it names
     * no person; undefined when not read that way (authenticate reads the person then).
     */
    sessionPerson?: SessionPerson | null;
  }
}

/** The authenticated person of a request; routes behind `authenticate` always have one. */
export function personOf(req: Request): Person {
  if (!req.person) throw new AppError(401, 'unauthenticated', 'sign in first');
  return req.person;
}

/** Who makes a change, from where, and when by the server's clock (reminders count from it). */
export function changeBy(req: Request, { now }: { now: () => Date }): ChangeOptions {
  return {
    actor: personOf(req),
    at: now().toISOString(),
    ...(req.ip === undefined ? {} : { ip: req.ip }),
  };
}
