import { inject } from '@angular/core';
import { CanMatchFn, Router } from '@angular/router';
import type { Role } from '../../../api/users/user.schemas';
import { AuthStore } from './auth-store';

/** Matches the route only for the listed roles; anyone else goes to sign-in (or home, if signed in). */
export function roleGuard(...roles: Role[]): CanMatchFn {
  return () => {
    const auth = inject(AuthStore);
    if (auth.hasRole(...roles)) return true;
    return inject(Router).parseUrl(auth.signedIn() ? '/' : '/sign-in');
  };
}
