import { inject } from '@angular/core';
import { type CanMatchFn, Router, type UrlSegment } from '@angular/router';
import type { Role } from '../../../../shared/domain';
import { Session } from './session';

function returnUrlOf(segments: UrlSegment[]): string {
  return '/' + segments.map((segment) => segment.path).join('/');
}

function toSignIn(router: Router, segments: UrlSegment[]) {
  return router.createUrlTree(['/sign-in'], { queryParams: { returnUrl: returnUrlOf(segments) } });
}

/**
 * Lets a route match only for the given roles; a signed-out visitor is sent to sign-in
 * with the page they wanted as the return URL. The server enforces access regardless.
 */
export function roleGuard(...roles: Role[]): CanMatchFn {
  return (_route, segments) => {
    const session = inject(Session);
    const router = inject(Router);
    if (session.hasRole(...roles)) return true;
    if (!session.signedIn()) return toSignIn(router, segments);
    return router.createUrlTree([session.homePath()]);
  };
}

/** Any signed-in person (the profile page). */
export const signedInGuard: CanMatchFn = (_route, segments) => {
  const session = inject(Session);
  return session.signedIn() || toSignIn(inject(Router), segments);
};

/** Managers with the admin flag (user management). */
export const adminGuard: CanMatchFn = (_route, segments) => {
  const session = inject(Session);
  const router = inject(Router);
  if (session.hasRole('manager') && session.isAdmin()) return true;
  return session.signedIn() ? router.createUrlTree([session.homePath()]) : toSignIn(router, segments);
};

/** The sign-in and password pages: someone already signed in goes to their start page. */
export const signedOutGuard: CanMatchFn = () => {
  const session = inject(Session);
  return !session.signedIn() || inject(Router).createUrlTree([session.homePath()]);
};
