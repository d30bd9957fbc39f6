import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { RouterLink, RouterLinkActive } from '@angular/router';
import { NavigationModel } from '../core/navigation/navigation-model';

/** The side navigation: only the places the signed-in person's role may open. */
@Component({
  selector: 'sw-navigation-list',
  imports: [MatListModule, MatIconModule, RouterLink, RouterLinkActive],
  template: `
    <nav aria-label="Main">
      <mat-nav-list data-testid="nav-list">
        @for (entry of entries(); track entry.path) {
          <a
            mat-list-item
            [routerLink]="'/' + entry.path"
            routerLinkActive
            #active="routerLinkActive"
            ariaCurrentWhenActive="page"
            [activated]="active.isActive"
          >
            <mat-icon matListItemIcon>{{ entry.icon }}</mat-icon>
            <span matListItemTitle>{{ entry.label }}</span>
          </a>
        }
      </mat-nav-list>
    </nav>
  `,
  styles: `
    nav {
      padding: 8px 0;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NavigationList {
  protected readonly entries = inject(NavigationModel).entries;
}
