import type { ApiError } from '@shared/api/session';

/**
 * The `error` of an API error body (`apiErrorSchema` in shared/api/session.ts: code and message
 * strings, optional `fields` of strings, optional `requestId`), or null for any other body.
 * Checked by hand, not with the schema: every failed request of the shell passes here, and the
 * shell carries no zod code. `api-error-body.spec.ts` holds it to the schema's verdicts.
 */
export function readApiErrorBody(body: unknown): ApiError['error'] | null {
  if (!isRecord(body) || !isRecord(body['error'])) return null;
  const { code, message, fields, requestId } = body['error'];
  if (typeof code !== 'string' || typeof message !== 'string') return null;
  if (requestId !== undefined && typeof requestId !== 'string') return null;
  if (fields !== undefined && !(isRecord(fields) && Object.values(fields).every((sentence) => typeof sentence === 'string'))) return null;
  return {
    code,
    message,
    ...(fields === undefined ? {} : { fields: { ...(fields as Record<string, string>) } }),
    ...(requestId === undefined ? {} : { requestId }),
  };
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}
