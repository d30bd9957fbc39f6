import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { ApiRequestError } from '../core/api/api-request-error';
import { RevisionStatusChip } from '../speed-books/revision-status-chip';
import { RevisionsApi, type BookRevision } from '../speed-books/revisions-api';
import { UtcDatePipe } from '../speed-books/utc-date-pipe';

/** The operator's open revisions: drafts to continue, and those waiting in review. */
@Component({
  selector: 'sw-draft-list',
  imports: [RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, RevisionStatusChip, UtcDatePipe],
  template: `
    <div class="sw-page">
      <h1 class="sw-page-title">Drafts</h1>
      <p class="lead">Revisions being written, and those waiting for an approver. A new draft starts from its speed book.</p>
      @if (problem(); as problem) {
        <div class="sw-problem" role="alert">
          <mat-icon>error</mat-icon>
          <div>
            <p data-testid="drafts-error">{{ problem }}</p>
            <button mat-stroked-button type="button" (click)="loadDrafts()">Try again</button>
          </div>
        </div>
      } @else {
        @if (loading()) {
          <mat-progress-bar mode="indeterminate" aria-label="Loading drafts" />
        }
        <div class="table-frame">
          <table class="list" aria-label="Open revisions" data-testid="draft-list">
            <thead>
              <tr>
                <th scope="col">Speed book</th>
                <th scope="col">No.</th>
                <th scope="col">Status</th>
                <th scope="col">Author</th>
                <th scope="col">Last change (UTC)</th>
                <th scope="col">Change summary</th>
              </tr>
            </thead>
            <tbody>
              @for (entry of entries(); track entry.revision.id) {
                <tr>
                  <th scope="row">
                    @if (entry.revision.status === 'draft') {
                      <a class="row-link" routerLink="/drafts" [queryParams]="{ revision: entry.revision.id }">{{ entry.book.title }}</a>
                    } @else {
                      <a class="row-link" routerLink="/speed-books" [queryParams]="{ book: entry.book.id, revision: entry.revision.id }">{{ entry.book.title }}</a>
                    }
                  </th>
                  <td>{{ entry.revision.number }}</td>
                  <td><sw-revision-status-chip [status]="entry.revision.status" /></td>
                  <td>{{ entry.revision.authorName }}</td>
                  <td>{{ entry.revision.updatedAt | utcDate: false }}</td>
                  <td>{{ entry.revision.changeSummary }}</td>
                </tr>
              } @empty {
                @if (!loading()) {
                  <tr>
                    <td colspan="6" class="empty">No drafts. Start one from a <a routerLink="/speed-books">speed book</a>.</td>
                  </tr>
                }
              }
            </tbody>
          </table>
        </div>
      }
    </div>
  `,
  styleUrl: '../speed-books/speed-books.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DraftList {
  private readonly api = inject(RevisionsApi);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly loading = signal(true);
  protected readonly problem = signal<string | null>(null);
  protected readonly entries = signal<readonly BookRevision[]>([]);

  constructor() {
    this.loadDrafts();
  }

  protected loadDrafts(): void {
    this.loading.set(true);
    this.problem.set(null);
    this.api
      .revisionsWithStatus(['draft', 'in_review'])
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (entries) => {
          this.entries.set(entries);
          this.loading.set(false);
        },
        error: (error: ApiRequestError) => {
          this.problem.set(error.message);
          this.loading.set(false);
        },
      });
  }
}
