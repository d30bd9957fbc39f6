import 'fake-indexeddb/auto';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { SessionUser } from '@shared/api/auth';
import { API_PATHS, CSRF_HEADER } from '../api/api-paths';
import { ApiRequestError } from '../api/api-request-error';
import { DeviceStore, SpeedwrightDeviceDatabase } from '../storage/device-store';
import { rememberSession } from '../sync/device-sync';
import { AuthService } from './auth-service';
import { csrfInterceptor } from './csrf-interceptor';

const engineer: SessionUser = {
  id: 7,
  email: 'engineer@demo.speedwright.example',
  displayName: 'Ines Marlow',
  role: 'engineer',
  operatorId: 1,
  operatorName: 'Kestrel Fen Aviation (demo)', operatorIsDemo: true,
};

describe('AuthService', () => {
  let auth: AuthService;
  let backend: HttpTestingController;
  let db: SpeedwrightDeviceDatabase;

  beforeEach(() => {
    db = new SpeedwrightDeviceDatabase(`speedwright-auth-test-${Math.random()}`);
    TestBed.configureTestingModule({
      providers: [provideHttpClient(withInterceptors([csrfInterceptor])), provideHttpClientTesting(), { provide: DeviceStore, useValue: { db } }],
    });
    auth = TestBed.inject(AuthService);
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(async () => {
    backend.verify();
    db.close();
    await db.delete();
  });

  /** The device has this person's operator's data from a completed sync. */
  async function deviceHoldsDataOf(user: SessionUser): Promise<void> {
    await rememberSession(db, user);
    await db.syncState.put({ operatorId: user.operatorId, cursor: 'c1', lastSyncedAt: '2026-12-01T10:00:00.000Z', lastAttemptAt: null, lastProblem: null, refused: [] });
  }

  const settled = () => new Promise<void>((done) => {
    const check = () => (auth.state() === 'unknown' ? setTimeout(check, 5) : done());
    check();
  });

  function signIn(): void {
    auth.signIn({ email: engineer.email, password: 'pw' }).subscribe();
    backend.expectOne(API_PATHS.csrf).flush({ token: 'before' });
    backend.expectOne(API_PATHS.login).flush({ user: engineer });
  }

  describe('session()', () => {
    it('asks the server once and shares the answer', () => {
      const seen: (SessionUser | null)[] = [];
      auth.session().subscribe((user) => seen.push(user));
      auth.session().subscribe((user) => seen.push(user));
      backend.expectOne(API_PATHS.me).flush({ user: engineer });

      expect(seen).toEqual([engineer, engineer]);
      expect(auth.user()).toEqual(engineer);
      expect(auth.state()).toBe('signed-in');

      auth.session().subscribe((user) => seen.push(user));
      backend.expectNone(API_PATHS.me);
      expect(seen).toHaveLength(3);
    });

    it('treats a 401 as signed out without reporting a problem', () => {
      let answer: SessionUser | null | undefined;
      auth.session().subscribe((user) => (answer = user));
      backend.expectOne(API_PATHS.me).flush({ error: { code: 'signed_out', message: 'x' } }, { status: 401, statusText: 'Unauthorized' });

      expect(answer).toBeNull();
      expect(auth.state()).toBe('signed-out');
      expect(auth.probeProblem()).toBeNull();
    });

    it('rejects a malformed session answer instead of trusting it', () => {
      let answer: SessionUser | null | undefined;
      auth.session().subscribe((user) => (answer = user));
      backend.expectOne(API_PATHS.me).flush({ user: { ...engineer, role: 'captain' } });

      expect(answer).toBeNull();
      expect(auth.user()).toBeNull();
      expect(auth.probeProblem()?.code).toBe('malformed_response');
    });

    it('remembers why the server could not be asked', async () => {
      auth.session().subscribe();
      backend.expectOne(API_PATHS.me).error(new ProgressEvent('error'));
      await settled();
      expect(auth.state()).toBe('signed-out');
      expect(auth.probeProblem()?.code).toBe('network_unreachable');
      expect(auth.probeProblem()?.message).toContain('cannot reach the server');
    });
  });

  describe('offline', () => {
    it('opens as the cached person when the server cannot be reached and their operator’s data is on the device', async () => {
      await deviceHoldsDataOf(engineer);
      let answer: SessionUser | null | undefined;
      auth.session().subscribe((user) => (answer = user));
      backend.expectOne(API_PATHS.me).error(new ProgressEvent('error'));
      await settled();
      expect(answer).toEqual(engineer);
      expect(auth.state()).toBe('signed-in');
      expect(auth.sessionFromCache()).toBe(true);
      auth.confirmedByServer();
      expect(auth.sessionFromCache()).toBe(false);
    });

    it('does not open as the cached person when the server says nobody is signed in, and forgets them', async () => {
      await deviceHoldsDataOf(engineer);
      let answer: SessionUser | null | undefined;
      auth.session().subscribe((user) => (answer = user));
      backend.expectOne(API_PATHS.me).flush({ error: { code: 'signed_out', message: 'x' } }, { status: 401, statusText: 'Unauthorized' });
      expect(answer).toBeNull();
      for (let i = 0; i < 50 && (await db.sessions.count()) > 0; i++) await new Promise((done) => setTimeout(done, 5));
      expect(await db.sessions.count()).toBe(0);
    });

    it('does not open offline without the operator’s data on the device', async () => {
      await rememberSession(db, engineer);
      auth.session().subscribe();
      backend.expectOne(API_PATHS.me).error(new ProgressEvent('error'));
      await settled();
      expect(auth.user()).toBeNull();
    });

    it('caches the person the server confirms', async () => {
      auth.session().subscribe();
      backend.expectOne(API_PATHS.me).flush({ user: engineer });
      for (let i = 0; i < 50 && (await db.sessions.count()) === 0; i++) await new Promise((done) => setTimeout(done, 5));
      expect((await db.sessions.get(engineer.id))?.user).toEqual(engineer);
    });
  });

  describe('signIn()', () => {
    it('parses the user and keeps it as the session', () => {
      let user: SessionUser | undefined;
      auth.signIn({ email: engineer.email, password: 'pw' }).subscribe((u) => (user = u));
      backend.expectOne(API_PATHS.csrf).flush({ token: 't' });
      const login = backend.expectOne(API_PATHS.login);
      expect(login.request.body).toEqual({ email: engineer.email, password: 'pw' });
      login.flush({ user: engineer });

      expect(user).toEqual(engineer);
      expect(auth.user()).toEqual(engineer);
      expect(auth.signedIn()).toBe(true);
    });

    it('fails with a typed error when the answer is malformed', () => {
      let error: ApiRequestError | undefined;
      auth.signIn({ email: engineer.email, password: 'pw' }).subscribe({ error: (e) => (error = e) });
      backend.expectOne(API_PATHS.csrf).flush({ token: 't' });
      backend.expectOne(API_PATHS.login).flush({ user: { id: 'seven' } });

      expect(error).toBeInstanceOf(ApiRequestError);
      expect(error?.code).toBe('malformed_response');
      expect(auth.user()).toBeNull();
    });

    it("passes the server's code and sentence on a 401", () => {
      let error: ApiRequestError | undefined;
      auth.signIn({ email: engineer.email, password: 'nope' }).subscribe({ error: (e) => (error = e) });
      backend.expectOne(API_PATHS.csrf).flush({ token: 't' });
      backend
        .expectOne(API_PATHS.login)
        .flush({ error: { code: 'invalid_credentials', message: 'The e-mail or password is not right.' } }, { status: 401, statusText: 'Unauthorized' });

      expect(error?.status).toBe(401);
      expect(error?.code).toBe('invalid_credentials');
      expect(error?.message).toBe('The e-mail or password is not right.');
      expect(error?.fromServer).toBe(true);
    });

    it('fetches a new CSRF token for the next write, because the session changed', () => {
      signIn();
      auth.signOut().subscribe();
      backend.expectOne(API_PATHS.csrf).flush({ token: 'after' });
      expect(backend.expectOne(API_PATHS.logout).request.headers.get(CSRF_HEADER)).toBe('after');
    });
  });

  describe('signOut()', () => {
    it('forgets the person once the server confirmed', () => {
      signIn();
      let done = false;
      auth.signOut().subscribe(() => (done = true));
      backend.expectOne(API_PATHS.csrf).flush({ token: 'after' });
      backend.expectOne(API_PATHS.logout).flush(null, { status: 204, statusText: 'No Content' });

      expect(done).toBe(true);
      expect(auth.user()).toBeNull();
      expect(auth.state()).toBe('signed-out');
    });

    it('keeps the person signed in when the server could not be told', () => {
      signIn();
      let error: ApiRequestError | undefined;
      auth.signOut().subscribe({ error: (e) => (error = e) });
      backend.expectOne(API_PATHS.csrf).flush({ token: 'after' });
      backend.expectOne(API_PATHS.logout).error(new ProgressEvent('error'));

      expect(error?.code).toBe('network_unreachable');
      expect(auth.user()).toEqual(engineer);
    });
  });
});
