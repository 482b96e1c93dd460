import { inject } from '@angular/core';
import { CanMatchFn, Router } from '@angular/router';
import { Role } from '../api/api-types';
import { SessionStore } from './session-store';

/** Lets signed-in people through; others go to the sign-in page and come back afterwards. */
export const authGuard: CanMatchFn = async (_route, segments) => {
  const router = inject(Router);
  const person = await inject(SessionStore).ensureLoaded();
  if (person) return true;
  const returnUrl = `/${segments.map((s) => s.path).join('/')}`;
  return router.createUrlTree(['/sign-in'], {
    queryParams: returnUrl === '/' ? {} : { returnUrl },
  });
};

/**
 * Lets only the given roles through (the server enforces the same). For others the route does not
 * match, and the next one does: a forRolesRoute with the same path, which tells them why.
 */
export function roleGuard(...roles: Role[]): CanMatchFn {
  return async () => {
    const session = inject(SessionStore);
    await session.ensureLoaded();
    return session.hasRole(...roles);
  };
}
