/** A role: admin (everything), cook (run and record batches), reviewer (read all, sign off). */
export type Role = 'admin' | 'cook' | 'reviewer';

/** A person as the API returns them. */
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

/** GET/POST /api/session. */
export interface SessionInfo {
  readonly person: Person;
  readonly csrfToken: string;
}

/** The API's error envelope. */
export interface ApiErrorBody {
  readonly error: {
    readonly code: string;
    readonly message: string;
    readonly details?: readonly unknown[];
  };
}
