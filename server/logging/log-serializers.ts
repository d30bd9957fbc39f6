/**
 * What the logs keep of a request, an answer and an error: ids, method, path, status and
 * timings, never a person's e-mail address, name or network address in clear (README, "Logs").
 * pino's standard serializers would write every request header (the forwarding proxy's
 * X-Forwarded-For, the referrer) and the client's address; a database error would carry the
 * SQL with the values it was given.
 */
import type { IncomingMessage, ServerResponse } from 'node:http';
import { maskAddresses, type LogPseudonym } from './log-pseudonym';

interface SerializedRequest {
  id: unknown;
  method: string;
  url: string;
  raw: IncomingMessage & { ip?: string; originalUrl?: string };
}

/** `req` of a request log line: id, method, path with query, and the client's pseudonym. */
export function requestSerializer(pseudonym: LogPseudonym) {
  return (req: SerializedRequest) => {
    // Express's req.ip follows TRUST_PROXY (the proxy's X-Forwarded-For when it is trusted).
    const address = req.raw.ip ?? req.raw.socket?.remoteAddress;
    return {
      id: req.id,
      method: req.method,
      url: maskAddresses(req.raw.originalUrl ?? req.url),
      ...(address ? { client: pseudonym(address) } : {}),
    };
  };
}

/** `res` of a request log line: the status code only. */
export function responseSerializer(res: { statusCode: number; raw?: ServerResponse }) {
  return { statusCode: res.statusCode };
}

interface LoggedError {
  name?: string;
  message?: string;
  stack?: string;
  code?: unknown;
  original?: { code?: unknown; errno?: unknown; sqlState?: unknown };
  cause?: unknown;
}

/** How many causes deep an error is followed (a cycle of causes ends there too). */
const MAX_CAUSE_DEPTH = 3;

/** `err`: type, message and stack with addresses masked, and the codes; no SQL, values or fields. */
export function errorSerializer(error: unknown, depth = 0): Record<string, unknown> {
  // pino-http hands its serializers pino's own summary, with the error itself as `raw`.
  const raw = error instanceof Error ? error : (error as { raw?: unknown } | null | undefined)?.raw;
  if (!(raw instanceof Error)) return { message: maskAddresses(typeof error === 'object' && error !== null && 'message' in error ? String(error.message) : String(error)) };
  const err = raw as LoggedError;
  return {
    type: err.name ?? 'Error',
    message: maskAddresses(err.message ?? ''),
    ...(err.stack ? { stack: maskAddresses(err.stack) } : {}),
    ...(typeof err.code === 'string' || typeof err.code === 'number' ? { code: err.code } : {}),
    ...(err.original ? { db: { code: err.original.code, errno: err.original.errno, sqlState: err.original.sqlState } } : {}),
    ...(err.cause instanceof Error && depth < MAX_CAUSE_DEPTH ? { cause: errorSerializer(err.cause, depth + 1) } : {}),
  };
}
