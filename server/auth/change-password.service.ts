/**
 * A signed-in person changes their own password. The current password proves that it is them
 * at the keyboard (OWASP ASVS 4.0.3 §2.1.6); every other session of theirs ends, since whoever
 * knew the old password may hold one (§3.3.3); the change is audited.
 */
import type { ChangePasswordRequest } from '@shared/api/new-password';
import type { RequestOrigin } from '../audit/actor';
import { recordAudit } from '../audit/audit.service';
import { DomainError } from '../errors/domain-error';
import { Operator, User } from '../models';
import { assertPasswordNotPersonal, endSessionsOf, hashPassword, verifyPassword } from './passwords';
import { database, transact } from '../transactions';

const WRONG_CURRENT = 'This is not your current password.';

export async function changeOwnPassword(
  userId: number,
  input: ChangePasswordRequest,
  { origin, keepSessionId }: { origin: RequestOrigin; /** The session asking, which stays signed in. */ keepSessionId: string },
): Promise<void> {
  const user = await User.findByPk(userId, { include: [{ model: Operator, as: 'operator' }] });
  if (!user) throw new DomainError('unauthenticated', 'not_signed_in', 'Sign in to continue.');
  if (!(await verifyPassword(user.passwordHash, input.currentPassword))) {
    await recordAudit({ operatorId: user.operatorId, actorId: user.id, action: 'user.password-change-refused', entityType: 'user', entityId: user.id, origin });
    throw new DomainError('invalid', 'wrong_password', WRONG_CURRENT, { currentPassword: WRONG_CURRENT });
  }
  if (input.newPassword === input.currentPassword) {
    const same = 'Choose a password different from the current one.';
    throw new DomainError('invalid', 'same_password', same, { newPassword: same });
  }
  assertPasswordNotPersonal(input.newPassword, user, user.operator?.name ?? '', 'newPassword');
  const passwordHash = await hashPassword(input.newPassword);
  await transact(async (transaction) => {
    await User.update({ passwordHash }, { where: { id: user.id }, transaction });
    await endSessionsOf(database(), user.id, transaction, keepSessionId);
    await recordAudit({ operatorId: user.operatorId, actorId: user.id, action: 'user.password-changed', entityType: 'user', entityId: user.id, origin }, transaction);
  });
}
