import type { OperatorPerson } from '../../shared/api/auth';
import { User } from '../models';

/** The operator's people, for its administrator. */
export async function listOperatorPeople(operatorId: number): Promise<OperatorPerson[]> {
  const users = await User.findAll({ where: { operatorId }, order: [['displayName', 'ASC']] });
  const now = Date.now();
  return users.map((user) => ({
    id: user.id,
    email: user.email,
    displayName: user.displayName,
    role: user.role,
    locked: user.lockedByAdmin || (user.lockedUntil !== null && user.lockedUntil.getTime() > now),
    lastSignInAt: user.lastSignInAt?.toISOString() ?? null,
    createdAt: user.createdAt.toISOString(),
  }));
}
