import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { addressedRecord } from '../core/api/addressed-record';
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

  private readonly record = addressedRecord(
    this.revisionId,
    (id) => this.api.revision(id),
    'This address does not name a revision. Choose one from its speed book.',
  );
  protected readonly loading = this.record.loading;
  protected readonly problem = this.record.problem;
  protected readonly revision = this.record.value;

  protected reload(): void {
    this.record.reload();
  }
}
