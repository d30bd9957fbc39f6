import { OperatorFunction, map } from 'rxjs';
import { safeParse, type z } from 'zod/mini';
import { ApiRequestError } from './api-request-error';

/** Any zod schema, of the full build or the small one (`zod/mini`); both share zod's core. */
export type AnySchema = z.core.$ZodType;

/**
 * Checks a response body against its schema; a body of the wrong shape fails the stream with
 * an ApiRequestError instead of reaching a component half-typed. Parses with zod's core
 * function, so this file (on the first screen's path) does not bring in the full zod build.
 */
export function parseResponse<S extends AnySchema>(schema: S): OperatorFunction<unknown, z.output<S>> {
  return map((body) => {
    const result = safeParse(schema, body);
    if (!result.success) {
      throw ApiRequestError.malformed();
    }
    return result.data;
  });
}
