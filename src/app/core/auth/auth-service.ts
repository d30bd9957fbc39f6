import { Injectable, Injector, computed, inject, signal } from '@angular/core';
import { Observable, catchError, finalize, from, map, of, shareReplay, tap } from 'rxjs';
import type { LoginRequest, SessionUser } from '@shared/api/session';
import { API_PATHS } from '../api/api-paths';
import { ApiClient } from '../api/api-client';
import { ApiRequestError } from '../api/api-request-error';
import type { SpeedwrightDeviceDatabase } from '../storage/device-database';
import { CsrfToken } from './csrf-token';
import { readSessionAnswer } from './session-answers';

/**
 * Statuses that mean the server could not be reached (no answer, or a proxy or gateway that
 * could not reach it): then the cached person opens the app, never after a real "not signed in".
 */
export function serverUnreachable(status: number): boolean {
  return status === 0 || status === 502 || status === 503 || status === 504;
}

/** `unknown` until the server has said whether this browser has a session. */
export type SessionState = 'unknown' | 'signed-in' | 'signed-out';

/** Who is signed in on this device, and the three things that change it. */
@Injectable({ providedIn: 'root' })
export class AuthService {
  private readonly api = inject(ApiClient);
  private readonly csrf = inject(CsrfToken);
  private readonly injector = inject(Injector);
  private readonly currentUser = signal<SessionUser | null>(null);
  private readonly currentState = signal<SessionState>('unknown');
  private readonly lastProbeProblem = signal<ApiRequestError | null>(null);
  private readonly fromCache = signal(false);
  private readonly signInEnded = signal(false);
  private probe: Observable<SessionUser | null> | null = null;

  readonly user = this.currentUser.asReadonly();
  readonly state = this.currentState.asReadonly();
  readonly signedIn = computed(() => this.currentUser() !== null);
  /** Why the server could not tell us about the session, when it was not a plain 401. */
  readonly probeProblem = this.lastProbeProblem.asReadonly();
  /**
   * True while the person comes from this device's cache because the server could not be
   * reached at page load; the next answer of the server (sync, any request) settles it.
   */
  readonly sessionFromCache = this.fromCache.asReadonly();
  /**
   * Opened offline as a person whose sign-in is past its 12 hours: the cards on the device still
   * work (within the currency limit), and the next answer of the server asks for the password.
   */
  readonly offlineSignInEnded = computed(() => this.fromCache() && this.signInEnded());

  /** The signed-in person, asking the server once per page load; guards wait on this. */
  session(): Observable<SessionUser | null> {
    if (this.currentState() !== 'unknown') {
      return of(this.currentUser());
    }
    this.probe ??= this.askServerForSession();
    return this.probe;
  }

  signIn(request: LoginRequest): Observable<SessionUser> {
    return this.api.post(API_PATHS.login, request, readSessionAnswer).pipe(
      tap(({ user, sessionExpiresAt }) => {
        // The server regenerated the session, so the old token no longer counts.
        this.csrf.forget();
        this.lastProbeProblem.set(null);
        this.settle(user);
        this.remember(user, sessionExpiresAt);
      }),
      map(({ user }) => user),
    );
  }

  signOut(): Observable<void> {
    return this.api.postWithoutAnswer(API_PATHS.logout, {}).pipe(tap(() => this.forgetSession()));
  }

  /**
   * The server no longer knows this session (a 401 somewhere, or a completed sign-out): the
   * cached person goes too, so a later offline reload does not open the app as them.
   */
  forgetSession(): void {
    this.csrf.forget();
    this.settle(null);
    void this.withCache((cache, db) => cache.forgetAllSessions(db));
  }

  /** The server answered a request of the cached person: they are signed in there too. */
  confirmedByServer(): void {
    const user = this.currentUser();
    if (!this.fromCache() || !user) return;
    this.fromCache.set(false);
    this.lastProbeProblem.set(null);
    this.remember(user);
  }

  private askServerForSession(): Observable<SessionUser | null> {
    return this.api.get(API_PATHS.me, readSessionAnswer).pipe(
      tap(({ user, sessionExpiresAt }) => this.remember(user, sessionExpiresAt)),
      map(({ user }): SessionUser | null => user),
      catchError((error: ApiRequestError) => {
        if (error.status === 401) {
          // The server's own answer: nobody is signed in here, whatever the device remembers.
          void this.forgetCachedSessions();
          return of(null);
        }
        this.lastProbeProblem.set(error);
        if (!serverUnreachable(error.status)) return of(null);
        return from(
          this.withCache(async (cache, db) => {
            const cached = await cache.cachedSessionForOffline(db);
            this.signInEnded.set(cached !== null && cache.offlineSessionEnded(await db.sessions.get(cached.id)));
            return cached;
          }).then((cached) => cached ?? null),
        ).pipe(tap((cached) => this.fromCache.set(cached !== null)));
      }),
      tap((user) => this.settle(user)),
      finalize(() => (this.probe = null)),
      shareReplay({ bufferSize: 1, refCount: false }),
    );
  }

  /**
   * A browser that holds no IndexedDB database of this site (a first visit) has no cached
   * session to forget, and the device store's code is not loaded for nothing.
   */
  private async forgetCachedSessions(): Promise<void> {
    const databases = await globalThis.indexedDB?.databases?.().catch(() => undefined);
    if (databases && databases.length === 0) return;
    await this.withCache((cache, db) => cache.forgetAllSessions(db));
  }

  private remember(user: SessionUser, sessionExpiresAt?: string): void {
    this.fromCache.set(false);
    void this.withCache((cache, db) => cache.rememberSession(db, user, new Date(), sessionExpiresAt));
  }

  /**
   * The device store and the session cache are loaded when first needed, which keeps IndexedDB
   * code out of the app's first download. Never rejects: without site storage, nothing is cached.
   */
  private async withCache<T>(work: (cache: typeof import('../sync/device-sync'), db: SpeedwrightDeviceDatabase) => Promise<T>): Promise<T | undefined> {
    try {
      const [cache, { DeviceStore }] = await Promise.all([import('../sync/device-sync'), import('../storage/device-store')]);
      return await work(cache, this.injector.get(DeviceStore).db);
    } catch {
      return undefined;
    }
  }

  private settle(user: SessionUser | null): void {
    if (!user) this.fromCache.set(false);
    this.currentUser.set(user);
    this.currentState.set(user ? 'signed-in' : 'signed-out');
  }
}
