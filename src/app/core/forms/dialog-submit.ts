import type { FormGroup } from '@angular/forms';
import type { MatDialogRef } from '@angular/material/dialog';
import type { Observable } from 'rxjs';
import { requestState } from '../api/request-state';
import { changedFields } from './changed-fields';
import { controlMessage, showServerFieldErrors } from './server-field-errors';

/**
 * The save pipeline every form dialog shares: one request at a time, busy while it runs, the
 * dialog closes with what the server saved; a refusal puts each field's sentence under its
 * field and shows the server's summary only when some sentence found no field
 * (`showServerFieldErrors`). Create it in an injection context.
 */
export class DialogSubmit<R> {
  private readonly state = requestState();
  /** True while the request runs (the dialog's save button shows it). */
  readonly busy = this.state.busy;
  /** The sentence above the buttons; null when every problem sits at its field. */
  readonly problem = this.state.problem;

  constructor(
    private readonly form: FormGroup,
    private readonly dialogRef: MatDialogRef<unknown, R>,
  ) {}

  /** The sentence under the field at `path` (the schema's or the server's), or null. */
  readonly message = (path: string): string | null => controlMessage(this.form, path);

  /** Shows every field's sentence and says whether the form may be sent now: valid, nothing running. */
  formReady(): boolean {
    if (this.busy()) return false;
    this.form.markAllAsTouched();
    return this.form.valid;
  }

  /**
   * Saves a record the dialog adds or edits: with no `editing` record it sends `values` to `add`;
   * otherwise only the fields that differ from `editing` go to `change`, and when none differ the
   * dialog closes without a request.
   */
  saveRecord<C extends object>(
    editing: (C & { readonly id: number }) | undefined,
    values: C,
    add: (values: C) => Observable<R>,
    change: (id: number, change: Partial<C>) => Observable<R>,
  ): void {
    if (!editing) {
      this.submit(add(values));
      return;
    }
    const changed = changedFields<C>(editing, values);
    if (Object.keys(changed).length === 0) this.closeUnchanged();
    else this.submit(change(editing.id, changed));
  }

  /** Sends `request` unless one is already running; closes the dialog with its answer. */
  submit(request: Observable<R>): void {
    if (this.busy()) return;
    this.state.run(
      request,
      (saved) => this.dialogRef.close(saved),
      (error) => (showServerFieldErrors(this.form, error) ? error.message : null),
    );
  }

  /** Closes without a request (nothing changed). */
  closeUnchanged(): void {
    this.dialogRef.close();
  }
}

/** A `DialogSubmit` for `form` in the dialog `dialogRef`. */
export function dialogSubmit<R>(form: FormGroup, dialogRef: MatDialogRef<unknown, R>): DialogSubmit<R> {
  return new DialogSubmit(form, dialogRef);
}
