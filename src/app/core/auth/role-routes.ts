import type { Route } from '@angular/router';
import type { Role } from '../api/api-types';

/** What a page for some roles only tells everyone else: who it is for. */
export interface ForRolesData {
  readonly roles: readonly Role[];
}

/**
 * The route that answers a path for those roleGuard turned away: the address stays, and the page
 * says whom it is for and whom to ask, instead of silently showing another page. Declare it right
 * after the guarded route, with the same path and roles; every address under the path matches.
 * @param path The guarded route's path.
 * @param roles The roles the guarded route lets through.
 */
export function forRolesRoute(path: string, ...roles: Role[]): Route {
  return {
    path,
    data: { roles } satisfies ForRolesData,
    children: [
      {
        path: '**',
        title: 'Not for your role · Larderbook',
        loadComponent: () => import('../layout/not-for-you/not-for-you'),
      },
    ],
  };
}
