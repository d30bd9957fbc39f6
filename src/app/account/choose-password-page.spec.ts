import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { API_PATHS } from '../core/api/api-paths';
import { ChoosePasswordPage } from './choose-password-page';

/** 43 base64url characters, the shape of a mailed link token. */
const TOKEN = 'Qk3x7b1yZp0aT9mVv2cN8rL4sH6uJ5eWd0oF1gIhK2A';
const PASSWORD = 'gravel harbour lantern';

describe('ChoosePasswordPage', () => {
  let harness: RouterTestingHarness;
  let backend: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter(
          [
            { path: 'invitation', component: ChoosePasswordPage, data: { kind: 'invitation' } },
            { path: 'reset-password', component: ChoosePasswordPage, data: { kind: 'reset' } },
          ],
          withComponentInputBinding(),
        ),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create();
  });

  afterEach(() => backend.verify());

  function page(): HTMLElement {
    return harness.routeNativeElement!;
  }

  async function type(label: string, value: string): Promise<void> {
    const field = Array.from(page().querySelectorAll('mat-form-field')).find((f) => f.querySelector('mat-label')?.textContent?.trim() === label)!;
    const input = field.querySelector('input') as HTMLInputElement;
    input.value = value;
    input.dispatchEvent(new Event('input'));
    await harness.fixture.whenStable();
  }

  function errorUnder(label: string): string | undefined {
    const field = Array.from(page().querySelectorAll('mat-form-field')).find((f) => f.querySelector('mat-label')?.textContent?.trim() === label)!;
    return field.querySelector('mat-error')?.textContent?.trim();
  }

  async function submit(): Promise<void> {
    (page().querySelector('button[type="submit"]') as HTMLButtonElement).click();
    await harness.fixture.whenStable();
  }

  it('accepts an invitation: checks the two passwords, sends the token from the link, then says where to sign in', async () => {
    await harness.navigateByUrl(`/invitation#token=${TOKEN}`);
    expect(page().querySelector('h1')?.textContent?.trim()).toBe('Welcome to Speedwright');

    await type('New password', 'short');
    await type('New password again', 'different');
    await submit();
    expect(errorUnder('New password')).toBe('Choose a password of at least 12 characters; a few unrelated words work well.');
    expect(errorUnder('New password again')).toBe('The two passwords are not the same.');

    await type('New password', PASSWORD);
    await type('New password again', PASSWORD);
    await submit();
    const request = backend.expectOne({ method: 'POST', url: API_PATHS.acceptInvitation });
    expect(request.request.body).toEqual({ token: TOKEN, password: PASSWORD });
    request.flush({ email: 'lee.quarry@demo.speedwright.example' });
    await harness.fixture.whenStable();

    expect(page().querySelector('[data-testid="password-set"]')?.textContent).toContain(
      'Your password is set and the invitation is used. Sign in with lee.quarry@demo.speedwright.example and your new password.',
    );
    expect(page().querySelector('a[href="/sign-in"]')?.textContent?.trim()).toBe('Go to sign-in');
    expect(page().querySelector('form')).toBeNull();
  });

  it('shows the server’s sentence when the invitation is spent, with no form left to try again', async () => {
    await harness.navigateByUrl(`/invitation#token=${TOKEN}`);
    await type('New password', PASSWORD);
    await type('New password again', PASSWORD);
    await submit();
    const sentence = 'This invitation has already been used. Sign in with the password you chose, or ask for a password reset.';
    backend.expectOne(API_PATHS.acceptInvitation).flush({ error: { code: 'link_used', message: sentence } }, { status: 410, statusText: 'Gone' });
    await harness.fixture.whenStable();
    expect(page().querySelector('[data-testid="link-problem"]')?.textContent?.trim()).toBe(sentence);
    expect(page().querySelector('form')).toBeNull();
    expect(page().querySelector('a[href="/sign-in"]')?.textContent?.trim()).toBe('Go to sign-in');
  });

  it('keeps the form when the server refuses for a reason a second try can fix', async () => {
    await harness.navigateByUrl(`/reset-password#token=${TOKEN}`);
    await type('New password', PASSWORD);
    await type('New password again', PASSWORD);
    await submit();
    const sentence = 'Too many requests from this device. Wait 15 minutes and try again.';
    backend.expectOne(API_PATHS.passwordResetConfirm).flush({ error: { code: 'too_many_attempts', message: sentence } }, { status: 429, statusText: 'x' });
    await harness.fixture.whenStable();
    expect(page().querySelector('[data-testid="account-error"]')?.textContent?.trim()).toBe(sentence);
    expect(page().querySelector('form')).not.toBeNull();
  });

  it('puts the server’s password sentence under the password field', async () => {
    await harness.navigateByUrl(`/invitation#token=${TOKEN}`);
    // Strong enough for the form's own check; the server refuses it for a reason only it knows
    // (a password built on the person's name, which the invitation page does not have).
    await type('New password', 'nell-ashcombe-harbour');
    await type('New password again', 'nell-ashcombe-harbour');
    await submit();
    backend.expectOne(API_PATHS.acceptInvitation).flush(
      { error: { code: 'weak_password', message: 'Some fields of the invitation are not right.', fields: { password: 'This password is built on your own name or e-mail address.' } } },
      { status: 400, statusText: 'Bad Request' },
    );
    await harness.fixture.whenStable();
    expect(errorUnder('New password')).toBe('This password is built on your own name or e-mail address.');
    expect(page().querySelector('[data-testid="account-error"]')).toBeNull();
  });

  it('refuses a common password in the form with the server’s own sentence, sending nothing', async () => {
    await harness.navigateByUrl(`/invitation#token=${TOKEN}`);
    await type('New password', 'password1234');
    await type('New password again', 'password1234');
    await submit();
    backend.expectNone(API_PATHS.acceptInvitation);
    expect(errorUnder('New password')).toMatch(/^This password is on the list of common and breached passwords\./);
  });

  it('says so when the link lost its token, and offers no form', async () => {
    await harness.navigateByUrl('/invitation#token=Qk3x7b1y');
    expect(page().querySelector('[data-testid="link-problem"]')?.textContent?.trim()).toBe(
      'This link is not complete. Open it again from the e-mail, or copy the whole link.',
    );
    expect(page().querySelector('form')).toBeNull();
  });

  it('confirms a password reset with the token of the reset link', async () => {
    await harness.navigateByUrl(`/reset-password#token=${TOKEN}`);
    expect(page().querySelector('h1')?.textContent?.trim()).toBe('Choose a new password');
    await type('New password', PASSWORD);
    await type('New password again', PASSWORD);
    await submit();
    const request = backend.expectOne({ method: 'POST', url: API_PATHS.passwordResetConfirm });
    expect(request.request.body).toEqual({ token: TOKEN, password: PASSWORD });
    request.flush({ email: 'pilot@demo.speedwright.example' });
    await harness.fixture.whenStable();
    expect(page().querySelector('[data-testid="password-set"]')?.textContent).toContain('Your new password is saved.');
  });
});
