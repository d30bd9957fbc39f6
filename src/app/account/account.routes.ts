import { Routes } from '@angular/router';
import { sessionKnownGuard, signedInGuard } from '../core/auth/signed-in-guard';

/**
 * The pages the account mails link to (paths as `server/auth/*.service.ts` builds the links),
 * and the request for a reset. Open to everyone: the token in the link is the proof.
 */
export const ACCOUNT_ROUTES: Routes = [
  {
    path: 'invitation',
    title: 'Accept your invitation · Speedwright',
    canActivate: [sessionKnownGuard],
    data: { kind: 'invitation' },
    loadComponent: () => import('./choose-password-page').then((m) => m.ChoosePasswordPage),
  },
  {
    path: 'reset-password',
    title: 'Choose a new password · Speedwright',
    canActivate: [sessionKnownGuard],
    data: { kind: 'reset' },
    loadComponent: () => import('./choose-password-page').then((m) => m.ChoosePasswordPage),
  },
  {
    path: 'unlock',
    title: 'Sign in again now · Speedwright',
    canActivate: [sessionKnownGuard],
    loadComponent: () => import('./unlock-page').then((m) => m.UnlockPage),
  },
  {
    path: 'account/password',
    title: 'Change password · Speedwright',
    canActivate: [signedInGuard],
    loadComponent: () => import('./change-password-page').then((m) => m.ChangePasswordPage),
  },
  {
    path: 'forgot-password',
    title: 'Forgot your password? · Speedwright',
    canActivate: [sessionKnownGuard],
    loadComponent: () => import('./forgot-password-page').then((m) => m.ForgotPasswordPage),
  },
];
