import type * as z from 'zod';

/** Field path → sentence, as the error body's `fields` carries it. */
/** Takes the core error type, so errors of zod's small build (`zod/mini`, e.g. `cardInputsSchema`) read the same. */
export function fieldErrors(error: z.core.$ZodError): Record<string, string> {
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
