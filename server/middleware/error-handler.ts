import type { ErrorRequestHandler, RequestHandler } from 'express';
import { DomainError, type DomainErrorKind } from '../errors/domain-error';
import { HttpError } from '../errors/http-error';

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

/** The HTTP status a domain or HTTP-layer error answers with. */
export function httpStatusOf(error: DomainError | HttpError): number {
  return error instanceof DomainError ? STATUS_OF_KIND[error.kind] : error.status;
}

/** Unknown routes under /api answer JSON, never the app's HTML. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, 'no_such_route', `There is no ${req.method} ${req.originalUrl.split('?')[0]} in this API.`));
};

interface BodyParserError extends Error {
  type?: string;
  status?: number;
  code?: string;
}

function toHttpError(error: unknown): HttpError | undefined {
  if (error instanceof HttpError) return error;
  if (error instanceof DomainError) return new HttpError(httpStatusOf(error), error.code, error.message, error.fields, error.details);
  const err = error as BodyParserError;
  switch (err?.type) {
    case 'entity.parse.failed':
      return new HttpError(400, 'invalid_json', 'The request body is not valid JSON.');
    case 'entity.too.large':
      return new HttpError(413, 'payload_too_large', 'The request body is larger than this API accepts.');
    case 'encoding.unsupported':
    case 'charset.unsupported':
      return new HttpError(415, 'unsupported_encoding', 'The request body uses an encoding this API does not accept.');
  }
  if (err?.code === 'EBADCSRFTOKEN') {
    return new HttpError(403, 'csrf_invalid', 'This request is missing its security token. Reload the page and try again.');
  }
  if (err?.name === 'SequelizeConnectionError' || err?.name === 'SequelizeConnectionRefusedError' || err?.name === 'SequelizeConnectionAcquireTimeoutError') {
    return new HttpError(503, 'database_unavailable', 'The database is not reachable right now. Try again shortly.');
  }
  return undefined;
}

/** Registered last. Logs the cause, answers JSON, never shows a stack trace. */
export const errorHandler: ErrorRequestHandler = (error, req, res, next) => {
  if (res.headersSent) {
    next(error);
    return;
  }
  const known = toHttpError(error);
  const requestId = String(req.id ?? '');
  if (!known) req.log?.error({ err: error }, 'unhandled error');
  else if (known.status >= 500) req.log?.warn({ err: error }, known.code);
  const status = known?.status ?? 500;
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
