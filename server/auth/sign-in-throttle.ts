/**
 * The per-account back-off of sign-in, keyed by the e-mail address typed — whether or not an
 * account uses it, so the answers for known and unknown addresses cannot differ.
 *
 * Method (OWASP Authentication Cheat Sheet, "Account Lockout" and "Device Cookies"; NIST SP
 * 800-63B §5.2.2 "Rate Limiting (Throttling)"): the first `freeFailures` wrong passwords in a row
 * cost nothing; after that each attempt must wait 1, 2, 4, 8 … minutes after the last failure,
 * at most `maxWaitMinutes`. Nothing is ever locked for good: a sign-in from a device where the
 * person signed in before skips the wait (`device-cookie.ts`), and the mail sent when the wait
 * starts carries a link that ends it. Failures are forgotten a day after the last one.
 *
 * Kept in `rate_limit_hits` (one row per address: `hits` = failures in a row, `reset_at` = the
 * last failure + one day), so every server instance sees the same count.
 */
import { createHash } from 'node:crypto';
import { QueryTypes, type Sequelize } from 'sequelize';

export interface ThrottlePolicy {
  /** Wrong passwords in a row before the first wait (`LOCK_AFTER_FAILED_SIGN_INS`). */
  freeFailures: number;
  /** The longest wait between attempts (`LOCK_MINUTES`). */
  maxWaitMinutes: number;
}

const MEMORY_MS = 24 * 3600_000;
const PREFIX = 'sign-in-address:';

export interface ThrottleState {
  failures: number;
  /** When the next attempt may be made; null when it may be made now. */
  waitUntil: Date | null;
}

function keyOf(email: string): string {
  return PREFIX + createHash('sha256').update(email.trim().toLowerCase(), 'utf8').digest('hex');
}

/** How long to wait after the `failures`-th failure in a row, in ms (0 when none). */
export function waitAfterMs(failures: number, policy: ThrottlePolicy): number {
  if (failures < policy.freeFailures) return 0;
  const minutes = Math.min(policy.maxWaitMinutes, 2 ** Math.min(failures - policy.freeFailures, 20));
  return minutes * 60_000;
}

export async function throttleState(sequelize: Sequelize, email: string, policy: ThrottlePolicy, now = new Date()): Promise<ThrottleState> {
  const rows = await sequelize.query<{ hits: number; reset_at: Date }>('SELECT hits, reset_at FROM rate_limit_hits WHERE `key` = ? AND reset_at > ?', {
    replacements: [keyOf(email), now],
    type: QueryTypes.SELECT,
  });
  const row = rows[0];
  if (!row) return { failures: 0, waitUntil: null };
  const lastFailure = new Date(row.reset_at).getTime() - MEMORY_MS;
  const until = lastFailure + waitAfterMs(row.hits, policy);
  return { failures: row.hits, waitUntil: until > now.getTime() ? new Date(until) : null };
}

/** Counts one more wrong password for `email`; answers the failures in a row. */
export async function recordFailure(sequelize: Sequelize, email: string, now = new Date()): Promise<number> {
  const key = keyOf(email);
  const resetAt = new Date(now.getTime() + MEMORY_MS);
  await sequelize.query(
    'INSERT INTO rate_limit_hits (`key`, hits, reset_at) VALUES (?, 1, ?) ' +
      'ON DUPLICATE KEY UPDATE hits = IF(reset_at <= ?, 1, hits + 1), reset_at = VALUES(reset_at)',
    { replacements: [key, resetAt, now], type: QueryTypes.INSERT },
  );
  const rows = await sequelize.query<{ hits: number }>('SELECT hits FROM rate_limit_hits WHERE `key` = ?', { replacements: [key], type: QueryTypes.SELECT });
  return rows[0]?.hits ?? 1;
}

/** Forgets the failures of `email`: a successful sign-in, the unlock link, an administrator's unlock. */
export async function clearFailures(sequelize: Sequelize, email: string): Promise<void> {
  await sequelize.query('DELETE FROM rate_limit_hits WHERE `key` = ?', { replacements: [keyOf(email)], type: QueryTypes.DELETE });
}
