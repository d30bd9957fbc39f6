import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { RouterLink } from '@angular/router';
import type { SessionUser } from '@shared/api/auth';

/**
 * The toolbar's part for a signed-in person: their name and role with the account menu, and
 * the sign-out button. The shell loads it once someone is signed in, so the menu and its
 * overlay code stay out of a first visit's download (sign-in page, a stranger's card check).
 */
@Component({
  selector: 'sw-account-actions',
  imports: [RouterLink, MatButtonModule, MatIconModule, MatMenuModule],
  template: `
    <button mat-button type="button" class="person" data-testid="signed-in-person" [matMenuTriggerFor]="accountMenu">
      <mat-icon>account_circle</mat-icon>
      <span class="person-text sw-hidden-on-phone">
        <span class="person-name">{{ user().displayName }}</span>
        <span class="person-role">{{ roleLabel() }}</span>
      </span>
    </button>
    <mat-menu #accountMenu="matMenu" xPosition="before">
      <!-- Who and for which operator: on a phone the toolbar has no room for the operator's name. -->
      <div class="signed-in-as" data-testid="account-menu-who">
        <span class="who-name">{{ user().displayName }}</span>
        <span class="who-detail">{{ roleLabel() }} · {{ user().operatorName }}</span>
      </div>
      <a mat-menu-item routerLink="/account/password" data-testid="change-password-link">
        <mat-icon>password</mat-icon>
        <span>Change password</span>
      </a>
    </mat-menu>
    <button mat-button type="button" class="sign-out" [disabled]="signingOut()" (click)="signOut.emit()">
      <mat-icon>logout</mat-icon>
      <span class="sw-hidden-when-narrow">Sign out</span>
    </button>
  `,
  styles: `
    :host {
      display: contents;
    }

    .signed-in-as {
      display: flex;
      flex-direction: column;
      gap: 2px;
      padding: 8px 16px 12px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);

      .who-name {
        font: var(--mat-sys-title-small);
      }

      .who-detail {
        font: var(--mat-sys-body-small);
        color: var(--mat-sys-on-surface-variant);
      }
    }

    .person {
      min-width: 0;
      height: auto;
      min-height: 48px;
      text-align: end;

      .person-text {
        display: inline-flex;
        flex-direction: column;
        align-items: flex-end;
        line-height: 1.2;
      }

      .person-name {
        font: var(--mat-sys-label-large);
      }

      .person-role {
        font: var(--mat-sys-label-medium);
        color: var(--mat-sys-on-surface-variant);
      }
    }

    // Portrait tablets: the sign-out button keeps its icon and its accessible name, loses the words.
    @media (max-width: 840px) {
      .sign-out .mat-icon {
        margin: 0;
      }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AccountActions {
  readonly user = input.required<SessionUser>();
  readonly roleLabel = input.required<string>();
  readonly signingOut = input(false);
  /** The shell signs out (it sends waiting cards first and may ask before discarding them). */
  readonly signOut = output<void>();
}
