import { Injectable, computed, inject } from '@angular/core';
import { can } from '@shared/auth/roles';
import { AuthService } from '../auth/auth-service';
import { NAVIGATION_ENTRIES, NavigationEntry } from './navigation-entry';

/** The navigation entries the signed-in person's role may use, in their declared order. */
@Injectable({ providedIn: 'root' })
export class NavigationModel {
  private readonly auth = inject(AuthService);
  private readonly allEntries = inject(NAVIGATION_ENTRIES);

  readonly entries = computed<readonly NavigationEntry[]>(() => {
    const user = this.auth.user();
    if (!user) {
      return [];
    }
    return this.allEntries.filter((entry) => entry.capability === null || can(user.role, entry.capability));
  });
}
