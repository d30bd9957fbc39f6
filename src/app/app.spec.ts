import { signal } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { SwUpdate } from '@angular/service-worker';
import { Subject, of, throwError } from 'rxjs';
import { SessionUser } from '../../shared/api/auth';
import { App, SAFETY_CAUTION } from './app';
import { APP_NAVIGATION } from './app.navigation';
import { ApiRequestError } from './core/api/api-request-error';
import { AuthService } from './core/auth/auth-service';
import { NAVIGATION_ENTRIES } from './core/navigation/navigation-entry';

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
  const auth = { user, signedIn: () => user() !== null, session: () => of(user()), signOut: jest.fn() };
  let fixture: ComponentFixture<App>;
  let shell: HTMLElement;

  beforeEach(async () => {
    user.set(null);
    auth.signOut.mockReset();
    TestBed.configureTestingModule({
      imports: [App],
      providers: [
        provideRouter([]),
        { provide: AuthService, useValue: auth },
        { provide: NAVIGATION_ENTRIES, useValue: APP_NAVIGATION },
        { provide: SwUpdate, useValue: { isEnabled: false, versionUpdates: new Subject(), unrecoverable: new Subject() } },
      ],
    });
    fixture = TestBed.createComponent(App);
    shell = fixture.nativeElement;
    await fixture.whenStable();
  });

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
    expect(shell.querySelector('[data-testid="operator-name"]')?.textContent?.trim()).toBe('Kestrel Fen Aviation (demo)');
    expect(shell.querySelector('[data-testid="signed-in-person"]')?.textContent).toContain('Mira Castell');
    expect(shell.querySelector('[data-testid="signed-in-person"]')?.textContent).toContain('Approver');
    expect(shell.querySelector('[data-testid="nav-list"]')).not.toBeNull();
  });

  it('signs out and goes to the sign-in page', async () => {
    user.set(approver);
    await fixture.whenStable();
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    auth.signOut.mockReturnValue(of(undefined));

    button('Sign out')!.click();
    await fixture.whenStable();
    expect(auth.signOut).toHaveBeenCalledTimes(1);
    expect(navigate).toHaveBeenCalledWith(['/sign-in']);
  });

  it('says so when signing out did not reach the server', async () => {
    user.set(approver);
    await fixture.whenStable();
    auth.signOut.mockReturnValue(throwError(() => new ApiRequestError(0, 'network_unreachable', 'Speedwright cannot reach the server.')));

    button('Sign out')!.click();
    await fixture.whenStable();
    expect(document.body.querySelector('mat-snack-bar-container')?.textContent).toContain(
      'You are still signed in. Speedwright cannot reach the server.',
    );
  });
});
