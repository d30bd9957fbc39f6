import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { SyncService } from './sync-service';

/** The signed-in person's issued cards that rest on a revision now superseded or withdrawn. */
@Component({
  selector: 'sw-revision-notices',
  imports: [MatIconModule],
  template: `
    @if (notices().length > 0) {
      <section class="notices" role="alert" aria-labelledby="notices-title" data-testid="revision-notices">
        <h2 id="notices-title"><mat-icon aria-hidden="true">campaign</mat-icon>Cards resting on old data</h2>
        <ul>
          @for (notice of notices(); track notice.entry.id) {
            <li data-testid="revision-notice" [attr.data-entry-id]="notice.entry.id" [attr.data-status]="notice.status" [attr.data-revision-id]="notice.revision.id">
              {{ notice.sentence }}
            </li>
          }
        </ul>
      </section>
    }
  `,
  styles: `
    .notices {
      padding: 12px 16px;
      border-radius: 12px;
      border: 1px solid var(--mat-sys-outline);
      background: var(--sw-caution-container);
      color: var(--sw-on-caution-container);
    }
    h2 {
      display: flex;
      align-items: center;
      gap: 8px;
      margin: 0 0 8px;
      font: var(--mat-sys-title-medium);
    }
    ul {
      margin: 0;
      padding-left: 20px;
      display: grid;
      gap: 6px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RevisionNotices {
  protected readonly notices = inject(SyncService).notices;
}
