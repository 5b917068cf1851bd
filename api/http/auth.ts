/** Role checks. Every API route carries exactly one of these guards; anything else is denied. */
import type { RequestHandler } from 'express';
import { ROLES, type Role } from '../users/user.schemas';
import { ForbiddenError, NotSignedInError } from './http-error';

export type RoleGuard = RequestHandler & { readonly allowedRoles: readonly Role[] | 'public' };

/** Lets the request through only for a signed-in, active user whose role is listed. */
export function requireRole(...roles: Role[]): RoleGuard {
  const guard: RequestHandler = (req, _res, next) => {
    if (!req.user) return next(new NotSignedInError());
    if (!roles.includes(req.user.role)) return next(new ForbiddenError());
    next();
  };
  return Object.assign(guard, { allowedRoles: Object.freeze([...roles]) });
}

/** Any signed-in role. */
export const signedIn = (): RoleGuard => requireRole(...ROLES);

/** Marks a route that anyone may call (sign-in, CSRF token). */
export function publicRoute(): RoleGuard {
  const guard: RequestHandler = (_req, _res, next) => next();
  return Object.assign(guard, { allowedRoles: 'public' as const });
}
