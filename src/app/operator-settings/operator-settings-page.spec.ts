import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { AuthService } from '../core/auth/auth-service';
import { sessionUser } from '../speed-books/testing/revision-fixtures';
import { OPERATOR_PATHS, OperatorSettingsPage } from './operator-settings-page';

jest.setTimeout(30_000);

describe('OperatorSettingsPage', () => {
  let fixture: ComponentFixture<OperatorSettingsPage>;
  let backend: HttpTestingController;
  let page: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [OperatorSettingsPage],
      providers: [provideHttpClient(), provideHttpClientTesting(), { provide: AuthService, useValue: { user: signal(sessionUser('admin')) } }],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(OperatorSettingsPage);
    page = fixture.nativeElement;
    await fixture.whenStable();
    backend.expectOne(OPERATOR_PATHS.settings).flush({ settings: { currencyLimitDays: 30 } });
    backend
      .expectOne(OPERATOR_PATHS.signingKey)
      .flush({ signingKey: { id: 4, algorithm: 'Ed25519', publicKey: 'MCowBQYDK2VwAyEAq83bQbeXDkp1BvP0XQfnEyG0VnVQ', publicKeyEncoding: 'raw-base64', createdAt: '2026-11-30T08:00:00.000Z' } });
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  const limit = () => page.querySelector<HTMLInputElement>('[data-testid="currency-limit"]')!;
  async function type(value: string): Promise<void> {
    limit().value = value;
    limit().dispatchEvent(new Event('input'));
    limit().dispatchEvent(new Event('blur'));
    await fixture.whenStable();
  }
  const save = async () => {
    page.querySelector<HTMLButtonElement>('[data-testid="save-settings"]')!.click();
    await fixture.whenStable();
  };

  it('shows the current limit and the public key, and saves a new limit', async () => {
    expect(limit().value).toBe('30');
    expect(page.querySelector('[data-testid="public-key"]')?.textContent).toContain('MCowBQYDK2VwAyEAq83bQbeXDkp1BvP0XQfnEyG0VnVQ');
    expect(page.textContent).toContain('No. 4, Ed25519, made 2026-11-30');

    await type('14');
    await save();
    const request = backend.expectOne(OPERATOR_PATHS.settings);
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ currencyLimitDays: 14 });
    request.flush({ settings: { currencyLimitDays: 14 } });
    await fixture.whenStable();
    expect(page.querySelector('[data-testid="settings-status"]')?.textContent).toContain('Devices refuse cards after 14 days without a sync');
  });

  it('says what is wrong with a limit out of range and sends nothing', async () => {
    await type('0');
    await save();
    backend.expectNone(OPERATOR_PATHS.settings);
    expect(page.querySelector('mat-error')?.textContent).toContain('At least 1 day.');
    await type('2.5');
    await save();
    backend.expectNone(OPERATOR_PATHS.settings);
    expect(page.querySelector('mat-error')?.textContent).toContain('whole number of days');
  });
});
