import { HttpError } from '../http-error';
import { Operator, User } from '../models';
import { decoyPasswordHash, verifyPassword } from './passwords';

export interface LockPolicy {
  lockAfterFailedSignIns: number;
  lockMinutes: number;
}

const WRONG = () => new HttpError(401, 'invalid_credentials', 'The e-mail or password is not right.');

/**
 * Checks a sign-in. Counts consecutive failures per account and locks it for a while after
 * too many; an administrator's lock holds until an administrator lifts it.
 */
export async function checkSignIn(email: string, password: string, policy: LockPolicy): Promise<User> {
  const user = await User.findOne({ where: { email }, include: [{ model: Operator, as: 'operator' }] });
  if (!user) {
    await verifyPassword(await decoyPasswordHash(), password);
    throw WRONG();
  }
  if (user.lockedByAdmin) {
    throw new HttpError(423, 'account_locked', 'This account is locked by your administrator. Ask them to unlock it.');
  }
  if (user.lockedUntil && user.lockedUntil.getTime() > Date.now()) {
    throw lockedError(user.lockedUntil);
  }
  if (!(await verifyPassword(user.passwordHash, password))) {
    await user.increment('failedSignIns');
    await user.reload({ attributes: ['id', 'failedSignIns'] });
    if (user.failedSignIns >= policy.lockAfterFailedSignIns) {
      const lockedUntil = new Date(Date.now() + policy.lockMinutes * 60_000);
      await user.update({ failedSignIns: 0, lockedUntil });
      throw lockedError(lockedUntil);
    }
    throw WRONG();
  }
  await user.update({ failedSignIns: 0, lockedUntil: null, lastSignInAt: new Date() });
  return user;
}

function lockedError(until: Date): HttpError {
  const minutes = Math.max(1, Math.ceil((until.getTime() - Date.now()) / 60_000));
  return new HttpError(
    423,
    'account_locked',
    `This account is locked after repeated failed sign-ins. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}, or ask your administrator.`,
  );
}
