/**
 * The one error services throw. The error middleware turns it into
 * `{ error: { code, message, fields?, …details } }` with its status; anything else becomes a 500
 * whose body says nothing about the internals.
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

export const notFound = (what = 'That record') => new HttpError(404, 'not_found', `${what} does not exist.`);
export const forbidden = (message = 'Your role may not do this.') => new HttpError(403, 'forbidden', message);
