import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router } from '@angular/router';
import { API_PATHS } from '../api/api-paths';
import { AuthService } from './auth-service';
import { signInRedirectInterceptor } from './sign-in-redirect-interceptor';

describe('signInRedirectInterceptor', () => {
  let http: HttpClient;
  let backend: HttpTestingController;
  const router = { url: '/people', navigate: jest.fn().mockResolvedValue(true) };
  const auth = { forgetSession: jest.fn() };
  const unauthorized = { status: 401, statusText: 'Unauthorized' };
  const signedOutBody = { error: { code: 'signed_out', message: 'Sign in first.' } };

  beforeEach(() => {
    router.url = '/people';
    router.navigate.mockClear();
    auth.forgetSession.mockClear();
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(withInterceptors([signInRedirectInterceptor])),
        provideHttpClientTesting(),
        { provide: Router, useValue: router },
        { provide: AuthService, useValue: auth },
      ],
    });
    http = TestBed.inject(HttpClient);
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => backend.verify());

  it('sends the person to sign-in with the current page as the return URL on a 401', () => {
    let failed = false;
    http.get(API_PATHS.users).subscribe({ error: () => (failed = true) });
    backend.expectOne(API_PATHS.users).flush(signedOutBody, unauthorized);

    expect(failed).toBe(true);
    expect(auth.forgetSession).toHaveBeenCalledTimes(1);
    expect(router.navigate).toHaveBeenCalledWith(['/sign-in'], { queryParams: { returnUrl: '/people' } });
  });

  it('does not redirect for the session probe, whose 401 just means "signed out"', () => {
    http.get(API_PATHS.me).subscribe({ error: () => undefined });
    backend.expectOne(API_PATHS.me).flush(signedOutBody, unauthorized);
    expect(router.navigate).not.toHaveBeenCalled();
    expect(auth.forgetSession).not.toHaveBeenCalled();
  });

  it('does not redirect for a wrong password at login', () => {
    http.post(API_PATHS.login, {}).subscribe({ error: () => undefined });
    backend
      .expectOne(API_PATHS.login)
      .flush({ error: { code: 'invalid_credentials', message: 'The e-mail or password is not right.' } }, unauthorized);
    expect(router.navigate).not.toHaveBeenCalled();
  });

  it('lets other errors through without navigating', () => {
    let status = 0;
    http.get(API_PATHS.users).subscribe({ error: (error) => (status = error.status) });
    backend.expectOne(API_PATHS.users).flush({}, { status: 500, statusText: 'Server Error' });
    expect(status).toBe(500);
    expect(router.navigate).not.toHaveBeenCalled();
  });
});
