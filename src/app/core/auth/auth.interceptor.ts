import { type HttpErrorResponse, type HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';
import { safeReturnUrl } from './return-url';
import { Session } from './session';

/**
 * For every API call: send the session cookie, and when the server answers 401 (the
 * session ended: signed out elsewhere, expired, deactivated) forget the user and go to
 * sign-in with the current page as the return URL. The sign-in endpoints' own 401s are
 * form errors and pass through. The CSRF header is added by HttpClient's XSRF support
 * (withXsrfConfiguration in app.config.ts), which reads the XSRF-TOKEN cookie.
 */
export const authInterceptor: HttpInterceptorFn = (req, next) => {
  if (!req.url.startsWith('/api/')) return next(req);
  const session = inject(Session);
  const router = inject(Router);
  return next(req.clone({ withCredentials: true })).pipe(
    catchError((error: HttpErrorResponse | { status?: number }) => {
      if (error.status === 401 && !req.url.startsWith('/api/auth/')) {
        session.set(null);
        const returnUrl = safeReturnUrl(router.url);
        void router.navigate(['/sign-in'], { queryParams: returnUrl ? { returnUrl } : {} });
      }
      return throwError(() => error);
    }),
  );
};
