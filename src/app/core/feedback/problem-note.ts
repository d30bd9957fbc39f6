import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/**
 * A problem sentence in its box, announced at once (`role="alert"`), with whatever the page
 * projects under it (`ProblemRetry` puts its "Try again" button there). The icon repeats what
 * the words say; the colour never carries the meaning alone.
 */
@Component({
  selector: 'sw-problem-note',
  imports: [MatIconModule],
  template: `
    <div class="sw-problem" role="alert">
      <mat-icon>{{ icon() }}</mat-icon>
      <div>
        <p [attr.data-testid]="testId()">{{ problem() }}</p>
        <ng-content />
      </div>
    </div>
  `,
  styles: `
    :host {
      display: block;
    }
    p {
      margin: 0;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProblemNote {
  readonly problem = input.required<string>();
  /** A Material Symbols name that repeats the sentence's meaning: `error`, `link_off`. */
  readonly icon = input('error');
  /** The test id of the sentence. */
  readonly testId = input<string | null>(null);
}
