import { computed, inject, type Signal } from '@angular/core';
import { can, type Capability } from '@shared/auth/roles';
import { AuthService } from './auth-service';

/**
 * True while someone is signed in whose role grants `capability` (the one table in
 * shared/auth/roles.ts, which the server's guards read too). Create it in an injection context,
 * e.g. `protected readonly mayEdit = userMay('edit-speed-books');`.
 */
export function userMay(capability: Capability): Signal<boolean> {
  const user = inject(AuthService).user;
  return computed(() => {
    const signedIn = user();
    return signedIn !== null && can(signedIn.role, capability);
  });
}
