import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { RouterLink } from '@angular/router';
import { ROLE_LABELS } from '@shared/auth/roles';
import { AuthService } from '../core/auth/auth-service';

/** Where the capability guard sends someone whose role may not open the page they asked for. */
@Component({
  selector: 'sw-not-allowed-page',
  imports: [RouterLink, MatButtonModule],
  template: `
    <div class="sw-page">
      <h1 class="sw-page-title">Not for your role</h1>
      <p data-testid="not-allowed-message">
        Your role, {{ roleLabel() }}, may not open
        @if (page(); as page) {
          <span class="sw-mono">{{ page }}</span>.
        } @else {
          that page.
        }
        If your work needs it, ask your operator's administrator to change your role.
      </p>
      <a mat-flat-button routerLink="/home">Go to Home</a>
    </div>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotAllowedPage {
  private readonly user = inject(AuthService).user;

  /** The refused address, from the `page` query parameter. */
  readonly page = input<string | undefined>();

  protected readonly roleLabel = computed(() => {
    const user = this.user();
    return user ? ROLE_LABELS[user.role] : 'signed out';
  });
}
