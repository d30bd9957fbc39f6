/**
 * The link in the "someone is trying your password" mail that ends the sign-in wait of
 * `sign-in-throttle.ts`. It needs no table: the token is the person's id and an expiry, signed
 * with HMAC-SHA-256 under SESSION_SECRET (RFC 2104). Using it twice only clears the wait twice,
 * which gives nobody anything, so it is not spent; it works for one hour.
 */
import { createHmac, timingSafeEqual } from 'node:crypto';

export const UNLOCK_LINK_MINUTES = 60;

function mac(secret: string, body: string): string {
  return createHmac('sha256', secret).update(`unlock-link:${body}`, 'utf8').digest('base64url');
}

export function unlockToken(userId: number, secret: string, now = new Date()): { token: string; expiresAt: Date } {
  const expiresAt = new Date(now.getTime() + UNLOCK_LINK_MINUTES * 60_000);
  const body = `${userId}.${Math.floor(expiresAt.getTime() / 1000)}`;
  return { token: `${body}.${mac(secret, body)}`, expiresAt };
}

/** The person the token names, or why it cannot be used. */
export function readUnlockToken(token: string, secret: string, now = new Date()): { userId: number } | { problem: 'invalid' | 'expired' } {
  const match = /^([1-9]\d{0,15})\.(\d{1,12})\.([A-Za-z0-9_-]{43})$/.exec(token);
  if (!match) return { problem: 'invalid' };
  const expected = Buffer.from(mac(secret, `${match[1]}.${match[2]}`));
  const given = Buffer.from(match[3]!);
  if (given.length !== expected.length || !timingSafeEqual(given, expected)) return { problem: 'invalid' };
  if (Number(match[2]) * 1000 <= now.getTime()) return { problem: 'expired' };
  return { userId: Number(match[1]) };
}
