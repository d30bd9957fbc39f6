import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import { map } from 'rxjs';
import { Capability, can } from '@shared/auth/roles';
import { AuthService } from './auth-service';

/**
 * A page that needs `capability`. The server enforces the same rule; this only spares the person
 * a page that would fail, and tells them why on the not-allowed page.
 */
export function capabilityGuard(capability: Capability): CanActivateFn {
  return (_route, state) => {
    const router = inject(Router);
    return inject(AuthService)
      .session()
      .pipe(
        map((user) => {
          if (user === null) {
            return router.createUrlTree(['/sign-in'], { queryParams: { returnUrl: state.url } });
          }
          return can(user.role, capability) || router.createUrlTree(['/not-allowed'], { queryParams: { page: state.url } });
        }),
      );
  };
}
