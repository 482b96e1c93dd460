import { HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { catchError, throwError } from 'rxjs';
import { ApiError } from '../api/api-error';
import { SessionStore } from '../auth/session-store';
import { SITE_HEADER_NAME } from './site-choice';

/**
 * Names the chosen site on every API call (nothing on a single-site install, nor on the session's
 * own calls, which come before a site is chosen). A site that is no longer the person's (removed,
 * or their role there taken away) answers no-such-site: the sites are asked for again, which
 * falls back to the default, and the page's next call works there.
 */
export const siteInterceptor: HttpInterceptorFn = (request, next) => {
  const session = inject(SessionStore);
  const site = session.site();
  if (!site || !request.url.startsWith('/api/') || request.url.startsWith('/api/session'))
    return next(request);
  return next(request.clone({ setHeaders: { [SITE_HEADER_NAME]: site.key } })).pipe(
    catchError((error: unknown) => {
      if (error instanceof ApiError && error.code === 'no-such-site') void session.loadSites();
      return throwError(() => error);
    }),
  );
};
