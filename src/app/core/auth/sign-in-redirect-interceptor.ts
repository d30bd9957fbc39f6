import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';
import { API_PATHS } from '../api/api-paths';
import { AuthService } from './auth-service';

/**
 * A 401 from these is an answer, not an expired session: the probe asks whether anyone is signed
 * in, and the login's 401 means a wrong password.
 */
const ANSWERS_WITH_401 = new Set<string>([API_PATHS.me, API_PATHS.login]);

/** Any other 401 means the session ended on the server: go to sign-in and come back afterwards. */
export const signInRedirectInterceptor: HttpInterceptorFn = (request, next) => {
  const router = inject(Router);
  const auth = inject(AuthService);
  return next(request).pipe(
    catchError((error: unknown) => {
      if (error instanceof HttpErrorResponse && error.status === 401 && !ANSWERS_WITH_401.has(request.url)) {
        auth.forgetSession();
        const returnUrl = router.url.startsWith('/sign-in') ? undefined : router.url;
        void router.navigate(['/sign-in'], { queryParams: { returnUrl } });
      }
      return throwError(() => error);
    }),
  );
};
