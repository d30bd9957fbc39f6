import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { catchError, switchMap, throwError } from 'rxjs';
import { readApiErrorBody } from '../api/api-error-body';
import { CSRF_HEADER, isApiUrl } from '../api/api-paths';
import { CsrfToken } from './csrf-token';

const READ_ONLY_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Adds the session's CSRF token to every state-changing API request. When the server says the
 * token is stale (403 `csrf_invalid`, e.g. after the session rotated), fetches a fresh one and
 * sends the request once more.
 */
export const csrfInterceptor: HttpInterceptorFn = (request, next) => {
  if (READ_ONLY_METHODS.has(request.method) || !isApiUrl(request.url)) {
    return next(request);
  }
  const csrf = inject(CsrfToken);
  const sendWithToken = () =>
    csrf.token().pipe(switchMap((token) => next(request.clone({ setHeaders: { [CSRF_HEADER]: token } }))));

  return sendWithToken().pipe(
    catchError((error: unknown) => {
      if (!isStaleTokenRejection(error)) {
        return throwError(() => error);
      }
      csrf.forget();
      return sendWithToken();
    }),
  );
};

function isStaleTokenRejection(error: unknown): boolean {
  if (!(error instanceof HttpErrorResponse) || error.status !== 403) {
    return false;
  }
  return readApiErrorBody(error.error)?.code === 'csrf_invalid';
}
