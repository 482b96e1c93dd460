import type { SiteRole } from './site.ts';

/**
 * People as the API shows them (/api/people, /api/session): one definition for the server, the
 * command line and the console. The console imports these as types only.
 */

/** The roles: admin (everything), cook (run and record batches), reviewer (read all, sign off). */
export type Role = 'admin' | 'cook' | 'reviewer';

/** Every role, most powerful first. */
export const ROLES: readonly Role[] = ['admin', 'cook', 'reviewer'];

/** A person as the API shows them; never carries the password hash. */
export interface Person {
  readonly id: number;
  readonly username: string;
  readonly displayName: string;
  readonly email: string | null;
  /**
   * The role in force: at the request's site for the signed-in person; in the people API the
   * role at every site, which holds nowhere when `roleEverywhere` is false.
   */
  readonly role: Role;
  /** Whether `role` holds at every site of the group; false: only `sites` give roles. */
  readonly roleEverywhere?: boolean;
  /** Roles at single sites, each winning over `role` there (the people API only). */
  readonly sites?: readonly SiteRole[];
  readonly active: boolean;
  /** Whether this is one of the demo sign-ins of the invented kitchen. */
  readonly demo: boolean;
  readonly createdAt: string;
  readonly updatedAt: string;
}

/** GET/POST /api/session: who is signed in, and the token that unsafe requests send back. */
export interface SessionInfo {
  readonly person: Person;
  readonly csrfToken: string;
  /**
   * How many sites the install has (1 for a single kitchen, which then never speaks of sites);
   * absent from servers before sites.
   */
  readonly siteCount?: number;
}

/** GET /api/session when nobody is signed in: an answer, not an error. */
export interface SignedOut {
  readonly person: null;
  readonly csrfToken: null;
}

/** GET /api/session: the signed-in person with their token, or signed out. */
export type SessionState = SessionInfo | SignedOut;

/** One of the demo's sign-ins, as the demo sets it up; only a demo server tells these. */
export interface DemoSignIn {
  readonly username: string;
  readonly displayName: string;
  readonly role: Role;
  /** The password the demo gives this person; they may have changed it since. */
  readonly password: string;
}

/** GET /api/session/demo: whether this server is the demo, and if so its sign-ins. */
export interface DemoInfo {
  readonly demo: boolean;
  /** The invented kitchen's name; null unless `demo`. */
  readonly kitchen: string | null;
  /** Empty unless `demo`. */
  readonly signIns: readonly DemoSignIn[];
}
