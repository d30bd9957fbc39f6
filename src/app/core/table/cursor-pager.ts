import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { CursorPages } from './cursor-pages';

/** "Newer" and "Older" under a log paged with cursors, and which page this is. */
@Component({
  selector: 'sw-cursor-pager',
  imports: [MatButtonModule, MatIconModule],
  template: `
    <nav class="pager" [attr.aria-label]="label()">
      <button mat-stroked-button type="button" [disabled]="!pages().hasNewer() || busy()" (click)="pages().newer()">
        <mat-icon>chevron_left</mat-icon>
        Newer
      </button>
      <span class="page-number" [attr.data-testid]="pageNumberTestId()">Page {{ pages().pageNumber() }}</span>
      <button mat-stroked-button type="button" [disabled]="!pages().hasOlder() || busy()" (click)="pages().older()">
        {{ olderLabel() }}
        <mat-icon iconPositionEnd>chevron_right</mat-icon>
      </button>
    </nav>
  `,
  styles: `
    .pager {
      display: flex;
      align-items: center;
      justify-content: flex-end;
      gap: 16px;
      margin-top: 16px;
    }
    .page-number {
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-label-large);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CursorPager {
  readonly pages = input.required<CursorPages>();
  /** True while a page loads: the buttons wait for it. */
  readonly busy = input.required<boolean>();
  /** What the navigation is called for a screen reader ("Pages of the audit trail"). */
  readonly label = input.required<string>();
  /** The word for going back in time ("Older", "Earlier"). */
  readonly olderLabel = input('Older');
  readonly pageNumberTestId = input<string | null>(null);
}
