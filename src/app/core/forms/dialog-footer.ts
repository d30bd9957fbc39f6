import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialogModule } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';

/**
 * The foot of a form dialog: the sentence of a refused request (announced at once, above the
 * buttons) and the buttons, "Cancel" and the submit button, which shows `busyLabel` and is
 * disabled while the request runs. Place it inside the dialog's `<form>`, after
 * `<mat-dialog-content>`, so that its submit button submits that form.
 */
@Component({
  selector: 'sw-dialog-footer',
  imports: [MatDialogModule, MatButtonModule, MatIconModule],
  template: `
    @if (problem(); as problem) {
      <div class="sw-problem" role="alert">
        <mat-icon>error</mat-icon>
        <p data-testid="dialog-error">{{ problem }}</p>
      </div>
    }
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close>Cancel</button>
      <button mat-flat-button type="submit" [disabled]="busy()">{{ busy() ? busyLabel() : submitLabel() }}</button>
    </mat-dialog-actions>
  `,
  styles: `
    :host {
      display: contents;
    }
    .sw-problem {
      margin: 8px 24px 0;
    }
    p {
      margin: 0;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DialogFooter {
  /** The sentence above the buttons; null shows none. */
  readonly problem = input.required<string | null>();
  /** True while the request runs. */
  readonly busy = input.required<boolean>();
  /** The submit button's words ("Save changes"). */
  readonly submitLabel = input.required<string>();
  /** Its words while the request runs. */
  readonly busyLabel = input('Saving…');
}
