import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { ApiRequestError } from '../core/api/api-request-error';
import { AuthService } from '../core/auth/auth-service';
import { RevisionsApi, type BookRevision } from '../speed-books/revisions-api';
import { UtcDatePipe } from '../speed-books/utc-date-pipe';

/** Revisions in review across the operator's speed books, oldest submission first. */
@Component({
  selector: 'sw-review-list',
  imports: [RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, UtcDatePipe],
  template: `
    <div class="sw-page">
      <h1 class="sw-page-title">Review</h1>
      <p class="lead">Revisions submitted for review. Compare each with the published revision and its source pages, then publish or return it.</p>
      @if (problem(); as problem) {
        <div class="sw-problem" role="alert">
          <mat-icon>error</mat-icon>
          <div>
            <p data-testid="review-list-error">{{ problem }}</p>
            <button mat-stroked-button type="button" (click)="loadReviews()">Try again</button>
          </div>
        </div>
      } @else {
        @if (loading()) {
          <mat-progress-bar mode="indeterminate" aria-label="Loading revisions in review" />
        }
        <div class="table-frame">
          <table class="list" aria-label="Revisions in review" data-testid="review-list">
            <thead>
              <tr>
                <th scope="col">Speed book</th>
                <th scope="col">No.</th>
                <th scope="col">Author</th>
                <th scope="col">Submitted (UTC)</th>
                <th scope="col">Change summary</th>
              </tr>
            </thead>
            <tbody>
              @for (entry of entries(); track entry.revision.id) {
                <tr>
                  <th scope="row">
                    <a class="row-link" routerLink="/review" [queryParams]="{ revision: entry.revision.id }">{{ entry.book.title }}</a>
                  </th>
                  <td>{{ entry.revision.number }}</td>
                  <td>
                    {{ entry.revision.authorName }}
                    @if (entry.revision.authorId === userId()) {
                      <span class="muted">(you; another approver reviews it)</span>
                    }
                  </td>
                  <td>{{ entry.revision.submittedAt | utcDate: false }}</td>
                  <td>{{ entry.revision.changeSummary }}</td>
                </tr>
              } @empty {
                @if (!loading()) {
                  <tr><td colspan="5" class="empty">No revision is waiting for review.</td></tr>
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
export class ReviewList {
  private readonly api = inject(RevisionsApi);
  private readonly destroyRef = inject(DestroyRef);
  private readonly user = inject(AuthService).user;

  protected readonly loading = signal(true);
  protected readonly problem = signal<string | null>(null);
  protected readonly entries = signal<readonly BookRevision[]>([]);
  protected readonly userId = computed(() => this.user()?.id ?? null);

  constructor() {
    this.loadReviews();
  }

  protected loadReviews(): void {
    this.loading.set(true);
    this.problem.set(null);
    this.api
      .revisionsWithStatus(['in_review'])
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (entries) => {
          this.entries.set([...entries].sort((a, b) => (a.revision.submittedAt ?? '').localeCompare(b.revision.submittedAt ?? '')));
          this.loading.set(false);
        },
        error: (error: ApiRequestError) => {
          this.problem.set(error.message);
          this.loading.set(false);
        },
      });
  }
}
