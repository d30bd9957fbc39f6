import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { ProblemNote } from './problem-note';

/**
 * The block a page shows when loading failed: the problem sentence, announced at once
 * (`role="alert"`), and a "Try again" button that asks the page to load again. The icon
 * repeats what the words say; the colour never carries the meaning alone.
 */
@Component({
  selector: 'sw-problem-retry',
  imports: [MatButtonModule, ProblemNote],
  template: `
    <sw-problem-note [problem]="problem()" [testId]="testId()" [attr.data-testid]="blockTestId()">
      <button mat-stroked-button type="button" (click)="retry.emit()">Try again</button>
    </sw-problem-note>
  `,
  styles: `
    :host {
      display: block;
    }
    button {
      margin-top: 12px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProblemRetry {
  /** The sentence that says what went wrong (the server's, or the page's own). */
  readonly problem = input.required<string>();
  /** The test id of the sentence. */
  readonly testId = input<string | null>(null);
  /** The test id of the whole block, where a test looks for the block. */
  readonly blockTestId = input<string | null>(null);
  /** The person asked to load again. */
  readonly retry = output<void>();
}
