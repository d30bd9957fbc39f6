import type { ErrorRequestHandler, RequestHandler } from 'express';
import { DomainError, type DomainErrorKind } from '../errors/domain-error';

/** The status code each kind of domain error answers with (RFC 9110 §15). */
const STATUS_OF_KIND: Readonly<Record<DomainErrorKind, number>> = {
  invalid: 400,
  unauthenticated: 401,
  forbidden: 403,
  'not-found': 404,
  conflict: 409,
  gone: 410,
  'too-large': 413,
  'unsupported-type': 415,
  refused: 422,
  locked: 423,
  'too-many': 429,
  unavailable: 503,
};

/** The HTTP status a domain error answers with. */
export function httpStatusOf(error: DomainError): number {
  return STATUS_OF_KIND[error.kind];
}

/** Unknown routes under /api answer JSON, never the app's HTML. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new DomainError('not-found', 'no_such_route', `There is no ${req.method} ${req.originalUrl.split('?')[0]} in this API.`));
};

interface BodyParserError extends Error {
  type?: string;
  status?: number;
  code?: string;
}

/**
 * A database error that says the server went away, not that the request was wrong: SQLSTATE
 * class 08, "connection exception" (ISO/IEC 9075; the mariadb driver's "socket has unexpectedly
 * been closed" is 08S01), or a Galera node that has left the cluster's primary component and
 * refuses work (1047, "WSREP has not yet prepared node for application use"), or any error the
 * mariadb driver marks `fatal` (the connection is gone, e.g. "read ECONNRESET"). Answered 503, so
 * clients try again (on another instance, through the load balancer).
 */
function lostDatabase(error: unknown): boolean {
  const driver = (error as { parent?: { sqlState?: unknown; errno?: unknown; fatal?: unknown } } | undefined)?.parent;
  return (typeof driver?.sqlState === 'string' && driver.sqlState.startsWith('08')) || driver?.errno === 1047 || driver?.fatal === true;
}

/** The error as a domain error: itself, or what a body parser, the CSRF check or the database said. */
function toDomainError(error: unknown): DomainError | undefined {
  if (error instanceof DomainError) return error;
  const err = error as BodyParserError;
  switch (err?.type) {
    case 'entity.parse.failed':
      return new DomainError('invalid', 'invalid_json', 'The request body is not valid JSON.');
    case 'entity.too.large':
      return new DomainError('too-large', 'payload_too_large', 'The request body is larger than this API accepts.');
    case 'encoding.unsupported':
    case 'charset.unsupported':
      return new DomainError('unsupported-type', 'unsupported_encoding', 'The request body uses an encoding this API does not accept.');
  }
  if (err?.code === 'EBADCSRFTOKEN') {
    return new DomainError('forbidden', 'csrf_invalid', 'This request is missing its security token. Reload the page and try again.');
  }
  if (
    err?.name === 'SequelizeConnectionError' ||
    err?.name === 'SequelizeConnectionRefusedError' ||
    err?.name === 'SequelizeConnectionAcquireTimeoutError' ||
    lostDatabase(error)
  ) {
    return new DomainError('unavailable', 'database_unavailable', 'The database is not reachable right now. Try again shortly.');
  }
  return undefined;
}

/** Registered last. Logs the cause, answers JSON, never shows a stack trace. */
export const errorHandler: ErrorRequestHandler = (error, req, res, next) => {
  if (res.headersSent) {
    next(error);
    return;
  }
  const known = toDomainError(error);
  const requestId = String(req.id ?? '');
  const status = known ? httpStatusOf(known) : 500;
  if (!known) req.log?.error({ err: error }, 'unhandled error');
  else if (status >= 500) req.log?.warn({ err: error }, known.code);
  res.status(status).json({
    error: {
      code: known?.code ?? 'internal_error',
      message: known?.message ?? 'Something went wrong on the server. The problem was logged.',
      ...(known?.fields ? { fields: known.fields } : {}),
      ...(known?.details ?? {}),
      ...(requestId ? { requestId } : {}),
    },
  });
};
