import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { SessionUser } from '@shared/api/auth';
import { API_PATHS } from '../core/api/api-paths';
import { AuthService } from '../core/auth/auth-service';
import { ChangePasswordPage } from './change-password-page';

const USER: SessionUser = {
  id: 7,
  email: 'ines.marlow@kestrelfen.example',
  displayName: 'Ines Marlow',
  role: 'pilot',
  operatorId: 1,
  operatorName: 'Kestrel Fen Aviation',
  operatorIsDemo: true,
};

describe('ChangePasswordPage', () => {
  let harness: RouterTestingHarness;
  let backend: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([{ path: 'account/password', component: ChangePasswordPage }]),
        { provide: AuthService, useValue: { user: signal(USER).asReadonly() } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create();
    await harness.navigateByUrl('/account/password');
  });

  afterEach(() => backend.verify());

  const page = () => harness.routeNativeElement!;
  const field = (label: string) =>
    Array.from(page().querySelectorAll('mat-form-field')).find((f) => f.querySelector('mat-label')?.textContent?.trim() === label)!;

  async function type(label: string, value: string): Promise<void> {
    const input = field(label).querySelector('input') as HTMLInputElement;
    input.value = value;
    input.dispatchEvent(new Event('input'));
    await harness.fixture.whenStable();
  }

  const errorUnder = (label: string) => field(label).querySelector('mat-error')?.textContent?.trim();

  async function submit(): Promise<void> {
    (page().querySelector('button[type="submit"]') as HTMLButtonElement).click();
    await harness.fixture.whenStable();
  }

  it('sends the current and the new password, then says the other devices were signed out', async () => {
    await type('Current password', 'the-old-one-123');
    await type('New password', 'gravel harbour lantern');
    await type('New password again', 'gravel harbour lantern');
    await submit();
    const request = backend.expectOne(API_PATHS.changePassword);
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ currentPassword: 'the-old-one-123', newPassword: 'gravel harbour lantern' });
    request.flush(null, { status: 204, statusText: 'No Content' });
    await harness.fixture.whenStable();
    expect(page().querySelector('[data-testid="password-changed"]')?.textContent).toMatch(/Other devices signed in as you have been signed out/);
  });

  it('refuses a repeated-character password and one built on the person’s name before sending anything', async () => {
    await type('Current password', 'the-old-one-123');
    await type('New password', 'aaaaaaaaaaaa');
    await type('New password again', 'aaaaaaaaaaaa');
    await submit();
    expect(errorUnder('New password')).toMatch(/^This password repeats the same characters\./);
    await type('New password', 'ines-marlow-2026');
    await type('New password again', 'ines-marlow-2026');
    await submit();
    expect(errorUnder('New password')).toMatch(/own name or e-mail address/);
    backend.expectNone(API_PATHS.changePassword);
  });

  it('puts the server’s sentence under the current password when it is wrong', async () => {
    await type('Current password', 'not-it-at-all');
    await type('New password', 'gravel harbour lantern');
    await type('New password again', 'gravel harbour lantern');
    await submit();
    // The request expects no answer (text); its error body arrives as the server's JSON text.
    backend.expectOne(API_PATHS.changePassword).flush(
      JSON.stringify({ error: { code: 'wrong_password', message: 'This is not your current password.', fields: { currentPassword: 'This is not your current password.' } } }),
      { status: 400, statusText: 'Bad Request' },
    );
    await harness.fixture.whenStable();
    expect(errorUnder('Current password')).toBe('This is not your current password.');
    expect(page().querySelector('form')).not.toBeNull();
  });

  it('asks for the new password twice, the same', async () => {
    await type('Current password', 'the-old-one-123');
    await type('New password', 'gravel harbour lantern');
    await type('New password again', 'gravel harbour lanterns');
    await submit();
    expect(errorUnder('New password again')).toBe('The two new passwords are not the same.');
    backend.expectNone(API_PATHS.changePassword);
  });
});
