import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { SessionUser } from '@shared/api/auth';
import { API_PATHS } from '../core/api/api-paths';
import { csrfInterceptor } from '../core/auth/csrf-interceptor';
import { signInRedirectInterceptor } from '../core/auth/sign-in-redirect-interceptor';
import { SignInPage } from './sign-in-page';

const admin: SessionUser = {
  id: 4,
  email: 'admin@demo.speedwright.example',
  displayName: 'Robin Aldane',
  role: 'admin',
  operatorId: 1,
  operatorName: 'Kestrel Fen Aviation (demo)', operatorIsDemo: true,
};

describe('SignInPage', () => {
  let fixture: ComponentFixture<SignInPage>;
  let backend: HttpTestingController;
  let navigateByUrl: jest.SpyInstance;
  let page: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [SignInPage],
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([csrfInterceptor, signInRedirectInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    navigateByUrl = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
    fixture = TestBed.createComponent(SignInPage);
    page = fixture.nativeElement;
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  function input(label: string): HTMLInputElement {
    const field = Array.from(page.querySelectorAll('mat-form-field')).find((f) => f.querySelector('mat-label')?.textContent?.trim() === label);
    return field!.querySelector('input')!;
  }

  async function submit(email: string, password: string): Promise<void> {
    for (const [label, value] of [['E-mail', email], ['Password', password]]) {
      const element = input(label);
      element.value = value;
      element.dispatchEvent(new Event('input'));
    }
    page.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    await fixture.whenStable();
  }

  function answerLogin(body: object | null, status: number): void {
    backend.expectOne(API_PATHS.csrf).flush({ token: 'tok' });
    backend.expectOne(API_PATHS.login).flush(body, { status, statusText: 'x' });
  }

  async function errorText(): Promise<string | undefined> {
    await fixture.whenStable();
    return page.querySelector('[data-testid="sign-in-error"]')?.textContent?.trim();
  }

  it('labels both fields and sets autocomplete for password managers', () => {
    expect(input('E-mail').getAttribute('autocomplete')).toBe('username');
    expect(input('Password').getAttribute('autocomplete')).toBe('current-password');
    expect(input('Password').type).toBe('password');
  });

  it("shows the server's own sentence on a wrong password", async () => {
    await submit('Pilot@Demo.Speedwright.Example ', 'wrong');
    backend.expectOne(API_PATHS.csrf).flush({ token: 'tok' });
    const login = backend.expectOne(API_PATHS.login);
    expect(login.request.body).toEqual({ email: 'pilot@demo.speedwright.example', password: 'wrong' });
    login.flush({ error: { code: 'invalid_credentials', message: 'The e-mail or password is not right.' } }, { status: 401, statusText: 'Unauthorized' });

    expect(await errorText()).toBe('The e-mail or password is not right.');
    expect(navigateByUrl).not.toHaveBeenCalled();
  });

  it('says the account is locked, in our words when the server sent none', async () => {
    await submit('pilot@demo.speedwright.example', 'pw');
    answerLogin(null, 423);
    expect(await errorText()).toMatch(/locked.*administrator/);
  });

  it('says to wait after too many attempts', async () => {
    await submit('pilot@demo.speedwright.example', 'pw');
    answerLogin({ error: { code: 'too_many_attempts', message: 'Too many attempts. Try again in 15 minutes.' } }, 429);
    expect(await errorText()).toBe('Too many attempts. Try again in 15 minutes.');
  });

  it('says the server cannot be reached on a network failure', async () => {
    await submit('pilot@demo.speedwright.example', 'pw');
    backend.expectOne(API_PATHS.csrf).error(new ProgressEvent('error'));
    expect(await errorText()).toBe("Speedwright cannot reach the server. Check the device's connection and try again.");
  });

  it('shows inline messages and sends nothing when the form is incomplete', async () => {
    await submit('not-an-address', '');
    backend.expectNone(API_PATHS.login);
    const errors = Array.from(page.querySelectorAll('mat-error')).map((e) => e.textContent?.trim());
    expect(errors).toEqual(['Enter an e-mail address such as name@example.com.', 'Enter your password.']);
  });

  it('puts field messages from a 400 under their fields', async () => {
    await submit('pilot@demo.speedwright.example', 'pw');
    answerLogin({ error: { code: 'invalid_request', message: 'Check the highlighted fields.', fields: { email: 'This address is not registered here.' } } }, 400);
    await fixture.whenStable();
    expect(page.querySelector('mat-error')?.textContent?.trim()).toBe('This address is not registered here.');
    expect(await errorText()).toBe('Check the highlighted fields.');
  });

  it('goes to the return URL after signing in', async () => {
    fixture.componentRef.setInput('returnUrl', '/people');
    await submit(admin.email, 'pw');
    answerLogin({ user: admin }, 200);
    expect(navigateByUrl).toHaveBeenCalledWith('/people');
  });

  it('goes home instead of following a return URL to another site', async () => {
    fixture.componentRef.setInput('returnUrl', '//evil.example/x');
    await submit(admin.email, 'pw');
    answerLogin({ user: admin }, 200);
    expect(navigateByUrl).toHaveBeenCalledWith('/home');
  });

  it('links to the request for a password reset', () => {
    const link = Array.from((fixture.nativeElement as HTMLElement).querySelectorAll('a')).find((a) => a.textContent?.includes('Forgot your password?'));
    expect(link?.getAttribute('href')).toBe('/forgot-password');
  });
});
