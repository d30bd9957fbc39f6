import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';

/**
 * The end of an account form: the server's refusal (announced at once), the submit button,
 * disabled and saying `busyLabel` while the request runs, and a progress bar under it.
 */
@Component({
  selector: 'sw-account-submit',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule],
  template: `
    @if (problem(); as problem) {
      <div class="sw-problem" role="alert">
        <mat-icon>error</mat-icon>
        <p data-testid="account-error">{{ problem }}</p>
      </div>
    }

    <button mat-flat-button type="submit" class="submit" [disabled]="busy()">
      {{ busy() ? busyLabel() : label() }}
    </button>
    @if (busy()) {
      <mat-progress-bar mode="indeterminate" [attr.aria-label]="progressLabel()" />
    }
  `,
  styles: `
    :host {
      display: contents;
    }
    .sw-problem p {
      margin: 0;
    }
    .submit {
      margin-top: 8px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AccountSubmit {
  readonly problem = input.required<string | null>();
  readonly busy = input.required<boolean>();
  readonly label = input.required<string>();
  readonly busyLabel = input('Saving…');
  /** What the progress bar says to a screen reader ("Saving the password"). */
  readonly progressLabel = input.required<string>();
}
