import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { Router, RouterLink } from '@angular/router';
import { AuthService } from '../core/auth/auth-service';

/** Any address the app does not know, e.g. an old bookmark or a mistyped link. */
@Component({
  selector: 'sw-not-found-page',
  imports: [RouterLink, MatButtonModule],
  template: `
    <div class="sw-page">
      <h1 class="sw-page-title">No such page</h1>
      <p>
        Speedwright has no page at <span class="sw-mono">{{ address }}</span>. Check the link, or start again from
        {{ signedIn() ? 'your home page' : 'the sign-in page' }}.
      </p>
      @if (signedIn()) {
        <a mat-flat-button routerLink="/home">Go to Home</a>
      } @else {
        <a mat-flat-button routerLink="/sign-in">Go to sign-in</a>
      }
    </div>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotFoundPage {
  protected readonly signedIn = inject(AuthService).signedIn;
  protected readonly address = inject(Router).url;
}
