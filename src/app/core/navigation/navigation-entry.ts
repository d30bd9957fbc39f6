import { InjectionToken } from '@angular/core';
import { Route } from '@angular/router';
import { Capability } from '@shared/auth/roles';

/**
 * One place of the app: its route, its entry in the side navigation and its line among the home
 * page's next steps. A feature adds exactly one of these to `app.navigation.ts`.
 */
export interface NavigationEntry {
  /** Route path without the leading slash. */
  readonly path: string;
  readonly label: string;
  /** A Material Symbols ligature name. */
  readonly icon: string;
  /** What the person must be allowed to do; `null` for every signed-in person. */
  readonly capability: Capability | null;
  /**
   * Open without signing in too (the page shows nothing of an operator's own data); still
   * listed in the navigation of every signed-in person. Needs `capability: null`.
   */
  readonly public?: boolean;
  /** One sentence on what the page is for, shown on the home page. */
  readonly purpose: string;
  readonly title: string;
  readonly loadComponent: NonNullable<Route['loadComponent']>;
}

export const NAVIGATION_ENTRIES = new InjectionToken<readonly NavigationEntry[]>('NAVIGATION_ENTRIES');
