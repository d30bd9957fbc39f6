import { Injectable, computed, inject, signal } from '@angular/core';
import { Observable, catchError, finalize, map, of, shareReplay, tap } from 'rxjs';
import { LoginRequest, SessionUser, loginResponseSchema } from '../../../../shared/api/auth';
import { API_PATHS } from '../api/api-paths';
import { ApiClient } from '../api/api-client';
import { ApiRequestError } from '../api/api-request-error';
import { CsrfToken } from './csrf-token';

/** `unknown` until the server has said whether this browser has a session. */
export type SessionState = 'unknown' | 'signed-in' | 'signed-out';

/** Who is signed in on this device, and the three things that change it. */
@Injectable({ providedIn: 'root' })
export class AuthService {
  private readonly api = inject(ApiClient);
  private readonly csrf = inject(CsrfToken);
  private readonly currentUser = signal<SessionUser | null>(null);
  private readonly currentState = signal<SessionState>('unknown');
  private readonly lastProbeProblem = signal<ApiRequestError | null>(null);
  private probe: Observable<SessionUser | null> | null = null;

  readonly user = this.currentUser.asReadonly();
  readonly state = this.currentState.asReadonly();
  readonly signedIn = computed(() => this.currentUser() !== null);
  /** Why the server could not tell us about the session, when it was not a plain 401. */
  readonly probeProblem = this.lastProbeProblem.asReadonly();

  /** The signed-in person, asking the server once per page load; guards wait on this. */
  session(): Observable<SessionUser | null> {
    if (this.currentState() !== 'unknown') {
      return of(this.currentUser());
    }
    this.probe ??= this.askServerForSession();
    return this.probe;
  }

  signIn(request: LoginRequest): Observable<SessionUser> {
    return this.api.post(API_PATHS.login, request, loginResponseSchema).pipe(
      map(({ user }) => user),
      tap((user) => {
        // The server regenerated the session, so the old token no longer counts.
        this.csrf.forget();
        this.lastProbeProblem.set(null);
        this.settle(user);
      }),
    );
  }

  signOut(): Observable<void> {
    return this.api.postWithoutAnswer(API_PATHS.logout, {}).pipe(tap(() => this.forgetSession()));
  }

  /** The server no longer knows this session (a 401 somewhere, or a completed sign-out). */
  forgetSession(): void {
    this.csrf.forget();
    this.settle(null);
  }

  private askServerForSession(): Observable<SessionUser | null> {
    return this.api.get(API_PATHS.me, loginResponseSchema).pipe(
      map(({ user }): SessionUser | null => user),
      catchError((error: ApiRequestError) => {
        if (error.status !== 401) {
          this.lastProbeProblem.set(error);
        }
        return of(null);
      }),
      tap((user) => this.settle(user)),
      finalize(() => (this.probe = null)),
      shareReplay({ bufferSize: 1, refCount: false }),
    );
  }

  private settle(user: SessionUser | null): void {
    this.currentUser.set(user);
    this.currentState.set(user ? 'signed-in' : 'signed-out');
  }
}
