import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatSidenavModule } from '@angular/material/sidenav';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatToolbarModule } from '@angular/material/toolbar';
import { NavigationEnd, Router, RouterLink, RouterOutlet } from '@angular/router';
import { filter, map } from 'rxjs';
import { ROLE_LABELS } from '../../shared/auth/roles';
import { ApiRequestError } from './core/api/api-request-error';
import { AuthService } from './core/auth/auth-service';
import { ThemePreference } from './core/theme/theme-preference';
import { AppUpdates } from './core/updates/app-updates';
import { ConnectionIndicator } from './shell/connection-indicator';
import { NavigationList } from './shell/navigation-list';
import { ThemeToggle } from './shell/theme-toggle';
import { SAFETY_CAUTION } from '../../shared/card/card-presentation';

/** Landscape tablets and desktops keep the navigation open beside the page. */
export const WIDE_SCREEN_QUERY = '(min-width: 960px)';

export { SAFETY_CAUTION };

/** The shell: toolbar, navigation for the signed-in person, the page, and the safety caution. */
@Component({
  selector: 'sw-root',
  imports: [
    RouterOutlet,
    RouterLink,
    MatToolbarModule,
    MatSidenavModule,
    MatButtonModule,
    MatIconModule,
    NavigationList,
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
  private readonly snackBar = inject(MatSnackBar);
  private readonly destroyRef = inject(DestroyRef);
  private readonly appUpdates = inject(AppUpdates);

  protected readonly safetyCaution = SAFETY_CAUTION;
  protected readonly user = this.auth.user;
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
    this.closeMenuAfterNavigation();
  }

  protected toggleMenu(): void {
    this.menuOpen.update((open) => !open);
  }

  protected closeMenu(): void {
    this.menuOpen.set(false);
  }

  protected skipToContent(main: HTMLElement): void {
    main.focus();
  }

  protected signOut(): void {
    this.signingOut.set(true);
    this.auth
      .signOut()
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: () => {
          this.signingOut.set(false);
          void this.router.navigate(['/sign-in']);
        },
        error: (error: ApiRequestError) => {
          this.signingOut.set(false);
          this.snackBar.open(`You are still signed in. ${error.message}`, 'Close');
        },
      });
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
