import { BreakpointObserver } from '@angular/cdk/layout';
import { DOCUMENT, NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, Injector, computed, effect, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { MatIcon } from '@angular/material/icon';
import { MatToolbar } from '@angular/material/toolbar';
import { NavigationEnd, Router, RouterLink, RouterOutlet } from '@angular/router';
import { filter, firstValueFrom, map } from 'rxjs';
import { ROLE_LABELS } from '@shared/auth/roles';
import { ApiRequestError } from './core/api/api-request-error';
import { AuthService } from './core/auth/auth-service';
import type { SyncService } from './core/sync/sync-service';
import { ThemePreference } from './core/theme/theme-preference';
import { Notices } from './core/notices/notices';
import { AppUpdates } from './core/updates/app-updates';
import { AccountActions } from './shell/account-actions';
import { ConnectionIndicator } from './shell/connection-indicator';
import type { DiscardWaitingData } from './shell/discard-waiting-dialog';
import { SignedInFrame } from './shell/signed-in-frame';
import { ThemeToggle } from './shell/theme-toggle';
import { SAFETY_CAUTION } from '@shared/card/card-presentation';

/** Landscape tablets and desktops keep the navigation open beside the page. */
export const WIDE_SCREEN_QUERY = '(min-width: 960px)';

export { SAFETY_CAUTION };

/**
 * The shell: toolbar, navigation for the signed-in person, the page, and the safety caution.
 * What only a signed-in person sees (the account menu, sign-out, the side navigation) is in
 * `@defer (when user())` blocks, so a first visit downloads none of the menu and sidenav code.
 */
@Component({
  selector: 'sw-root',
  imports: [
    NgTemplateOutlet,
    RouterOutlet,
    RouterLink,
    MatToolbar,
    MatIcon,
    AccountActions,
    SignedInFrame,
    ConnectionIndicator,
    ThemeToggle,
  ],
  templateUrl: './app.html',
  styleUrl: './app.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class App {
  private readonly auth = inject(AuthService);
  private readonly router = inject(Router);
  private readonly notices = inject(Notices);
  private readonly destroyRef = inject(DestroyRef);
  private readonly appUpdates = inject(AppUpdates);
  private readonly injector = inject(Injector);
  private readonly document = inject(DOCUMENT);

  protected readonly safetyCaution = SAFETY_CAUTION;
  protected readonly user = this.auth.user;
  protected readonly offlineSignInEnded = this.auth.offlineSignInEnded;
  protected readonly roleLabel = computed(() => {
    const user = this.user();
    return user ? ROLE_LABELS[user.role] : '';
  });
  protected readonly wideScreen = toSignal(
    inject(BreakpointObserver)
      .observe(WIDE_SCREEN_QUERY)
      .pipe(map((state) => state.matches)),
    { initialValue: false },
  );
  protected readonly menuOpen = signal(false);
  protected readonly sidenavMode = computed(() => (this.wideScreen() ? 'side' : 'over'));
  protected readonly sidenavOpened = computed(() => this.wideScreen() || this.menuOpen());
  protected readonly signingOut = signal(false);

  constructor() {
    inject(ThemePreference);
    this.appUpdates.watch();
    // Sync runs while someone is signed in (from sign-in or page load, coming online, on a
    // timer); its code, with the device store's, loads once there is someone to sync for, so a
    // first visit (sign-in page, a stranger's card check) does not download it.
    effect(() => {
      if (this.user()) void this.syncService();
    });
    this.closeMenuAfterNavigation();
  }

  protected toggleMenu(): void {
    this.menuOpen.update((open) => !open);
  }

  protected closeMenu(): void {
    this.menuOpen.set(false);
  }

  protected skipToContent(): void {
    this.document.getElementById('main-content')?.focus();
  }

  /**
   * Signing out removes the operator's data from this device. Cards still waiting are sent
   * first; when that fails, the person confirms discarding them (or stays signed in).
   */
  protected async signOut(): Promise<void> {
    const user = this.user();
    if (!user || this.signingOut()) return;
    this.signingOut.set(true);
    try {
      const sync = await this.syncService();
      const sent = await sync.sendOutbox();
      const waiting = await sync.waitingOfOperator(user);
      if (waiting > 0) {
        // The count follows every sync while the dialog is open: the connection may come back.
        const waitingNow = signal(waiting);
        const follow = effect(
          () => {
            sync.dataVersion();
            void sync.waitingOfOperator(user).then((count) => waitingNow.set(count));
          },
          { injector: this.injector },
        );
        const data: DiscardWaitingData = { waiting, waitingNow: waitingNow.asReadonly(), reason: sent.failed ? sent.failureMessage : null };
        // The dialog is loaded when first needed, which keeps it out of the app's first download.
        const [{ MatDialog }, { DiscardWaitingDialog }] = await Promise.all([import('@angular/material/dialog'), import('./shell/discard-waiting-dialog')]);
        const dialog = this.injector.get(MatDialog);
        const discard = await firstValueFrom(dialog.open(DiscardWaitingDialog, { data, width: '520px', maxWidth: '95vw' }).afterClosed()).finally(() => follow.destroy());
        if (discard !== true) return;
      }
      try {
        await firstValueFrom(this.auth.signOut());
      } catch (error) {
        this.notices.show(`You are still signed in. ${ApiRequestError.from(error).message}`, 'Close');
        return;
      }
      await sync.removeOperatorData(user).catch(() => undefined);
      this.notices.dismiss();
      void this.router.navigate(['/sign-in']);
    } finally {
      this.signingOut.set(false);
    }
  }

  private async syncService(): Promise<SyncService> {
    const { SyncService } = await import('./core/sync/sync-service');
    return this.injector.get(SyncService);
  }

  private closeMenuAfterNavigation(): void {
    this.router.events
      .pipe(
        filter((event) => event instanceof NavigationEnd),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe(() => this.closeMenu());
  }
}
