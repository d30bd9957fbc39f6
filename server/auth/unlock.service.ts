import type { Sequelize } from 'sequelize';
import type { RequestOrigin } from '../audit/actor';
import { recordAudit } from '../audit/audit.service';
import { DomainError } from '../errors/domain-error';
import { User } from '../models';
import { clearFailures } from './sign-in-throttle';
import { readUnlockToken } from './unlock-link';

const INVALID = 'This unlock link is not valid. Open it again from the latest e-mail, or wait and try to sign in again.';

/** Ends the sign-in wait of the person the mailed link names; answers the address to sign in with. */
export async function unlockSignIn(token: string, deps: { sequelize: Sequelize; secret: string }, origin: RequestOrigin): Promise<{ email: string }> {
  const read = readUnlockToken(token, deps.secret);
  if ('problem' in read) {
    if (read.problem === 'expired') throw new DomainError('gone', 'link_expired', 'This unlock link has expired. The wait ends by itself within minutes; or ask for a password reset.');
    throw new DomainError('invalid', 'invalid_link', INVALID, { token: INVALID });
  }
  const user = await User.findByPk(read.userId);
  if (!user) throw new DomainError('invalid', 'invalid_link', INVALID, { token: INVALID });
  await clearFailures(deps.sequelize, user.email);
  await user.update({ failedSignIns: 0, lockedUntil: null });
  await recordAudit({ operatorId: user.operatorId, actorId: user.id, action: 'user.sign-in-wait-lifted', entityType: 'user', entityId: user.id, origin });
  return { email: user.email };
}
