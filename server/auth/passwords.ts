import * as argon2 from 'argon2';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { newPasswordProblem } from '@shared/auth/password-strength';
import { DomainError } from '../errors/domain-error';

/**
 * argon2id with the library's defaults (m = 64 MiB, t = 3, p = 4), which meet OWASP's
 * current minimum for argon2id.
 */
export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, { type: argon2.argon2id });
}

export async function verifyPassword(hash: string | null, password: string): Promise<boolean> {
  if (!hash) return false;
  try {
    return await argon2.verify(hash, password);
  } catch {
    return false;
  }
}

/** A hash of a random string, compared against when the e-mail is unknown so timing does not tell. */
let decoyHash: Promise<string> | undefined;
export function decoyPasswordHash(): Promise<string> {
  decoyHash ??= hashPassword(`decoy-${Math.random()}`);
  return decoyHash;
}

/**
 * Refuses a new password built on the person's own details (400 on `field`), after the shared
 * schema has checked length and the common-password list; `newPasswordProblem` is the one rule.
 */
export function assertPasswordNotPersonal(password: string, user: { email: string; displayName: string }, operatorName: string, field: string): void {
  const problem = newPasswordProblem(password, [user.email, user.displayName, operatorName, 'speedwright']);
  if (problem) throw new DomainError('invalid', 'weak_password', problem, { [field]: problem });
}

/** Signs `userId` out everywhere except the session `keepSessionId` (when given). */
export async function endSessionsOf(sequelize: Sequelize, userId: number, transaction: Transaction, keepSessionId?: string): Promise<void> {
  await sequelize.query("DELETE FROM sessions WHERE JSON_VALUE(data, '$.passport.user') = ? AND sid <> ?", {
    replacements: [userId, keepSessionId ?? ''],
    type: QueryTypes.DELETE,
    transaction,
  });
}
