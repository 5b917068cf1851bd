import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';
import { CsrfToken } from '../auth/csrf-token';
import { ApiError } from '../errors/api-error';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/** Adds the CSRF header, turns failures into ApiError, and sends a lapsed session to sign-in. */
export const apiInterceptor: HttpInterceptorFn = (req, next) => {
  const csrf = inject(CsrfToken);
  const router = inject(Router);
  const token = csrf.value();
  const request = !SAFE.has(req.method) && token ? req.clone({ setHeaders: { 'x-csrf-token': token } }) : req;
  return next(request).pipe(
    catchError((err: unknown) => {
      if (!(err instanceof HttpErrorResponse)) return throwError(() => err);
      const body = err.error?.error as { code?: string; message?: string; fields?: Record<string, string[]> } | undefined;
      const apiError = new ApiError(
        err.status,
        body?.code ?? (err.status === 0 ? 'NETWORK' : 'HTTP_' + err.status),
        body?.message ?? (err.status === 0 ? 'The server cannot be reached. Check your connection.' : `The server answered ${err.status}.`),
        body?.fields ?? {},
      );
      const quiet = req.url.endsWith('/api/auth/me') || req.url.endsWith('/api/auth/sign-in');
      if (err.status === 401 && !quiet) void router.navigateByUrl('/sign-in');
      return throwError(() => apiError);
    }),
  );
};
