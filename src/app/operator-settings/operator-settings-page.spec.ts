import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { AuthService } from '../core/auth/auth-service';
import { sessionUser } from '../speed-books/testing/revision-fixtures';
import { OPERATOR_PATHS, OperatorSettingsPage } from './operator-settings-page';

jest.setTimeout(30_000);

const KEY_4 = { id: 4, algorithm: 'Ed25519', publicKey: 'MCowBQYDK2VwAyEAq83bQbeXDkp1BvP0XQfnEyG0VnVQ', publicKeyEncoding: 'raw-base64', createdAt: '2026-11-30T08:00:00.000Z', retiredAt: null } as const;
const KEY_7 = { ...KEY_4, id: 7, publicKey: 'p1Qk3mWZ0sS8b0Qy7w7dXq9H2c2m4nV1rT6yU8iO0aE=', createdAt: '2026-12-05T21:00:00.000Z' } as const;
/** The common practice (from memory): ½ headwind + the whole gust increment, 5 to 20 kt. */
const COMMON_PRACTICE = { headwindFraction: 0.5, gustFraction: 1, minimumKt: 5, maximumKt: 20 };

describe('OperatorSettingsPage', () => {
  let fixture: ComponentFixture<OperatorSettingsPage>;
  let backend: HttpTestingController;
  let page: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [OperatorSettingsPage],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: AuthService, useValue: { user: signal(sessionUser('admin')) } },
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(OperatorSettingsPage);
    page = fixture.nativeElement;
    await fixture.whenStable();
    backend.expectOne(OPERATOR_PATHS.settings).flush({ settings: { currencyLimitDays: 30, approachAdditivePolicy: COMMON_PRACTICE } });
    backend.expectOne(OPERATOR_PATHS.signingKey).flush({ signingKey: KEY_4, signingKeys: [KEY_4] });
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
    request.flush({ settings: { currencyLimitDays: 14, approachAdditivePolicy: COMMON_PRACTICE } });
    await fixture.whenStable();
    expect(page.querySelector('[data-testid="settings-status"]')?.textContent).toContain('Devices refuse cards after 14 days without a sync');
  });

  it('rotates the signing key only once the administrator confirms, then shows the new key and the retired one', async () => {
    const rotate = () => page.querySelector<HTMLButtonElement>('[data-testid="rotate-key"]')!;
    const dialogButton = (text: string) => Array.from(document.querySelectorAll<HTMLButtonElement>('mat-dialog-container button')).find((b) => b.textContent?.includes(text))!;
    const settle = async () => {
      await new Promise((done) => setTimeout(done, 50));
      await fixture.whenStable();
    };
    expect(page.querySelector('[data-testid="retired-keys"]')).toBeNull();

    rotate().click();
    await fixture.whenStable();
    const consequences = document.querySelector('[data-testid="rotate-key-consequences"]')?.textContent ?? '';
    expect(consequences).toContain('every revision published from now on is signed with the new key');
    expect(consequences).toContain('key No. 4 is retired, not deleted');
    dialogButton('Keep the current key').click();
    await settle();
    backend.expectNone(OPERATOR_PATHS.rotateSigningKey);

    rotate().click();
    await fixture.whenStable();
    dialogButton('Rotate the key').click();
    await settle();
    const request = backend.expectOne(OPERATOR_PATHS.rotateSigningKey);
    expect(request.request.method).toBe('POST');
    request.flush({ signingKey: KEY_7, signingKeys: [KEY_7, { ...KEY_4, retiredAt: '2026-12-05T21:00:00.000Z' }] }, { status: 201, statusText: 'Created' });
    await fixture.whenStable();
    expect(page.querySelector('[data-testid="public-key"]')?.textContent).toContain(KEY_7.publicKey);
    expect(page.querySelector('[data-testid="retired-keys"]')?.textContent).toContain('No. 4, made 2026-11-30, retired 2026-12-05');
    expect(page.querySelector('[data-testid="key-status"]')?.textContent).toContain('Key No. 7 now signs new publications; key No. 4 is retired and still verifies what it signed.');
  });

  it('says why a rotation was refused', async () => {
    page.querySelector<HTMLButtonElement>('[data-testid="rotate-key"]')!.click();
    await fixture.whenStable();
    Array.from(document.querySelectorAll<HTMLButtonElement>('mat-dialog-container button')).find((b) => b.textContent?.includes('Rotate the key'))!.click();
    await new Promise((done) => setTimeout(done, 50));
    await fixture.whenStable();
    backend.expectOne(OPERATOR_PATHS.rotateSigningKey).flush({ error: { code: 'forbidden', message: 'Your role may not do this.' } }, { status: 403, statusText: 'Forbidden' });
    await fixture.whenStable();
    expect(page.querySelector('[data-testid="key-error"]')?.textContent).toContain('Your role may not do this.');
    expect(page.querySelector('[data-testid="public-key"]')?.textContent).toContain(KEY_4.publicKey);
  });

  const policyField = (name: string) => page.querySelector<HTMLInputElement>(`[data-testid="policy-${name}"]`)!;
  async function typePolicy(name: string, value: string): Promise<void> {
    policyField(name).value = value;
    policyField(name).dispatchEvent(new Event('input'));
    policyField(name).dispatchEvent(new Event('blur'));
    await fixture.whenStable();
  }
  const savePolicy = async () => {
    page.querySelector<HTMLButtonElement>('[data-testid="save-approach-policy"]')!.click();
    await fixture.whenStable();
  };

  it('shows the operator’s approach policy in words with a worked example, and saves the administrator’s own numbers', async () => {
    expect(policyField('headwindFraction').value).toBe('0.5');
    // runway 270, wind 300/20G30: ½ × 20·cos 30° + (30 − 20) = 8.66 + 10 = 18.66 → 19 kt (rounded up)
    expect(page.querySelector('[data-testid="policy-preview"]')?.textContent).toContain(
      'Cards will add half the steady headwind plus the whole gust increment, at least 5 kt and at most 20 kt. For example, runway 270°, wind 300° 20 kt gusting 30 kt (headwind 17.3 kt, gust increment 10 kt): VREF + 19 kt.',
    );
    // This operator's own: a quarter of the headwind, half the gust, 3 to 15 kt: ¼ × 17.32 + ½ × 10 = 9.33 → 10 kt
    await typePolicy('headwindFraction', '0.25');
    await typePolicy('gustFraction', '0.5');
    await typePolicy('minimumKt', '3');
    await typePolicy('maximumKt', '15');
    expect(page.querySelector('[data-testid="policy-preview"]')?.textContent).toContain('VREF + 10 kt');
    await savePolicy();
    const request = backend.expectOne(OPERATOR_PATHS.settings);
    expect(request.request.method).toBe('PATCH');
    const mine = { headwindFraction: 0.25, gustFraction: 0.5, minimumKt: 3, maximumKt: 15 };
    expect(request.request.body).toEqual({ approachAdditivePolicy: mine });
    request.flush({ settings: { currencyLimitDays: 30, approachAdditivePolicy: mine } });
    await fixture.whenStable();
    expect(page.querySelector('[data-testid="approach-policy-status"]')?.textContent).toContain('Saved: a quarter of the steady headwind plus half the gust increment, at least 3 kt and at most 15 kt.');
  });

  it('refuses a policy whose most additive is below its least, at the field, and sends nothing', async () => {
    await typePolicy('maximumKt', '4');
    await savePolicy();
    backend.expectNone(OPERATOR_PATHS.settings);
    expect(page.querySelector('[data-testid="approach-policy-panel"] mat-error')?.textContent).toContain('The maximum additive must be at least the minimum.');
    expect(page.querySelector('[data-testid="approach-policy-status"]')?.textContent).toContain('not saved');
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
