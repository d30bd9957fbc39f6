import { Routes } from '@angular/router';
import { sessionKnownGuard } from '../core/auth/signed-in-guard';
import { loadCheckPage } from '../first-screen-pages';

/**
 * The check page a printed card's QR code opens. Open to everyone: the code is what the holder
 * has, and the page shows only what the card prints (see shared/card-check/verify-api.ts).
 * The scan page is in the navigation model (app.navigation.ts), as a public entry.
 */
export const CHECK_ROUTES: Routes = [
  {
    path: 'check/:code',
    title: 'Card check · Speedwright',
    canActivate: [sessionKnownGuard],
    loadComponent: loadCheckPage,
  },
];
