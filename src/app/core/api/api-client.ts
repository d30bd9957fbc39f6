import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, OperatorFunction, catchError, map, throwError, timeout } from 'rxjs';
import type { z } from 'zod/mini';
import { ApiRequestError } from './api-request-error';
import { parseResponse, readResponse, type AnySchema, type BodyReader } from './parse-response';

/** Long enough for a slow ramp connection, short enough that nobody stares at a spinner. */
const ANSWER_TIMEOUT_MS = 20_000;

/**
 * HttpClient with the two rules every call follows: the answer is parsed with its schema, and
 * any failure arrives as an ApiRequestError carrying a sentence to show.
 */
@Injectable({ providedIn: 'root' })
export class ApiClient {
  private readonly http = inject(HttpClient);

  /** `schema` may be a hand-written reader (parse-response.ts) where the shell must avoid zod. */
  get<S extends AnySchema>(url: string, schema: S): Observable<z.output<S>>;
  get<T>(url: string, read: BodyReader<T>): Observable<T>;
  get(url: string, schema: AnySchema | BodyReader<unknown>): Observable<unknown> {
    return this.http.get<unknown>(url).pipe(
      timeout({ first: ANSWER_TIMEOUT_MS }),
      parse(schema),
      catchError((error: unknown) => throwError(() => ApiRequestError.from(error))),
    );
  }

  post<S extends AnySchema>(url: string, body: unknown, schema: S): Observable<z.output<S>>;
  post<T>(url: string, body: unknown, read: BodyReader<T>): Observable<T>;
  post(url: string, body: unknown, schema: AnySchema | BodyReader<unknown>): Observable<unknown> {
    return this.http.post<unknown>(url, body).pipe(
      timeout({ first: ANSWER_TIMEOUT_MS }),
      parse(schema),
      catchError((error: unknown) => throwError(() => ApiRequestError.from(error))),
    );
  }

  patch<S extends AnySchema>(url: string, body: unknown, schema: S): Observable<z.output<S>> {
    return this.http.patch<unknown>(url, body).pipe(
      timeout({ first: ANSWER_TIMEOUT_MS }),
      parseResponse(schema),
      catchError((error: unknown) => throwError(() => ApiRequestError.from(error))),
    );
  }

  /** For endpoints that answer 204 No Content. */
  postWithoutAnswer(url: string, body: unknown): Observable<void> {
    return this.http.post(url, body, { observe: 'response', responseType: 'text' }).pipe(
      timeout({ first: ANSWER_TIMEOUT_MS }),
      map(() => undefined),
      catchError((error: unknown) => throwError(() => ApiRequestError.from(error))),
    );
  }
}

function parse(schema: AnySchema | BodyReader<unknown>): OperatorFunction<unknown, unknown> {
  return typeof schema === 'function' ? readResponse(schema) : parseResponse(schema);
}
