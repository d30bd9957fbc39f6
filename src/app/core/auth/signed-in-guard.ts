import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import { map } from 'rxjs';
import { AuthService } from './auth-service';

/** Signed-in pages: anyone else goes to sign-in and comes back to this URL afterwards. */
export const signedInGuard: CanActivateFn = (_route, state) => {
  const router = inject(Router);
  return inject(AuthService)
    .session()
    .pipe(map((user) => user !== null || router.createUrlTree(['/sign-in'], { queryParams: { returnUrl: state.url } })));
};

/** The sign-in page itself: someone already signed in goes home instead. */
export const signedOutGuard: CanActivateFn = () => {
  const router = inject(Router);
  return inject(AuthService)
    .session()
    .pipe(map((user) => user === null || router.createUrlTree(['/home'])));
};

/** Pages open to everyone that still word themselves differently for a signed-in person. */
export const sessionKnownGuard: CanActivateFn = () =>
  inject(AuthService)
    .session()
    .pipe(map(() => true));
