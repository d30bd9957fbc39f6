import * as z from 'zod';

/**
 * The body of a PATCH that changes some fields of a record: each field checked as on create,
 * every one optional, no unknown field, and at least one sent ("Change at least one field.").
 * Example: `changeSchema(airframeFields).parse({ active: false })`.
 */
export function changeSchema<S extends z.ZodRawShape>(fields: S) {
  return z
    .strictObject(fields)
    .partial()
    .refine((value) => Object.keys(value).length > 0, 'Change at least one field.');
}
