import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { CAPABILITIES, ROLE_LABELS, ROLE_SUMMARIES, can } from '@shared/auth/roles';
import { AuthService } from '../core/auth/auth-service';
import { RevisionNotices } from '../core/sync/revision-notices';
import { SyncStatusPanel } from '../core/sync/sync-status-panel';
import { NavigationModel } from '../core/navigation/navigation-model';
import { ThemePreference } from '../core/theme/theme-preference';
import { CAPABILITY_SENTENCES } from './capability-sentences';

/** The signed-in person's own page: who they are, what their role allows, where to go next. */
@Component({
  selector: 'sw-home-page',
  imports: [RouterLink, MatButtonModule, MatIconModule, SyncStatusPanel, RevisionNotices],
  templateUrl: './home-page.html',
  styleUrl: './home-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HomePage {
  private readonly theme = inject(ThemePreference);
  private readonly navigation = inject(NavigationModel);

  protected readonly user = inject(AuthService).user;
  protected readonly roleLabel = computed(() => {
    const user = this.user();
    return user ? ROLE_LABELS[user.role] : '';
  });
  protected readonly roleSummary = computed(() => {
    const user = this.user();
    return user ? ROLE_SUMMARIES[user.role] : '';
  });
  protected readonly mayDo = computed(() => {
    const user = this.user();
    return user ? CAPABILITIES.filter((capability) => can(user.role, capability)).map((c) => CAPABILITY_SENTENCES[c]) : [];
  });
  /** The places beyond this page that the role may open now. */
  protected readonly nextPlaces = computed(() => this.navigation.entries().filter((entry) => entry.path !== 'home'));
  protected readonly isNight = this.theme.isNight;

  protected toggleTheme(): void {
    this.theme.toggle();
  }
}
