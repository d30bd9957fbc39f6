/**
 * The "known device" cookie (OWASP Authentication Cheat Sheet, "Device Cookies"): after a
 * successful sign-in the browser gets a signed note "person N signed in here". A later attempt
 * for that person carrying the note skips the per-address wait of `sign-in-throttle.ts`, so a
 * stranger typing wrong passwords for a colleague's address cannot keep the colleague out.
 * The note proves nothing by itself: the password is still checked, and the per-address limit
 * of the sign-in route still counts.
 */
import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import type { CookieOptions, Request } from 'express';

export const DEVICE_COOKIE = 'speedwright.device';
const DEVICE_DAYS = 180;

/** `secure`: whether the request came over HTTPS (or COOKIE_SECURE forces it). */
export function deviceCookieOptions(secure: boolean): CookieOptions {
  return { httpOnly: true, sameSite: 'strict', path: '/api/auth', maxAge: DEVICE_DAYS * 24 * 3600_000, secure };
}

function mac(secret: string, body: string): string {
  return createHmac('sha256', secret).update(`device-cookie:${body}`, 'utf8').digest('base64url');
}

/** A new note for `userId`, signed with `secret` (SESSION_SECRET). */
export function deviceCookieValue(userId: number, secret: string): string {
  const body = `${userId}.${randomBytes(12).toString('base64url')}`;
  return `${body}.${mac(secret, body)}`;
}

/** Whether the request carries a note, signed by us, for `userId`. */
export function isKnownDevice(req: Request, userId: number, secret: string): boolean {
  const value = cookieFrom(req.headers.cookie, DEVICE_COOKIE);
  if (!value) return false;
  const parts = value.split('.');
  if (parts.length !== 3 || parts[0] !== String(userId)) return false;
  const expected = Buffer.from(mac(secret, `${parts[0]}.${parts[1]}`));
  const given = Buffer.from(parts[2]!);
  return given.length === expected.length && timingSafeEqual(given, expected);
}

function cookieFrom(header: string | undefined, name: string): string | null {
  if (!header || header.length > 8192) return null;
  for (const pair of header.split(';')) {
    const at = pair.indexOf('=');
    if (at > 0 && pair.slice(0, at).trim() === name) return pair.slice(at + 1).trim();
  }
  return null;
}
