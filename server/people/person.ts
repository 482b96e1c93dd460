/** The roles: admin (everything), cook (run and record batches), reviewer (read all, sign off). */
export type Role = 'admin' | 'cook' | 'reviewer';

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
