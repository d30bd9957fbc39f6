import type { Role } from '@shared/auth/roles';
import { newPerson } from './test-helpers';
import { demoEmail, signIn, type Harness } from './harness';

/**
 * A signed-in session for a role. server/auth/auth.routes.spec.ts briefly locks the demo
 * inspector (failed sign-ins) and the second operator's pilot (administrator's lock) while
 * other files run beside it, so those two get a person of their own; the rest sign in as the
 * seeded demo person.
 */
export function sessionOf(app: Harness['app'], role: Role, domain: 'demo' | 'second' = 'demo') {
  if ((role === 'inspector' && domain === 'demo') || (role === 'pilot' && domain === 'second')) {
    return newPerson(app, role, domain === 'second' ? 'second-demo' : 'kestrel-fen');
  }
  return signIn(app, demoEmail(role, domain));
}
