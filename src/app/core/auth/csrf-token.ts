import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, catchError, map, shareReplay, throwError } from 'rxjs';
import { API_PATHS } from '../api/api-paths';
import { ApiRequestError } from '../api/api-request-error';
import { readResponse } from '../api/parse-response';
import { readCsrfAnswer } from './session-answers';

/**
 * The CSRF token of the current session, fetched once and shared. The server ties it to the
 * session, so it is forgotten whenever the session changes (sign-in, sign-out, a rejection).
 */
@Injectable({ providedIn: 'root' })
export class CsrfToken {
  private readonly http = inject(HttpClient);
  private current: Observable<string> | null = null;

  token(): Observable<string> {
    this.current ??= this.fetchToken();
    return this.current;
  }

  forget(): void {
    this.current = null;
  }

  private fetchToken(): Observable<string> {
    return this.http.get<unknown>(API_PATHS.csrf).pipe(
      readResponse(readCsrfAnswer),
      map(({ token }) => token),
      catchError((error: unknown) => {
        this.forget();
        return throwError(() => ApiRequestError.from(error));
      }),
      shareReplay({ bufferSize: 1, refCount: false }),
    );
  }
}
