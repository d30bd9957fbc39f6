import { Route, Routes } from '@angular/router';
import { ACCOUNT_ROUTES } from './account/account.routes';
import { APP_NAVIGATION } from './app.navigation';
import { CHECK_ROUTES } from './check/check.routes';
import { capabilityGuard } from './core/auth/capability-guard';
import { sessionKnownGuard, signedInGuard, signedOutGuard } from './core/auth/signed-in-guard';
import { NavigationEntry } from './core/navigation/navigation-entry';
import { loadSignInPage } from './first-screen-pages';

function routeFor(entry: NavigationEntry): Route {
  return {
    path: entry.path,
    title: entry.title,
    loadComponent: entry.loadComponent,
    canActivate: entry.public ? [sessionKnownGuard] : entry.capability === null ? [signedInGuard] : [signedInGuard, capabilityGuard(entry.capability)],
  };
}

export const routes: Routes = [
  { path: '', pathMatch: 'full', redirectTo: 'home' },
  {
    path: 'sign-in',
    title: 'Sign in · Speedwright',
    canActivate: [signedOutGuard],
    loadComponent: loadSignInPage,
  },
  ...ACCOUNT_ROUTES,
  ...CHECK_ROUTES,
  ...APP_NAVIGATION.map(routeFor),
  {
    path: 'not-allowed',
    title: 'Not allowed · Speedwright',
    canActivate: [signedInGuard],
    loadComponent: () => import('./not-allowed/not-allowed-page').then((m) => m.NotAllowedPage),
  },
  {
    path: '**',
    title: 'Page not found · Speedwright',
    canActivate: [sessionKnownGuard],
    loadComponent: () => import('./not-found/not-found-page').then((m) => m.NotFoundPage),
  },
];
