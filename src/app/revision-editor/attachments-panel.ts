import { ChangeDetectionStrategy, Component, DestroyRef, effect, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import type { Observable } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { AttachmentView } from '@shared/api/attachments';
import { ApiRequestError } from '../core/api/api-request-error';
import { RevisionsApi } from '../speed-books/revisions-api';
import { UtcDatePipe } from '../speed-books/utc-date-pipe';
import { fileSize } from '../core/format/display-format';

/** The flight-manual pages a draft's figures came from, so the approver can compare. */
@Component({
  selector: 'sw-attachments-panel',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, UtcDatePipe],
  template: `
    <p class="help">Attach the flight-manual pages the figures come from: PDF, PNG or JPEG, up to 10 MB each.</p>
    <input #picker class="sw-visually-hidden" type="file" tabindex="-1" aria-label="Source page file (PDF, PNG or JPEG)" accept=".pdf,.png,.jpg,.jpeg,application/pdf,image/png,image/jpeg" (change)="attachFile($event)" data-testid="attachment-file" />
    <button mat-stroked-button type="button" (click)="picker.click()" [disabled]="busy()"><mat-icon>attach_file</mat-icon>Attach a source page</button>
    @if (busy()) {
      <mat-progress-bar mode="indeterminate" aria-label="Working on the source pages" />
    }
    @if (problem(); as problem) {
      <p class="sw-problem" role="alert" data-testid="attachment-problem"><mat-icon>error</mat-icon>{{ problem }}</p>
    }
    <ul class="files" data-testid="attachment-list">
      @for (attachment of attachments(); track attachment.id) {
        <li>
          <mat-icon aria-hidden="true">{{ attachment.contentType === 'application/pdf' ? 'picture_as_pdf' : 'image' }}</mat-icon>
          <a [href]="attachment.url" target="_blank" rel="noopener">{{ attachment.originalName }}</a>
          <span class="muted">{{ sizeLabel(attachment.sizeBytes) }} · {{ attachment.createdAt | utcDate }}</span>
          <button mat-icon-button type="button" (click)="removeAttachment(attachment)" [disabled]="busy()" [attr.aria-label]="'Remove ' + attachment.originalName">
            <mat-icon>delete</mat-icon>
          </button>
        </li>
      } @empty {
        <li class="muted">No source pages attached yet.</li>
      }
    </ul>
  `,
  styles: `
    .help,
    .muted {
      color: var(--mat-sys-on-surface-variant);
    }
    .help {
      margin: 0 0 12px;
    }
    .files {
      list-style: none;
      padding: 0;
      margin: 12px 0 0;
    }
    .files li {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 8px;
      min-height: 48px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AttachmentsPanel {
  private readonly api = inject(RevisionsApi);
  private readonly destroyRef = inject(DestroyRef);

  readonly revisionId = input.required<number>();

  protected readonly attachments = signal<readonly AttachmentView[]>([]);
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);

  constructor() {
    effect(() => this.loadAttachments(this.revisionId()));
  }

  protected attachFile(event: Event): void {
    const field = event.target as HTMLInputElement;
    const file = field.files?.[0];
    field.value = '';
    if (!file) return;
    this.run(this.api.attach(this.revisionId(), file), (attachment) => this.attachments.update((list) => [...list, attachment]));
  }

  protected removeAttachment(attachment: AttachmentView): void {
    this.run(this.api.removeAttachment(attachment.id), () => this.attachments.update((list) => list.filter((a) => a.id !== attachment.id)));
  }

  protected sizeLabel(bytes: number): string {
    return fileSize(bytes);
  }

  private loadAttachments(revisionId: number): void {
    this.run(this.api.attachments(revisionId), (attachments) => this.attachments.set(attachments));
  }

  private run<T>(request: Observable<T>, done: (value: T) => void): void {
    this.busy.set(true);
    this.problem.set(null);
    request.pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (value) => {
        done(value);
        this.busy.set(false);
      },
      error: (error: ApiRequestError) => {
        this.problem.set(error.message);
        this.busy.set(false);
      },
    });
  }
}
