import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';
import { SessionStore } from '../auth/session-store';
import { ApiError } from './api-error';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Adds the session's CSRF token to every state-changing API request, and turns failures into
 * ApiErrors with readable messages. A 401 outside sign-in means the session ended: back to sign-in.
 */
export const apiErrorInterceptor: HttpInterceptorFn = (request, next) => {
  const session = inject(SessionStore);
  const router = inject(Router);
  const token = session.csrfToken();
  const withToken =
    token && !SAFE_METHODS.has(request.method) && request.url.startsWith('/api/')
      ? request.clone({ setHeaders: { 'X-CSRF-Token': token } })
      : request;
  return next(withToken).pipe(
    catchError((response: unknown) => {
      if (!(response instanceof HttpErrorResponse)) return throwError(() => response);
      const error = ApiError.from(response);
      if (error.status === 401 && !request.url.startsWith('/api/session')) {
        session.forget();
        void router.navigate(['/sign-in'], { queryParams: { returnUrl: router.url } });
      }
      return throwError(() => error);
    }),
  );
};
