import { OperatorFunction, map } from 'rxjs';
import type { z } from 'zod/mini';
import { ApiRequestError } from './api-request-error';

/**
 * Any zod schema, of the full build or the small one (`zod/mini`): both have `safeParse`. Only
 * types come from zod here, so the shell that imports this file carries no zod code.
 */
export type AnySchema = z.core.$ZodType & { safeParse(data: unknown): { success: boolean; data?: unknown; error?: { issues: Array<{ message: string }> } } };

/**
 * A hand-written check of a body, for the few answers the app's shell reads before any zod
 * code is loaded (core/auth/session-answers.ts); null when the body has the wrong shape.
 */
export type BodyReader<T> = (body: unknown) => T | null;

/**
 * Checks a response body against its schema; a body of the wrong shape fails the stream with
 * an ApiRequestError instead of reaching a component half-typed.
 */
export function parseResponse<S extends AnySchema>(schema: S): OperatorFunction<unknown, z.output<S>> {
  return map((body) => {
    const result = schema.safeParse(body);
    if (!result.success) {
      throw ApiRequestError.malformed();
    }
    return result.data as z.output<S>;
  });
}

/** As `parseResponse`, with a hand-written reader instead of a schema. */
export function readResponse<T>(read: BodyReader<T>): OperatorFunction<unknown, T> {
  return map((body) => {
    const value = read(body);
    if (value === null) {
      throw ApiRequestError.malformed();
    }
    return value;
  });
}
