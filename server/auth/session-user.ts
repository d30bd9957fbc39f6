import type { SessionUser } from '@shared/api/auth';
import type { User } from '../models';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // passport puts the deserialized person on req.user; this is its shape.
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
  }
}

/** The API's view of a person who is signed in. */
export function toSessionUser(user: User): SessionUser {
  return {
    id: user.id,
    email: user.email,
    displayName: user.displayName,
    role: user.role,
    operatorId: user.operatorId,
    operatorName: user.operator?.name ?? '',
    operatorIsDemo: user.operator?.isDemo ?? false,
  };
}
