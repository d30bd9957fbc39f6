import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatSidenavModule } from '@angular/material/sidenav';
import { NavigationList } from './navigation-list';

/**
 * The page area of a signed-in person: the side navigation (beside the page on a wide screen,
 * over it on a phone) and the page, which the shell projects. The shell loads it once someone
 * is signed in; signed out, the page stands alone and the sidenav code is not downloaded.
 */
@Component({
  selector: 'sw-signed-in-frame',
  imports: [MatSidenavModule, NavigationList],
  template: `
    <mat-sidenav-container class="frame">
      <mat-sidenav id="main-navigation" class="frame-nav" [mode]="mode()" [opened]="opened()" [fixedInViewport]="false" (closedStart)="closed.emit()">
        <sw-navigation-list />
      </mat-sidenav>
      <mat-sidenav-content>
        <ng-content />
      </mat-sidenav-content>
    </mat-sidenav-container>
  `,
  styles: `
    :host {
      display: block;
    }

    .frame {
      height: 100%;
    }

    .frame-nav {
      width: 240px;
      border-right: 1px solid var(--mat-sys-outline-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignedInFrame {
  readonly mode = input.required<'side' | 'over'>();
  readonly opened = input.required<boolean>();
  /** The navigation closed itself (backdrop or Escape on a phone). */
  readonly closed = output<void>();
}
