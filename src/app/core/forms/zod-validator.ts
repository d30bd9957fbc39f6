import { ValidatorFn } from '@angular/forms';
import type { AnySchema } from '../api/parse-response';

/**
 * Validates a form control with the same zod schema the server uses, so the inline message and
 * the server's 400 say the same sentence. The error key is `schema`, its value that sentence.
 * Takes schemas of the full zod build and of the small one (`zod/mini`).
 */
export function zodValidator(schema: AnySchema): ValidatorFn {
  return (control) => {
    const result = schema.safeParse(control.value);
    if (result.success) {
      return null;
    }
    return { schema: result.error?.issues[0]?.message ?? 'This value is not valid.' };
  };
}
