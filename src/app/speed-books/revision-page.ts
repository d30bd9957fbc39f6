import { ChangeDetectionStrategy, Component, effect, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import type { RevisionView } from '../../../shared/api/revisions';
import { requestState } from '../core/api/request-state';
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

  /** NaN when the address does not name a revision. */
  readonly revisionId = input.required<number>();

  private readonly request = requestState();
  protected readonly loading = this.request.busy;
  protected readonly problem = this.request.problem;
  protected readonly revision = signal<RevisionView | null>(null);

  constructor() {
    effect(() => this.loadRevision(this.revisionId()));
  }

  protected reload(): void {
    this.loadRevision(this.revisionId());
  }

  private loadRevision(id: number): void {
    if (!Number.isFinite(id)) {
      this.request.showProblem('This address does not name a revision. Choose one from its speed book.');
      return;
    }
    this.request.run(this.api.revision(id), (revision) => this.revision.set(revision));
  }
}
