import { inject } from '@angular/core';
import { type CanMatchFn, Router } from '@angular/router';
import type { Role } from '../../../../shared/domain';
import { Session } from './session';

/**
 * Lets a route match only for the given roles; a signed-out visitor is sent to sign-in
 * with the page they wanted as the return URL. The server enforces access regardless.
 */
export function roleGuard(...roles: Role[]): CanMatchFn {
  return (_route, segments) => {
    const session = inject(Session);
    const router = inject(Router);
    if (session.hasRole(...roles)) return true;
    if (!session.signedIn()) {
      const returnUrl = '/' + segments.map((segment) => segment.path).join('/');
      return router.createUrlTree(['/sign-in'], { queryParams: { returnUrl } });
    }
    return router.createUrlTree([session.homePath()]);
  };
}
