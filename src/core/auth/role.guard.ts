import { inject } from '@angular/core';
import { CanMatchFn, Router } from '@angular/router';
import type { Role } from '../../../api/users/user.schemas';
import { AuthStore } from './auth-store';

/**
 * Matches the route only for the listed roles. Anyone signed out goes to sign-in; a signed-in person
 * whose role may not open the page goes to a page that says so, naming the page and the roles that may.
 */
export function roleGuard(...roles: Role[]): CanMatchFn {
  return (_route, segments) => {
    const auth = inject(AuthStore);
    if (auth.hasRole(...roles)) return true;
    const router = inject(Router);
    if (!auth.signedIn()) return router.parseUrl('/sign-in');
    const page = '/' + segments.map((s) => s.path).join('/');
    return router.createUrlTree(['/not-allowed'], { queryParams: { page, roles: roles.join(',') } });
  };
}
