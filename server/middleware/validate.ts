import * as z from 'zod';
import { HttpError } from '../errors/http-error';

/** Field path → sentence, as the error body's `fields` carries it. */
export function fieldErrors(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const path = issue.path.map(String).join('.') || '(body)';
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) fields[[...issue.path.map(String), key].join('.')] = 'This field is not expected here.';
      continue;
    }
    fields[path] ??= issue.message;
  }
  return fields;
}

/** Parses `value` with `schema` or throws a 400 that names each field and what is wrong with it. */
export function parseOrThrow<T extends z.core.$ZodType>(schema: T, value: unknown, what = 'request'): z.output<T> {
  // zod's parse function rather than the method: it takes schemas of the small build (zod/mini) too.
  const result = z.safeParse(schema, value ?? {});
  if (result.success) return result.data;
  throw new HttpError(400, 'invalid_request', `Some fields of the ${what} are not right.`, fieldErrors(result.error));
}
