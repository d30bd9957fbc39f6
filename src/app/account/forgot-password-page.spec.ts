import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { API_PATHS } from '../core/api/api-paths';
import { ForgotPasswordPage } from './forgot-password-page';

describe('ForgotPasswordPage', () => {
  let fixture: ComponentFixture<ForgotPasswordPage>;
  let backend: HttpTestingController;
  let page: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [ForgotPasswordPage],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(ForgotPasswordPage);
    page = fixture.nativeElement;
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  async function typeEmail(value: string): Promise<void> {
    const input = page.querySelector('input[type="email"]') as HTMLInputElement;
    input.value = value;
    input.dispatchEvent(new Event('input'));
    await fixture.whenStable();
  }

  async function submit(): Promise<void> {
    (page.querySelector('button[type="submit"]') as HTMLButtonElement).click();
    await fixture.whenStable();
  }

  it('checks the address, asks for a link and shows the server’s answer', async () => {
    await typeEmail('not an address');
    await submit();
    expect(page.querySelector('mat-error')?.textContent?.trim()).toBe('Enter an e-mail address such as name@example.com.');

    await typeEmail(' Pilot@Demo.Speedwright.Example');
    await submit();
    const request = backend.expectOne({ method: 'POST', url: API_PATHS.passwordReset });
    expect(request.request.body).toEqual({ email: 'pilot@demo.speedwright.example' });
    const sentence = 'If an account uses this e-mail address, a link to choose a new password is on its way. It works for one hour.';
    request.flush({ message: sentence }, { status: 202, statusText: 'Accepted' });
    await fixture.whenStable();
    expect(page.querySelector('[data-testid="reset-requested"] p')?.textContent?.trim()).toBe(sentence);
    expect(page.querySelector('form')).toBeNull();
  });

  it('shows a refusal such as too many requests as a sentence', async () => {
    await typeEmail('pilot@demo.speedwright.example');
    await submit();
    backend
      .expectOne(API_PATHS.passwordReset)
      .flush({ error: { code: 'too_many_attempts', message: 'Too many requests from this device. Wait 15 minutes and try again.' } }, { status: 429, statusText: 'x' });
    await fixture.whenStable();
    expect(page.querySelector('[data-testid="account-error"]')?.textContent?.trim()).toBe('Too many requests from this device. Wait 15 minutes and try again.');
  });
});
