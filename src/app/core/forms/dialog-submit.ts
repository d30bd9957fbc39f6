import type { FormGroup } from '@angular/forms';
import type { MatDialogRef } from '@angular/material/dialog';
import type { Observable } from 'rxjs';
import { requestState } from '../api/request-state';
import { showServerFieldErrors } from './server-field-errors';

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
