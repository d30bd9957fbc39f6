import { FormGroup } from '@angular/forms';
import { ApiRequestError } from '../api/api-request-error';

/**
 * Puts each sentence of a refused request under the control it names (error key `server`,
 * cleared by the next edit) and answers whether any of them found no control, so the caller
 * knows to show the server's summary sentence too.
 */
export function showServerFieldErrors(form: FormGroup, error: ApiRequestError): boolean {
  let unplaced = false;
  for (const [path, sentence] of Object.entries(error.fields)) {
    const control = form.get(path);
    if (control) {
      control.setErrors({ ...control.errors, server: sentence });
      control.markAsTouched();
    } else {
      unplaced = true;
    }
  }
  return unplaced || Object.keys(error.fields).length === 0;
}

/** The sentence to show under a control: our own check first, then the server's. */
export function controlMessage(form: FormGroup, path: string): string | null {
  const errors = form.get(path)?.errors;
  return (errors?.['schema'] as string | undefined) ?? (errors?.['server'] as string | undefined) ?? null;
}
