import type { Request } from 'express';
import type { ChangeOptions } from '../batches/batch.ts';
import type { Person, Role } from '../../shared/api/person.ts';
import type { SiteInfo } from '../../shared/api/site.ts';
import type { SiteScope } from '../sites/site-scope.ts';
import type { SessionPerson } from '../people/people-repository.ts';
import { AppError } from '../http/app-error.ts';
import { formulaSiteOf } from '../formulas/formula-site.ts';

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
    /** The site the request works at (resolveSite); `person.role` is the role there. */
    site?: SiteScope;
    /** The person's role at every site of the group; null when they have roles at single sites only. */
    groupRole?: Role | null;
    /** The key of every site of the install, seen or not (a formula's `site:` must be one). */
    installSiteKeys?: readonly string[];
    /** The sites the person can see, with their role at each (and the id, for queries). */
    siteRoles?: readonly (SiteInfo & { readonly id: number })[];
  }
}

/** The authenticated person of a request; routes behind `authenticate` always have one. */
export function personOf(req: Request): Person {
  if (!req.person) throw new AppError(401, 'unauthenticated', 'sign in first');
  return req.person;
}

/** The site of a request, once resolveSite has run (every route behind it has one). */
export function siteOf(req: Request): SiteScope {
  if (!req.site) throw new AppError(400, 'site-required', 'say which site');
  return req.site;
}

/**
 * Who makes a change, from where, at which site, and when by the server's clock (reminders count
 * from it).
 */
export function changeBy(req: Request, { now }: { now: () => Date }): ChangeOptions {
  const formulas = formulaSiteOf(req);
  return {
    actor: personOf(req),
    at: now().toISOString(),
    ...(req.ip === undefined ? {} : { ip: req.ip }),
    ...(req.site ? { site: req.site } : {}),
    ...(formulas ? { formulas } : {}),
  };
}
