import { HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';
import { AuthStore } from '../auth/auth-store';
import { ApiError, toApiError } from './api-error';

/** Where a 401 is an answer, not an expired session: the session probe and sign-in, the password links. */
const ANSWERS_401 = [/^\/api\/v1\/session$/, /^\/api\/v1\/password-links\//];

/**
 * Every API failure reaches callers as an ApiError. A 401 on any other call means the session ended:
 * forget the user and send them to sign in, coming back to the page they were on.
 */
export const apiErrorInterceptor: HttpInterceptorFn = (req, next) => {
  const router = inject(Router);
  const auth = inject(AuthStore);
  return next(req).pipe(
    catchError((err: unknown) => {
      const error: ApiError = toApiError(err);
      const path = req.url.split('?')[0];
      if (error.status === 401 && !ANSWERS_401.some((re) => re.test(path))) {
        auth.forget();
        const current = router.url;
        const next = current.startsWith('/sign-in') ? undefined : current;
        void router.navigate(['/sign-in'], { queryParams: next ? { next } : {} });
      }
      return throwError(() => error);
    }),
  );
};
