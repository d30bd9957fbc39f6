import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl } from '@angular/forms';
import { forkJoin, of, switchMap } from 'rxjs';
import type { AttachmentView } from '@shared/api/attachments';
import { reasonSchema, type RevisionView } from '@shared/api/revisions';
import { UNIT_SYMBOLS, isCanonical, statedUnitsOf } from '@shared/speed-book/stated-units';
import type { CoverageReport } from '@shared/card/coverage-report';
import { contributionWords, fourEyesRefusal } from '@shared/speed-book/four-eyes';
import { ApiRequestError } from '../core/api/api-request-error';
import { CoverageApi } from '../coverage/coverage-api';
import { CoverageRefusal } from '../coverage/coverage-refusal';
import { CoveragePicture } from '../coverage/coverage-picture';
import { AuthService } from '../core/auth/auth-service';
import { FORM_PAGE_IMPORTS } from '../core/forms/form-page-imports';
import { zodValidator } from '../core/forms/zod-validator';
import { RevisionContentView } from '../speed-books/revision-content-view';
import { RevisionStatusChip } from '../speed-books/revision-status-chip';
import { RevisionsApi, type RevisionDiff, type SpeedBook } from '../speed-books/revisions-api';
import { UtcDatePipe } from '../speed-books/utc-date-pipe';
import { DiffTable } from './diff-table';
import { SourcePages } from './source-pages';
import { ProblemRetry } from '../core/feedback/problem-retry';

/**
 * The approver's review of one revision: the diff against the published revision beside the
 * source pages, then publish or return with a reason. Nobody approves a revision they contributed
 * to (shared/speed-book/four-eyes.ts): the page lists the contributors and, in place of the
 * approve button, says why it is not offered; the server refuses it too. The envelope proof
 * (coverage picture) shows, before publishing, exactly where the book gives a card and where it
 * does not, with the engineer's recorded exceptions beside it.
 */
@Component({
  selector: 'sw-revision-review',
  imports: [
    ProblemRetry,
    FORM_PAGE_IMPORTS,
    RevisionContentView,
    RevisionStatusChip,
    UtcDatePipe,
    DiffTable,
    SourcePages,
    CoveragePicture,
  ],
  templateUrl: './revision-review.html',
  styleUrl: './revision-review.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RevisionReview {
  private readonly api = inject(RevisionsApi);
  private readonly coverageApi = inject(CoverageApi);
  private readonly destroyRef = inject(DestroyRef);
  private readonly user = inject(AuthService).user;

  /** NaN when the address does not name a revision. */
  readonly revisionId = input.required<number>();

  protected readonly loading = signal(true);
  protected readonly problem = signal<string | null>(null);
  protected readonly revision = signal<RevisionView | null>(null);
  protected readonly book = signal<SpeedBook | null>(null);
  protected readonly diff = signal<RevisionDiff | null>(null);
  protected readonly attachments = signal<readonly AttachmentView[]>([]);
  protected readonly busy = signal(false);
  protected readonly actionProblem = signal<string | null>(null);
  protected readonly outcome = signal<string | null>(null);
  protected readonly returnReason = new FormControl('', { nonNullable: true, validators: zodValidator(reasonSchema.shape.reason) });

  protected readonly coverage = signal<CoverageReport | null>(null);
  protected readonly coverageLoading = signal(false);
  protected readonly coverageProblem = signal<string | null>(null);
  /**
   * Every exception the revision records, with the rule's title when the report names it; the
   * report's own findings with an exception count too (the server read them from the content).
   */
  protected readonly recordedExceptions = computed(() => {
    const content = this.revision()?.content ?? {};
    const recorded = Array.isArray(content['ruleExceptions']) ? (content['ruleExceptions'] as { ruleId?: unknown; reason?: unknown }[]) : [];
    const rules = this.coverage()?.rules ?? [];
    const exceptions = new Map<string, string>();
    for (const e of recorded) if (typeof e.ruleId === 'string' && typeof e.reason === 'string') exceptions.set(e.ruleId, e.reason);
    for (const rule of rules) if (rule.exception !== undefined && !exceptions.has(rule.ruleId)) exceptions.set(rule.ruleId, rule.exception);
    return [...exceptions].map(([ruleId, reason]) => {
      const rule = rules.find((r) => r.ruleId === ruleId);
      return { ruleId, reason, title: rule?.title ?? ruleId, brokenAt: rule?.brokenAt ?? 0 };
    });
  });

  protected readonly published = computed(() => this.book()?.currentRevision ?? null);
  protected readonly ownRevision = computed(() => this.revision()?.authorId === this.user()?.id);
  protected readonly inReview = computed(() => this.revision()?.status === 'in_review');
  /** The units the revision's flight manual prints; the diff shows its figures in them. */
  protected readonly statedUnits = computed(() => statedUnitsOf(this.revision()?.content));
  protected readonly unitsSentence = computed(() => {
    const units = this.statedUnits();
    const stated = `Weights in ${UNIT_SYMBOLS[units.weight]}, speeds in ${UNIT_SYMBOLS[units.speed]}, as the flight manual of this revision prints them`;
    return isCanonical('weight', units) && isCanonical('speed', units) ? `${stated}.` : `${stated}; the stored kg and kt are in brackets.`;
  });
  /** Everyone who contributed, in words: "Ines Marlow (started it and submitted it)". */
  protected readonly contributors = computed(() =>
    (this.revision()?.contributors ?? []).map((contributor) => ({ ...contributor, words: contributionWords(contributor.kinds) })),
  );
  /** Why the signed-in approver may not publish it (they contributed), or null; the server's own sentence. */
  protected readonly approveRefusal = computed(() => {
    const revision = this.revision();
    const me = this.user()?.id;
    if (!revision || me === undefined) return null;
    return fourEyesRefusal(revision.number, revision.contributors.find((contributor) => contributor.userId === me)?.kinds ?? []);
  });

  constructor() {
    effect(() => this.loadReview(this.revisionId()));
  }

  protected reload(): void {
    this.loadReview(this.revisionId());
  }

  protected reloadCoverage(): void {
    this.loadCoverage(this.revisionId());
  }

  /** Apart from the rest of the page, so a slow or failed sweep never hides the diff. */
  private loadCoverage(id: number): void {
    this.coverage.set(null);
    this.coverageProblem.set(null);
    if (!Number.isFinite(id)) return;
    this.coverageLoading.set(true);
    this.coverageApi
      .revisionCoverage(id)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (report) => {
          this.coverage.set(report);
          this.coverageLoading.set(false);
        },
        error: (error: ApiRequestError) => {
          this.coverageProblem.set(error.message);
          this.coverageLoading.set(false);
        },
      });
  }

  protected publishRevision(): void {
    const revision = this.revision();
    if (!revision || this.approveRefusal()) return;
    this.act(this.api.approve(revision.id), (published) => `Revision ${published.number} is published and signed; it is now the current revision of ${this.book()?.title ?? 'its speed book'}.`);
  }

  protected returnRevision(): void {
    const revision = this.revision();
    this.returnReason.markAsTouched();
    if (!revision || this.ownRevision() || this.returnReason.invalid) return;
    this.act(this.api.returnToAuthor(revision.id, this.returnReason.value.trim()), (returned) => `Revision ${returned.number} went back to ${returned.authorName} as a draft, with your reason.`);
  }

  private act(request: ReturnType<RevisionsApi['approve']>, sentence: (revision: RevisionView) => string): void {
    this.busy.set(true);
    this.actionProblem.set(null);
    request.pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (revision) => {
        this.busy.set(false);
        this.revision.set(revision);
        this.outcome.set(sentence(revision));
      },
      error: (error: ApiRequestError) => {
        this.busy.set(false);
        // Publishing re-checks the envelope: the report it refused with replaces the one shown.
        if (error instanceof CoverageRefusal) this.coverage.set(error.report);
        this.actionProblem.set(error.fields['reason'] ?? error.message);
      },
    });
  }

  private loadReview(id: number): void {
    this.loading.set(true);
    this.problem.set(null);
    this.outcome.set(null);
    this.actionProblem.set(null);
    if (!Number.isFinite(id)) {
      this.problem.set('This address does not name a revision. Choose one from the list of revisions in review.');
      this.loading.set(false);
      return;
    }
    this.loadCoverage(id);
    this.api
      .revision(id)
      .pipe(
        switchMap((revision) =>
          forkJoin({ revision: of(revision), book: this.api.speedBook(revision.speedBookId), attachments: this.api.attachments(revision.id) }),
        ),
        switchMap(({ revision, book, attachments }) => {
          const against = book.currentRevision;
          const diff = against && against.id !== revision.id ? this.api.diff(revision.id, against.id) : of(null);
          return forkJoin({ revision: of(revision), book: of(book), attachments: of(attachments), diff });
        }),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe({
        next: ({ revision, book, attachments, diff }) => {
          this.revision.set(revision);
          this.book.set(book);
          this.attachments.set(attachments);
          this.diff.set(diff);
          this.loading.set(false);
        },
        error: (error: ApiRequestError) => {
          this.problem.set(error.message);
          this.loading.set(false);
        },
      });
  }
}
