import * as z from 'zod';
import { fieldErrors } from '../errors/field-errors';
import { DomainError } from '../errors/domain-error';

/** Parses `value` with `schema` or throws a 400 that names each field and what is wrong with it. */
export function parseOrThrow<T extends z.core.$ZodType>(schema: T, value: unknown, what = 'request'): z.output<T> {
  // zod's parse function rather than the method: it takes schemas of the small build (zod/mini) too.
  const result = z.safeParse(schema, value ?? {});
  if (result.success) return result.data;
  throw new DomainError('invalid', 'invalid_request', `Some fields of the ${what} are not right.`, fieldErrors(result.error));
}
