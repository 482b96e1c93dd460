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
  readonly role: Role;
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
}
