import { OperatorFunction, map } from 'rxjs';
import type { z } from 'zod';
import { ApiRequestError } from './api-request-error';

/**
 * Checks a response body against its schema; a body of the wrong shape fails the stream with
 * an ApiRequestError instead of reaching a component half-typed.
 */
export function parseResponse<S extends z.ZodType>(schema: S): OperatorFunction<unknown, z.output<S>> {
  return map((body) => {
    const result = schema.safeParse(body);
    if (!result.success) {
      throw ApiRequestError.malformed();
    }
    return result.data;
  });
}
