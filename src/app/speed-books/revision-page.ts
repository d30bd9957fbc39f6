import { ChangeDetectionStrategy, Component, DestroyRef, effect, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import type { RevisionView } from '../../../shared/api/revisions';
import { ApiRequestError } from '../core/api/api-request-error';
import { RevisionContentView } from './revision-content-view';
import { RevisionStatusChip } from './revision-status-chip';
import { RevisionsApi } from './revisions-api';
import { UtcDatePipe } from './utc-date-pipe';
import { ProblemRetry } from '../core/feedback/problem-retry';

/** One revision, read-only: who wrote and approved it, when, why, and its whole content. */
@Component({
  selector: 'sw-revision-page',
  imports: [ProblemRetry, RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, RevisionContentView, RevisionStatusChip, UtcDatePipe],
  templateUrl: './revision-page.html',
  styleUrl: './speed-books.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RevisionPage {
  private readonly api = inject(RevisionsApi);
  private readonly destroyRef = inject(DestroyRef);

  /** NaN when the address does not name a revision. */
  readonly revisionId = input.required<number>();

  protected readonly loading = signal(true);
  protected readonly problem = signal<string | null>(null);
  protected readonly revision = signal<RevisionView | null>(null);

  constructor() {
    effect(() => this.loadRevision(this.revisionId()));
  }

  protected reload(): void {
    this.loadRevision(this.revisionId());
  }

  private loadRevision(id: number): void {
    this.loading.set(true);
    this.problem.set(null);
    if (!Number.isFinite(id)) {
      this.problem.set('This address does not name a revision. Choose one from its speed book.');
      this.loading.set(false);
      return;
    }
    this.api
      .revision(id)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (revision) => {
          this.revision.set(revision);
          this.loading.set(false);
        },
        error: (error: ApiRequestError) => {
          this.problem.set(error.message);
          this.loading.set(false);
        },
      });
  }
}
