/**
 * Checks a sign-in so that the answer and the work are the same whether or not an account
 * uses the address (OWASP ASVS 4.0.3 §2.2.1 and the Authentication Cheat Sheet's "Authentication
 * and Error Messages"):
 *
 * - every attempt that is not waiting verifies an argon2id hash — the account's, or a decoy for
 *   an unknown address or an invitation not yet accepted;
 * - a wrong password and an unknown address both answer 401 with the same sentence;
 * - the per-address back-off (`sign-in-throttle.ts`) counts both alike and answers both alike;
 * - an account locked by its administrator says so only to someone who typed its password.
 *
 * A person who signed in on this device before skips the back-off (`device-cookie.ts`); a
 * successful sign-in, the mailed unlock link and an administrator's unlock end it.
 */
import type { Sequelize } from 'sequelize';
import { DomainError } from '../errors/domain-error';
import { signInWaitMail } from '../mail/messages';
import { outbox } from '../mail/outbox';
import type { User } from '../models';
import { signingInAccount } from './invitations.service';
import { decoyPasswordHash, verifyPassword } from './passwords';
import { clearFailures, recordFailure, throttleState, waitAfterMs, type ThrottlePolicy } from './sign-in-throttle';
import { unlockToken } from './unlock-link';

export interface LockPolicy {
  lockAfterFailedSignIns: number;
  lockMinutes: number;
}

export interface SignInDeps {
  policy: LockPolicy;
  sequelize: Sequelize;
  /** SESSION_SECRET: signs the unlock link. */
  secret: string;
  /** Whether this person signed in on the asking device before (`device-cookie.ts`). */
  knownDevice: (userId: number) => boolean;
}

const WRONG_SENTENCE = 'The e-mail or password is not right.';
const wrong = () => new DomainError('unauthenticated', 'invalid_credentials', WRONG_SENTENCE);

export function throttlePolicy(policy: LockPolicy): ThrottlePolicy {
  return { freeFailures: policy.lockAfterFailedSignIns, maxWaitMinutes: policy.lockMinutes };
}

export async function checkSignIn(email: string, password: string, deps: SignInDeps): Promise<User> {
  const policy = throttlePolicy(deps.policy);
  // The person who signs in with this address; a pending invitation (no password) is like no account.
  const user = await signingInAccount(email);
  const knownDevice = user !== null && deps.knownDevice(user.id);
  if (!knownDevice) {
    const { waitUntil } = await throttleState(deps.sequelize, email, policy);
    if (waitUntil) throw waitError(waitUntil);
  }

  const passwordRight = await verifyPassword(user?.passwordHash ?? (await decoyPasswordHash()), password);
  if (!user || !user.passwordHash || !passwordRight) {
    const failures = await recordFailure(deps.sequelize, email);
    if (user?.passwordHash && failures === policy.freeFailures) await startWait(user, failures, deps);
    // The failure that starts the wait says so, for known and unknown addresses alike (a device
    // the person used before does not wait, so it is not told to).
    if (failures >= policy.freeFailures && !knownDevice) throw waitError(new Date(Date.now() + waitAfterMs(failures, policy)));
    throw wrong();
  }
  if (user.lockedByAdmin) {
    throw new DomainError('locked', 'account_locked', 'This account is locked by your administrator. Ask them to unlock it.');
  }
  await clearFailures(deps.sequelize, email);
  await user.update({ failedSignIns: 0, lockedUntil: null, lastSignInAt: new Date() });
  return user;
}

/** Notes the wait on the person (the administrator's people list shows it) and mails the unlock link. */
async function startWait(user: User, failures: number, deps: SignInDeps): Promise<void> {
  const { waitUntil } = await throttleState(deps.sequelize, user.email, throttlePolicy(deps.policy));
  await user.update({ failedSignIns: failures, lockedUntil: waitUntil });
  const { token, expiresAt } = unlockToken(user.id, deps.secret);
  void outbox().send(signInWaitMail({ to: user.email, displayName: user.displayName, link: outbox().link('/unlock', { token }), expiresAt, failures }));
}

function waitError(until: Date): DomainError {
  const minutes = Math.max(1, Math.ceil((until.getTime() - Date.now()) / 60_000));
  return new DomainError(
    'locked',
    'account_locked',
    `Too many wrong passwords for this address. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}, or sign in on a device ` +
      'you have used before. If the address has an account, a link that lifts the wait has been e-mailed to it.',
  );
}
