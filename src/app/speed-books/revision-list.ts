import { ChangeDetectionStrategy, Component, computed, inject, input, signal, type OnInit } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { requestState } from '../core/api/request-state';
import { AuthService } from '../core/auth/auth-service';
import { RevisionStatusChip } from './revision-status-chip';
import { RevisionsApi, type BookRevision } from './revisions-api';
import { UtcDatePipe } from './utc-date-pipe';
import { ProblemRetry } from '../core/feedback/problem-retry';

/** Which list: revisions waiting for an approver (review), or every open revision (drafts). */
export type RevisionListKind = 'review' | 'drafts';

/** What differs between the two lists: the words, the test ids, the statuses asked for. */
const LISTS = {
  review: {
    title: 'Review',
    lead: 'Revisions submitted for review. Compare each with the published revision and its source pages, then publish or return it.',
    statuses: ['in_review'],
    tableLabel: 'Revisions in review',
    tableTestId: 'review-list',
    errorTestId: 'review-list-error',
    loadingLabel: 'Loading revisions in review',
    whenHeading: 'Submitted (UTC)',
  },
  drafts: {
    title: 'Drafts',
    lead: 'Revisions being written, and those waiting for an approver. A new draft starts from its speed book.',
    statuses: ['draft', 'in_review'],
    tableLabel: 'Open revisions',
    tableTestId: 'draft-list',
    errorTestId: 'drafts-error',
    loadingLabel: 'Loading drafts',
    whenHeading: 'Last change (UTC)',
  },
} as const;

/**
 * The operator's open revisions as one table, for the review page (in review, oldest
 * submission first, each opening the review) and the drafts page (drafts and those in review,
 * with their status, each opening the editor or the book).
 */
@Component({
  selector: 'sw-revision-list',
  imports: [ProblemRetry, RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, RevisionStatusChip, UtcDatePipe],
  template: `
    <div class="sw-page">
      <h1 class="sw-page-title">{{ list().title }}</h1>
      <p class="lead">{{ list().lead }}</p>
      @if (request.problem(); as problem) {
        <sw-problem-retry [problem]="problem" [testId]="list().errorTestId" (retry)="loadRevisions()" />
      } @else {
        @if (request.busy()) {
          <mat-progress-bar mode="indeterminate" [attr.aria-label]="list().loadingLabel" />
        }
        <div class="table-frame">
          <table class="list" [attr.aria-label]="list().tableLabel" [attr.data-testid]="list().tableTestId">
            <thead>
              <tr>
                <th scope="col">Speed book</th>
                <th scope="col">No.</th>
                @if (kind() === 'drafts') {
                  <th scope="col">Status</th>
                }
                <th scope="col">Author</th>
                <th scope="col">{{ list().whenHeading }}</th>
                <th scope="col">Change summary</th>
              </tr>
            </thead>
            <tbody>
              @for (entry of entries(); track entry.revision.id) {
                <tr>
                  <th scope="row">
                    @if (kind() === 'review') {
                      <a class="row-link" routerLink="/review" [queryParams]="{ revision: entry.revision.id }">{{ entry.book.title }}</a>
                    } @else if (entry.revision.status === 'draft') {
                      <a class="row-link" routerLink="/drafts" [queryParams]="{ revision: entry.revision.id }">{{ entry.book.title }}</a>
                    } @else {
                      <a class="row-link" routerLink="/speed-books" [queryParams]="{ book: entry.book.id, revision: entry.revision.id }">{{ entry.book.title }}</a>
                    }
                  </th>
                  <td>{{ entry.revision.number }}</td>
                  @if (kind() === 'drafts') {
                    <td><sw-revision-status-chip [status]="entry.revision.status" /></td>
                    <td>{{ entry.revision.authorName }}</td>
                    <td>{{ entry.revision.updatedAt | utcDate: false }}</td>
                  } @else {
                    <td>
                      {{ entry.revision.authorName }}
                      @if (entry.revision.authorId === userId()) {
                        <span class="muted">(you; another approver reviews it)</span>
                      }
                    </td>
                    <td>{{ entry.revision.submittedAt | utcDate: false }}</td>
                  }
                  <td>{{ entry.revision.changeSummary }}</td>
                </tr>
              } @empty {
                @if (!request.busy()) {
                  @if (kind() === 'review') {
                    <tr><td colspan="5" class="empty">No revision is waiting for review.</td></tr>
                  } @else {
                    <tr>
                      <td colspan="6" class="empty">No drafts. Start one from a <a routerLink="/speed-books">speed book</a>.</td>
                    </tr>
                  }
                }
              }
            </tbody>
          </table>
        </div>
      }
    </div>
  `,
  styleUrl: './speed-books.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RevisionList implements OnInit {
  private readonly api = inject(RevisionsApi);
  private readonly user = inject(AuthService).user;

  readonly kind = input.required<RevisionListKind>();
  protected readonly list = computed(() => LISTS[this.kind()]);
  protected readonly request = requestState();
  protected readonly entries = signal<readonly BookRevision[]>([]);
  protected readonly userId = computed(() => this.user()?.id ?? null);

  ngOnInit(): void {
    this.loadRevisions();
  }

  protected loadRevisions(): void {
    this.request.run(this.api.revisionsWithStatus([...this.list().statuses]), (entries) =>
      this.entries.set(this.kind() === 'review' ? [...entries].sort((a, b) => (a.revision.submittedAt ?? '').localeCompare(b.revision.submittedAt ?? '')) : entries),
    );
  }
}
