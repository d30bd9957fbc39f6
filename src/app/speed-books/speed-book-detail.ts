import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { FormControl } from '@angular/forms';
import { Router } from '@angular/router';
import { forkJoin, map, switchMap } from 'rxjs';
import type { AircraftTypeView } from '@shared/api/fleet';
import { createRevisionSchema, reasonSchema, type RevisionSummary } from '@shared/api/revisions';
import { REVISION_SCHEMA_VERSION } from '@shared/speed-book/revision-content';
import { userMay } from '../core/auth/user-may';
import { addressedRecord } from '../core/api/addressed-record';
import { requestState } from '../core/api/request-state';
import { FORM_PAGE_IMPORTS } from '../core/forms/form-page-imports';
import { zodValidator } from '../core/forms/zod-validator';
import { RevisionStatusChip } from './revision-status-chip';
import { RevisionsApi, type SpeedBook } from './revisions-api';
import { UtcDatePipe } from './utc-date-pipe';
import { ProblemRetry } from '../core/feedback/problem-retry';

/** One speed book: its current revision, its revision history, and the next step for the person's role. */
@Component({
  selector: 'sw-speed-book-detail',
  imports: [ProblemRetry, FORM_PAGE_IMPORTS, RevisionStatusChip, UtcDatePipe],
  templateUrl: './speed-book-detail.html',
  styleUrl: './speed-books.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SpeedBookDetail {
  private readonly api = inject(RevisionsApi);
  private readonly router = inject(Router);

  /** NaN when the address does not name a speed book. */
  readonly bookId = input.required<number>();

  private readonly record = addressedRecord(
    this.bookId,
    (id) =>
      forkJoin({ book: this.api.speedBook(id), types: this.api.aircraftTypes() }).pipe(
        map(({ book, types }) => ({ book, type: types.find((t) => t.id === book.aircraftTypeId) ?? null })),
      ),
    'This address does not name a speed book. Choose one from the list.',
  );
  protected readonly loading = this.record.loading;
  protected readonly problem = this.record.problem;
  protected readonly book = computed<SpeedBook | null>(() => this.record.value()?.book ?? null);
  protected readonly type = computed<AircraftTypeView | null>(() => this.record.value()?.type ?? null);
  protected readonly mayEdit = userMay('edit-speed-books');
  protected readonly mayPublish = userMay('publish-revisions');
  protected readonly openRevision = computed(() => this.book()?.revisions.find((r) => r.status === 'draft' || r.status === 'in_review') ?? null);

  protected readonly changeSummary = new FormControl('', { nonNullable: true, validators: zodValidator(createRevisionSchema.shape.changeSummary) });
  private readonly drafting = requestState();
  protected readonly startingDraft = this.drafting.busy;
  protected readonly draftProblem = this.drafting.problem;

  protected readonly withdrawing = signal<RevisionSummary | null>(null);
  protected readonly withdrawReason = new FormControl('', { nonNullable: true, validators: zodValidator(reasonSchema.shape.reason) });
  private readonly withdrawal = requestState();
  protected readonly withdrawBusy = this.withdrawal.busy;
  protected readonly withdrawProblem = this.withdrawal.problem;

  protected reload(): void {
    this.record.reload();
  }

  protected startDraft(): void {
    const book = this.book();
    this.changeSummary.markAsTouched();
    if (!book || this.changeSummary.invalid || this.startingDraft()) return;
    const changeSummary = this.changeSummary.value.trim();
    // With nothing published to copy, the first draft starts from the type's own figures.
    const content = book.revisions.some((r) => r.publishedAt !== null) ? undefined : this.emptyContent();
    // Busy until the editor is open, so the button cannot start a second draft meanwhile.
    this.drafting.run(
      this.api
        .startDraft(book.id, { changeSummary, ...(content ? { content } : {}) })
        .pipe(switchMap((revision) => this.router.navigate(['/drafts'], { queryParams: { revision: revision.id } }))),
      () => undefined,
      (error) => error.fields['changeSummary'] ?? error.message,
    );
  }

  protected askWithdrawReason(revision: RevisionSummary): void {
    this.withdrawing.set(revision);
    this.withdrawReason.reset('');
    this.withdrawal.showProblem(null);
  }

  protected cancelWithdrawal(): void {
    this.withdrawing.set(null);
  }

  protected withdrawRevision(): void {
    const revision = this.withdrawing();
    this.withdrawReason.markAsTouched();
    if (!revision || this.withdrawReason.invalid) return;
    this.withdrawal.run(
      this.api.withdraw(revision.id, this.withdrawReason.value.trim()),
      () => {
        this.withdrawing.set(null);
        this.reload();
      },
      (error) => error.fields['reason'] ?? error.message,
    );
  }

  private emptyContent(): Record<string, unknown> {
    const type = this.type();
    return {
      schemaVersion: REVISION_SCHEMA_VERSION,
      aircraft: type ? { category: type.category, engines: type.engines, ceilingFt: type.ceilingFt } : {},
      weights: {},
      configurations: [],
      speeds: [],
      limits: { vfeKt: {} },
      indicatorMarkingBasis: 'ias',
      notes: '',
    };
  }
}
