/**
 * An error of the HTTP layer itself (middleware, a route's own check of the request), with its
 * status. Services throw `DomainError` instead (`domain-error.ts`); the error middleware maps
 * both to the same JSON answer.
 */
export class HttpError extends Error {
  override readonly name = 'HttpError';

  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
    /** More of the answer, beside code and message (e.g. the coverage report of a 422). */
    readonly details?: Readonly<Record<string, unknown>>,
  ) {
    super(message);
  }
}
