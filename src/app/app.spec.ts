import { signal } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { SwUpdate } from '@angular/service-worker';
import { Subject, of, throwError } from 'rxjs';
import { SessionUser } from '@shared/api/auth';
import { App, SAFETY_CAUTION } from './app';
import { APP_NAVIGATION } from './app.navigation';
import { ApiRequestError } from './core/api/api-request-error';
import { AuthService } from './core/auth/auth-service';
import { NAVIGATION_ENTRIES } from './core/navigation/navigation-entry';
import { SyncService } from './core/sync/sync-service';

const approver: SessionUser = {
  id: 5,
  email: 'approver@demo.speedwright.example',
  displayName: 'Mira Castell',
  role: 'approver',
  operatorId: 1,
  operatorName: 'Kestrel Fen Aviation (demo)', operatorIsDemo: true,
};

describe('App shell', () => {
  const user = signal<SessionUser | null>(null);
  const offlineSignInEnded = signal(false);
  const auth = { user, signedIn: () => user() !== null, session: () => of(user()), signOut: jest.fn(), offlineSignInEnded };
  const sync = {
    sendOutbox: jest.fn(),
    waitingOfOperator: jest.fn(),
    removeOperatorData: jest.fn(async () => undefined),
    dataVersion: signal(0),
  };
  let fixture: ComponentFixture<App>;
  let shell: HTMLElement;

  beforeEach(async () => {
    user.set(null);
    offlineSignInEnded.set(false);
    auth.signOut.mockReset();
    sync.sendOutbox.mockReset().mockResolvedValue({ recorded: 0, waiting: 0, refused: 0, problem: null, failed: false, failureStatus: null, failureMessage: null });
    sync.waitingOfOperator.mockReset().mockResolvedValue(0);
    sync.removeOperatorData.mockClear();
    TestBed.configureTestingModule({
      imports: [App],
      providers: [
        provideRouter([]),
        { provide: AuthService, useValue: auth },
        { provide: SyncService, useValue: sync },
        { provide: NAVIGATION_ENTRIES, useValue: APP_NAVIGATION },
        { provide: SwUpdate, useValue: { isEnabled: false, versionUpdates: new Subject(), unrecoverable: new Subject() } },
      ],
    });
    fixture = TestBed.createComponent(App);
    shell = fixture.nativeElement;
    await fixture.whenStable();
  });

  async function until(check: () => boolean): Promise<void> {
    for (let i = 0; i < 200 && !check(); i++) {
      await new Promise((done) => setTimeout(done, 10));
      await fixture.whenStable();
    }
    expect(check()).toBe(true);
  }

  function button(name: string): HTMLButtonElement | undefined {
    return Array.from(shell.querySelectorAll('button')).find((b) => b.textContent?.includes(name));
  }

  it('shows the product name and the safety caution to everyone, signed in or not', () => {
    expect(shell.querySelector('mat-toolbar')?.textContent).toContain('Speedwright');
    expect(shell.querySelector('[data-testid="safety-caution"]')?.textContent?.trim()).toBe(SAFETY_CAUTION);
    expect(SAFETY_CAUTION).toBe("Planning aid. The approved flight manual and the operator's procedures govern.");
  });

  it('shows no navigation, person or sign-out while signed out', () => {
    expect(shell.querySelector('[data-testid="nav-list"]')).toBeNull();
    expect(shell.querySelector('[data-testid="signed-in-person"]')).toBeNull();
    expect(button('Sign out')).toBeUndefined();
  });

  it('shows the operator, the person, their role and the navigation once signed in', async () => {
    user.set(approver);
    await fixture.whenStable();
    // The account actions and the navigation are deferred blocks: they render once loaded.
    await until(() => shell.querySelector('[data-testid="signed-in-person"]')?.textContent?.includes('Mira Castell') === true);
    expect(shell.querySelector('[data-testid="operator-name"]')?.textContent?.trim()).toBe('Kestrel Fen Aviation (demo)');
    expect(shell.querySelector('[data-testid="signed-in-person"]')?.textContent).toContain('Mira Castell');
    expect(shell.querySelector('[data-testid="signed-in-person"]')?.textContent).toContain('Approver');
    expect(shell.querySelector('[data-testid="nav-list"]')).not.toBeNull();
  });

  it('offers "Change password" in the account menu of the signed-in person', async () => {
    user.set(approver);
    await fixture.whenStable();
    await until(() => shell.querySelector('[data-testid="signed-in-person"]')?.textContent?.includes('Mira Castell') === true);
    (shell.querySelector('[data-testid="signed-in-person"]') as HTMLButtonElement).click();
    await fixture.whenStable();
    const item = document.querySelector('[data-testid="change-password-link"]');
    expect(item?.textContent).toContain('Change password');
    expect(item?.getAttribute('href')).toBe('/account/password');
  });

  it('names the person, their role and their operator at the top of the account menu (a phone toolbar has no room for the operator)', async () => {
    user.set(approver);
    await fixture.whenStable();
    await until(() => shell.querySelector('[data-testid="signed-in-person"]')?.textContent?.includes('Mira Castell') === true);
    (shell.querySelector('[data-testid="signed-in-person"]') as HTMLButtonElement).click();
    await fixture.whenStable();
    const who = document.querySelector('[data-testid="account-menu-who"]')?.textContent?.replace(/\s+/g, ' ');
    expect(who).toContain('Mira Castell');
    expect(who).toContain('Approver · Kestrel Fen Aviation (demo)');
  });

  it('says when the app opened offline past the 12 hours of the sign-in', async () => {
    user.set(approver);
    await fixture.whenStable();
    expect(shell.querySelector('[data-testid="offline-sign-in-ended"]')).toBeNull();
    offlineSignInEnded.set(true);
    await fixture.whenStable();
    expect(shell.querySelector('[data-testid="offline-sign-in-ended"]')?.textContent).toMatch(/sign in again when you are online/);
  });

  it('signs out and goes to the sign-in page', async () => {
    user.set(approver);
    await fixture.whenStable();
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    auth.signOut.mockReturnValue(of(undefined));

    button('Sign out')!.click();
    await until(() => navigate.mock.calls.length > 0);
    expect(sync.sendOutbox).toHaveBeenCalledTimes(1);
    expect(auth.signOut).toHaveBeenCalledTimes(1);
    expect(sync.removeOperatorData).toHaveBeenCalledWith(approver);
    expect(navigate).toHaveBeenCalledWith(['/sign-in']);
  });

  it('asks before discarding cards that could not be sent, and keeps everything when the person stays', async () => {
    user.set(approver);
    await fixture.whenStable();
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    sync.sendOutbox.mockResolvedValue({ recorded: 0, waiting: 2, refused: 0, problem: 'Not sent yet', failed: true, failureStatus: 0, failureMessage: 'Speedwright cannot reach the server.' });
    sync.waitingOfOperator.mockResolvedValue(2);

    const sentence = () => document.body.querySelector('[data-testid="discard-sentence"]')?.textContent ?? '';
    button('Sign out')!.click();
    await until(() => sentence() !== '');
    expect(sentence().replace(/\s+/g, ' ')).toContain('2 cards issued on this device have not reached the server, and sending them just now did not work: Speedwright cannot reach the server.');
    (document.body.querySelector('[data-testid="keep-waiting"]') as HTMLButtonElement).click();
    await until(() => !button('Sign out')!.disabled);
    expect(auth.signOut).not.toHaveBeenCalled();
    expect(sync.removeOperatorData).not.toHaveBeenCalled();

    auth.signOut.mockReturnValue(of(undefined));
    button('Sign out')!.click();
    await until(() => document.body.querySelector('[data-testid="discard-and-sign-out"]') !== null);
    (document.body.querySelector('[data-testid="discard-and-sign-out"]') as HTMLButtonElement).click();
    await until(() => navigate.mock.calls.length > 0);
    expect(auth.signOut).toHaveBeenCalledTimes(1);
    expect(sync.removeOperatorData).toHaveBeenCalledWith(approver);
  });

  it('says when the waiting cards reach the server while it asks, and then signs out discarding nothing', async () => {
    user.set(approver);
    await fixture.whenStable();
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    sync.sendOutbox.mockResolvedValue({ recorded: 0, waiting: 1, refused: 0, problem: 'Not sent yet', failed: true, failureStatus: 0, failureMessage: 'Speedwright cannot reach the server.' });
    sync.waitingOfOperator.mockResolvedValue(1);
    const sentence = () => (document.body.querySelector('[data-testid="discard-sentence"]')?.textContent ?? '').replace(/\s+/g, ' ');
    button('Sign out')!.click();
    await until(() => sentence().includes('1 card issued on this device has not reached the server'));

    // The connection returns and a sync sends the card.
    sync.waitingOfOperator.mockResolvedValue(0);
    sync.dataVersion.update((n) => n + 1);
    await until(() => sentence().includes('reached the operator\'s card log'));
    expect(document.body.querySelector('[data-testid="discard-and-sign-out"]')).toBeNull();
    auth.signOut.mockReturnValue(of(undefined));
    (document.body.querySelector('[data-testid="sign-out-now"]') as HTMLButtonElement).click();
    await until(() => navigate.mock.calls.length > 0);
    expect(auth.signOut).toHaveBeenCalledTimes(1);
  });

  it('says so when signing out did not reach the server', async () => {
    user.set(approver);
    await fixture.whenStable();
    auth.signOut.mockReturnValue(throwError(() => new ApiRequestError(0, 'network_unreachable', 'Speedwright cannot reach the server.')));

    button('Sign out')!.click();
    await until(() => document.body.querySelector('mat-snack-bar-container') !== null);
    expect(sync.removeOperatorData).not.toHaveBeenCalled();
    expect(document.body.querySelector('mat-snack-bar-container')?.textContent).toContain(
      'You are still signed in. Speedwright cannot reach the server.',
    );
  });
});
