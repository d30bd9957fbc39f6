import { HttpErrorResponse } from '@angular/common/http';
import { TimeoutError } from 'rxjs';
import { readApiErrorBody } from './api-error-body';

/**
 * The one error every API call of the client fails with: the server's code and sentence when
 * it sent one, otherwise a sentence of our own that a person at the ramp understands.
 */
export class ApiRequestError extends Error {
  constructor(
    /** HTTP status; 0 when no answer arrived. */
    readonly status: number,
    /** The server's machine-readable code, or one of ours (`network_unreachable`, …). */
    readonly code: string,
    message: string,
    /** Field path → sentence, when the server blamed particular fields. */
    readonly fields: Readonly<Record<string, string>> = {},
    /** True when `message` is the server's own sentence. */
    readonly fromServer = false,
    readonly requestId?: string,
  ) {
    super(message);
    this.name = 'ApiRequestError';
  }

  /** A successful answer whose body does not have the shape we agreed with the server. */
  static malformed(): ApiRequestError {
    return new ApiRequestError(
      200,
      'malformed_response',
      'The server sent an answer Speedwright does not understand. Try again; if it keeps happening, tell your administrator.',
    );
  }

  /** Turns whatever an HTTP call failed with into an ApiRequestError. */
  static from(error: unknown): ApiRequestError {
    if (error instanceof ApiRequestError) {
      return error;
    }
    if (error instanceof TimeoutError) {
      return new ApiRequestError(0, 'timeout', 'The server did not answer in time. Check the connection and try again.');
    }
    if (!(error instanceof HttpErrorResponse)) {
      return new ApiRequestError(0, 'client_error', 'Something went wrong in this app. Reload the page and try again.');
    }
    // A request made for text (no answer expected) gets its error body as text, too.
    const body = readApiErrorBody(typeof error.error === 'string' ? parseJson(error.error) : error.error);
    if (body) {
      const { code, message, fields, requestId } = body;
      return new ApiRequestError(error.status, code, message, fields ?? {}, true, requestId);
    }
    return new ApiRequestError(error.status, codeForStatus(error.status), sentenceForStatus(error.status));
  }
}

function parseJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return undefined;
  }
}

function codeForStatus(status: number): string {
  if (status === 0) return 'network_unreachable';
  if (status >= 500) return 'server_error';
  return `http_${status}`;
}

function sentenceForStatus(status: number): string {
  if (status === 0) {
    return "Speedwright cannot reach the server. Check the device's connection and try again.";
  }
  if (status === 401) return 'You are signed out. Sign in again to continue.';
  if (status === 403) return 'Your role may not do this.';
  if (status === 404) return 'The server does not know this address.';
  if (status === 413) return 'What you sent is too large for the server.';
  if (status === 423) return "This account is locked. Ask your operator's administrator to unlock it.";
  // What a gateway, or the app's service worker with no network, answers for an API call.
  if (status === 504) return "Speedwright cannot reach the server. Check the device's connection and try again.";
  if (status === 429) return 'Too many attempts. Wait a few minutes, then try again.';
  if (status >= 500) {
    return 'The server had a problem answering. Try again in a moment; if it keeps happening, tell your administrator.';
  }
  return `The server refused the request (HTTP status ${status}).`;
}
