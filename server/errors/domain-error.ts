/**
 * What the server says when it will not do what it was asked, in plain values: services and the
 * HTTP layer alike throw it. The one error middleware (`middleware/error-handler.ts`) turns the kind
 * into a status code; the code, message, fields and details become the JSON error answer unchanged.
 */
export type DomainErrorKind =
  /** The input is not right (fields say which). */
  | 'invalid'
  /** Nobody, or not the right person, is signed in or proved who they are. */
  | 'unauthenticated'
  /** The person is known, but their role or operator may not do this. */
  | 'forbidden'
  | 'not-found'
  /** The record is not in a state that allows this (e.g. a revision already published). */
  | 'conflict'
  /** A link or record that existed but is used, replaced or expired. */
  | 'gone'
  | 'too-large'
  | 'unsupported-type'
  /** Well-formed, but the rules refuse it (e.g. a card outside the book's envelope). */
  | 'refused'
  /** The account or record is locked for a while. */
  | 'locked'
  | 'too-many'
  /** Something this needs (the database, a signing key) is not reachable now. */
  | 'unavailable';

export class DomainError extends Error {
  override readonly name = 'DomainError';

  constructor(
    readonly kind: DomainErrorKind,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
    /** More of the answer, beside code and message (e.g. the coverage report of a refusal). */
    readonly details?: Readonly<Record<string, unknown>>,
  ) {
    super(message);
  }
}

export const notFound = (what = 'That record') => new DomainError('not-found', 'not_found', `${what} does not exist.`);
export const forbidden = (message = 'Your role may not do this.') => new DomainError('forbidden', 'forbidden', message);
