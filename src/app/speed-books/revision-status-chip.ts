import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { RevisionStatus } from '@shared/api/revisions';

/** Our words for the five states of a revision (product.md, "Vocabulary"). */
export const REVISION_STATUS_LABELS: Readonly<Record<RevisionStatus, string>> = {
  draft: 'Draft',
  in_review: 'In review',
  published: 'Published',
  superseded: 'Superseded',
  withdrawn: 'Withdrawn',
};

const ICONS: Readonly<Record<RevisionStatus, string>> = {
  draft: 'edit_note',
  in_review: 'rate_review',
  published: 'verified',
  superseded: 'history',
  withdrawn: 'block',
};

/** A revision's status as an icon and a word, never by colour alone. */
@Component({
  selector: 'sw-revision-status-chip',
  imports: [MatIconModule],
  template: `<mat-icon aria-hidden="true">{{ icon() }}</mat-icon><span>{{ label() }}</span>`,
  styles: `
    :host {
      display: inline-flex;
      align-items: center;
      gap: 4px;
      padding: 2px 10px 2px 6px;
      border-radius: 999px;
      font: var(--mat-sys-label-large);
      background: var(--mat-sys-surface-container-high);
      color: var(--mat-sys-on-surface);
      white-space: nowrap;
    }
    :host(.published) {
      background: var(--mat-sys-primary-container);
      color: var(--mat-sys-on-primary-container);
    }
    :host(.withdrawn) {
      background: var(--mat-sys-error-container);
      color: var(--mat-sys-on-error-container);
    }
    :host(.in_review) {
      background: var(--sw-caution-container);
      color: var(--sw-on-caution-container);
    }
    mat-icon {
      font-size: 18px;
      width: 18px;
      height: 18px;
    }
  `,
  host: { '[class]': 'status()', 'data-testid': 'revision-status' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RevisionStatusChip {
  readonly status = input.required<RevisionStatus>();
  protected readonly label = computed(() => REVISION_STATUS_LABELS[this.status()]);
  protected readonly icon = computed(() => ICONS[this.status()]);
}
