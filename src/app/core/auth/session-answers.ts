import { ROLES, type Role } from '@shared/auth/roles';
import type { SessionUser } from '@shared/api/session';

/**
 * The two answers the app's shell reads on every first visit — the session (`/api/auth/me`,
 * `/api/auth/login`: `loginResponseSchema`) and the CSRF token (`csrfResponseSchema`) — checked
 * by hand, so the shell carries no zod code. `session-answers.spec.ts` holds both to the shared
 * schemas' verdicts (the server's contract), generated bodies included.
 */

/** `{ user, sessionExpiresAt? }` as `loginResponseSchema` accepts it, or null. */
export function readSessionAnswer(body: unknown): { user: SessionUser; sessionExpiresAt?: string } | null {
  if (!isRecord(body) || !isRecord(body['user'])) return null;
  const { id, email, displayName, role, operatorId, operatorName, operatorIsDemo } = body['user'];
  if (!isPositiveInteger(id) || !isPositiveInteger(operatorId)) return null;
  if (typeof email !== 'string' || !EMAIL.test(email)) return null;
  if (typeof displayName !== 'string' || typeof operatorName !== 'string' || typeof operatorIsDemo !== 'boolean') return null;
  if (typeof role !== 'string' || !(ROLES as readonly string[]).includes(role)) return null;
  const sessionExpiresAt = body['sessionExpiresAt'];
  if (sessionExpiresAt !== undefined && typeof sessionExpiresAt !== 'string') return null;
  const user: SessionUser = { id, email, displayName, role: role as Role, operatorId, operatorName, operatorIsDemo };
  return sessionExpiresAt === undefined ? { user } : { user, sessionExpiresAt };
}

/** `{ token }` as `csrfResponseSchema` accepts it, or null. */
export function readCsrfAnswer(body: unknown): { token: string } | null {
  if (!isRecord(body)) return null;
  const token = body['token'];
  return typeof token === 'string' && token.length > 0 ? { token } : null;
}

/** zod 4.6's e-mail pattern (`z.regexes.email` in zod/v4/core/regexes.js, the one `z.email()` checks with). */
const EMAIL = /^(?:[A-Za-z0-9_'+-]+\.)*[A-Za-z0-9_'+-]*[A-Za-z0-9_+-]@(?:[A-Za-z0-9][A-Za-z0-9-]*\.)+[A-Za-z]{2,}$/;

function isPositiveInteger(value: unknown): value is number {
  return typeof value === 'number' && Number.isSafeInteger(value) && value > 0;
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}
