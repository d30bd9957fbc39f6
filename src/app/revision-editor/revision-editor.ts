import { ChangeDetectionStrategy, Component, DestroyRef, ElementRef, computed, effect, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl } from '@angular/forms';
import { MatDialog } from '@angular/material/dialog';
import { MAT_FORM_FIELD_DEFAULT_OPTIONS } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { Router } from '@angular/router';
import { Observable, Subscription, forkJoin, map, of, switchMap } from 'rxjs';
import { createRevisionSchema, type RevisionView } from '@shared/api/revisions';
import type { SpeedTableUploadResponse } from '@shared/api/uploads';
import { AIRCRAFT_CATEGORIES, SPEED_BASES, SPEED_PHASES } from '@shared/speed-book/revision-content';
import { ApiRequestError } from '../core/api/api-request-error';
import { CoverageRefusal } from '../coverage/coverage-refusal';
import { FORM_PAGE_IMPORTS } from '../core/forms/form-page-imports';
import { zodValidator } from '../core/forms/zod-validator';
import { RevisionStatusChip } from '../speed-books/revision-status-chip';
import { RevisionsApi, type SpeedBook } from '../speed-books/revisions-api';
import { AttachmentsPanel } from './attachments-panel';
import { DiscardDraftDialog, type DiscardDraftData } from './discard-draft-dialog';
import { EnvelopeCoverageSection } from './envelope-coverage-section';
import { SPEED_CLASSES } from './envelope-form';
import { contentProblems } from './content-problems';
import { LIMIT_FIELDS, SPEED_CLASS_WORDS, WEIGHT_FIELDS } from './editor-field-words';
import { LiveCoverage } from './live-coverage';
import { CsvUploadPanel } from './csv-upload-panel';
import { PositionErrorEditor } from './position-error-editor';
import { problemLocation } from './problem-location';
import { RevisionForm } from './revision-form';
import { StatedUnitInput } from './stated-unit-input';
import { StatedUnitsContext } from './stated-units-context';
import { StatedUnitsPanel } from './stated-units-panel';
import { restateFigures, statedSymbol, statedUnitWords } from '@shared/speed-book/stated-units';
import { TabulatedSpeedGrid } from './tabulated-speed-grid';

/**
 * The revision editor: a draft's whole content as a reactive form, checked as it is typed with
 * the shared revision-content schema (the sentences the server would give), saved with PATCH and
 * submitted for review. CSV previews and source pages join the draft from here.
 */
@Component({
  selector: 'sw-revision-editor',
  imports: [
    FORM_PAGE_IMPORTS,
    MatSelectModule,
    RevisionStatusChip,
    PositionErrorEditor,
    TabulatedSpeedGrid,
    CsvUploadPanel,
    AttachmentsPanel,
    StatedUnitInput,
    StatedUnitsPanel,
    EnvelopeCoverageSection,
  ],
  // Hints and sentences take the room they need, so two-line ones never run into the next row.
  providers: [{ provide: MAT_FORM_FIELD_DEFAULT_OPTIONS, useValue: { appearance: 'outline', subscriptSizing: 'dynamic' } }, StatedUnitsContext, LiveCoverage],
  templateUrl: './revision-editor.html',
  styleUrl: './revision-editor.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RevisionEditor {
  private readonly api = inject(RevisionsApi);
  private readonly coverage = inject(LiveCoverage);
  private readonly router = inject(Router);
  private readonly dialog = inject(MatDialog);
  private readonly destroyRef = inject(DestroyRef);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);

  /** NaN when the address does not name a revision. */
  readonly revisionId = input.required<number>();

  protected readonly categories = AIRCRAFT_CATEGORIES;
  protected readonly phases = SPEED_PHASES;
  protected readonly bases = SPEED_BASES;
  protected readonly speedClasses = SPEED_CLASSES.map((value) => ({ value, words: SPEED_CLASS_WORDS[value] }));
  protected readonly limitFields = LIMIT_FIELDS;
  protected readonly weightFields = WEIGHT_FIELDS;

  protected readonly form = new RevisionForm();
  /** The flight manual's units, for every weight and speed field and heading (they store kg and kt). */
  private readonly statedUnits = inject(StatedUnitsContext).units;
  protected readonly weightUnit = computed(() => statedSymbol('weight', this.statedUnits()));
  protected readonly speedUnit = computed(() => statedSymbol('speed', this.statedUnits()));
  protected readonly changeSummary = new FormControl('', { nonNullable: true, validators: zodValidator(createRevisionSchema.shape.changeSummary) });

  protected readonly loading = signal(true);
  protected readonly problem = signal<string | null>(null);
  protected readonly revision = signal<RevisionView | null>(null);
  protected readonly book = signal<SpeedBook | null>(null);
  protected readonly saving = signal(false);
  protected readonly saveProblem = signal<string | null>(null);
  protected readonly notice = signal<string | null>(null);
  protected readonly uploadChanges = signal<readonly string[]>([]);
  protected readonly dirty = signal(false);

  private readonly localProblems = signal<Readonly<Record<string, string>>>({});
  /** The server's word from the last save or submit; it counts until the next edit. */
  private readonly serverProblems = signal<Readonly<Record<string, string>>>({});
  /** The schema's and the server's sentences, their kt and kg figures restated in the flight manual's units. */
  protected readonly problems = computed<Readonly<Record<string, string>>>(() => {
    const units = this.statedUnits();
    const all = { ...this.localProblems(), ...this.serverProblems() };
    return Object.fromEntries(Object.entries(all).map(([path, sentence]) => [path, restateFigures(sentence, units)]));
  });
  protected readonly problemList = computed(() => {
    const content = this.form.content();
    const units = this.statedUnits();
    return Object.entries(this.problems()).map(([path, sentence]) => ({ path, where: statedUnitWords(problemLocation(path, content), units), sentence }));
  });
  protected readonly configurationKeys = signal<readonly string[]>([]);
  private formChanges: Subscription | null = null;

  constructor() {
    effect(() => this.loadDraft(this.revisionId()));
  }

  protected problemAt(path: string): string | undefined {
    return this.problems()[path];
  }

  protected limitPath(key: string): string {
    return `limits.${key}`;
  }

  protected addConfiguration(): void {
    this.form.addConfiguration();
  }

  protected removeConfiguration(i: number): void {
    this.form.configurations.removeAt(i);
  }

  protected addSpeed(): void {
    this.form.addSpeed();
  }

  protected removeSpeed(i: number): void {
    this.form.speeds.removeAt(i);
  }

  /** Moves the focus to the field a listed problem is about, when it has one. */
  protected goToProblem(path: string): void {
    const field = this.host.nativeElement.querySelector<HTMLElement>(`[data-path="${CSS.escape(path)}"]`);
    field?.focus();
    field?.scrollIntoView({ block: 'center' });
  }

  protected saveDraft(): void {
    this.persist().subscribe();
  }

  protected submitForReview(): void {
    this.form.group.markAllAsTouched();
    this.changeSummary.markAsTouched();
    this.persist()
      .pipe(switchMap((saved) => (saved ? this.api.submit(saved.id) : of(null))))
      .subscribe({
        next: (submitted) => {
          if (!submitted) return;
          void this.router.navigate(['/speed-books'], { queryParams: { book: submitted.speedBookId } });
        },
        error: (error: ApiRequestError) => (error instanceof CoverageRefusal ? this.showCoverageRefusal(error) : this.showServerRefusal(error)),
      });
  }

  /** The envelope proof failed: the saved draft stays as it is, and the picture shows where. */
  private showCoverageRefusal(refusal: CoverageRefusal): void {
    this.saving.set(false);
    this.coverage.showSubmitRefusal(refusal.report, refusal.message);
    this.saveProblem.set(refusal.message);
    const picture = this.host.nativeElement.querySelector<HTMLElement>('[data-testid="live-coverage"]');
    picture?.scrollIntoView?.({ block: 'start' });
  }

  /** Deletes the draft (after asking) and goes back to the drafts; a refusal is said in the status line. */
  protected discardDraft(): void {
    const revision = this.revision();
    if (!revision) return;
    const data: DiscardDraftData = { number: revision.number, bookTitle: this.book()?.title ?? 'this speed book', changeSummary: revision.changeSummary };
    this.dialog
      .open<DiscardDraftDialog, DiscardDraftData, boolean>(DiscardDraftDialog, { data, autoFocus: 'dialog' })
      .afterClosed()
      .pipe(
        switchMap((confirmed) => (confirmed ? this.api.discardDraft(revision.id).pipe(map(() => true)) : of(false))),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe({
        next: (discarded) => {
          if (discarded) void this.router.navigate(['/drafts']);
        },
        error: (error: ApiRequestError) => this.saveProblem.set(error.message),
      });
  }

  /** Saves an accepted CSV preview into the draft at once: accepting is the engineer's decision. */
  protected acceptUpload(upload: SpeedTableUploadResponse): void {
    const changes = this.form.acceptUpload(upload);
    this.uploadChanges.set(changes);
    this.persist().subscribe();
  }

  /**
   * PATCHes the content and change summary; emits the saved revision, or null (and says why on
   * screen) when the server refused.
   */
  private persist(): Observable<RevisionView | null> {
    const revision = this.revision();
    if (!revision) return of(null);
    if (this.changeSummary.invalid) {
      this.saveProblem.set('Give the change summary before saving.');
      return of(null);
    }
    this.saving.set(true);
    this.saveProblem.set(null);
    this.notice.set(null);
    return new Observable<RevisionView | null>((subscriber) => {
      const request = this.api
        .updateDraft(revision.id, { content: this.form.content(), changeSummary: this.changeSummary.value.trim() })
        .pipe(takeUntilDestroyed(this.destroyRef))
        .subscribe({
          next: (saved) => {
            this.saving.set(false);
            this.revision.set(saved);
            this.dirty.set(false);
            this.notice.set(`Draft saved. ${Object.keys(saved.problems).length ? 'It can be submitted once the problems listed are fixed.' : 'It is complete and can be submitted for review.'}`);
            subscriber.next(saved);
            subscriber.complete();
          },
          error: (error: ApiRequestError) => {
            this.showServerRefusal(error);
            subscriber.next(null);
            subscriber.complete();
          },
        });
      return () => request.unsubscribe();
    });
  }

  private showServerRefusal(error: ApiRequestError): void {
    this.saving.set(false);
    const content: Record<string, string> = {};
    for (const [path, sentence] of Object.entries(error.fields)) {
      if (path === 'changeSummary') this.changeSummary.setErrors({ schema: sentence });
      else content[path.replace(/^content\./, '')] = sentence;
    }
    this.serverProblems.set(content);
    this.placeProblems();
    this.form.group.markAllAsTouched();
    this.saveProblem.set(error.message);
  }

  private loadDraft(id: number): void {
    this.loading.set(true);
    this.problem.set(null);
    if (!Number.isFinite(id)) {
      this.problem.set('This address does not name a revision. Choose a draft from the list.');
      this.loading.set(false);
      return;
    }
    this.api
      .revision(id)
      .pipe(
        switchMap((revision) => forkJoin({ revision: of(revision), book: this.api.speedBook(revision.speedBookId) })),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe({
        next: ({ revision, book }) => {
          this.revision.set(revision);
          this.book.set(book);
          this.fillForm(revision);
          this.loading.set(false);
        },
        error: (error: ApiRequestError) => {
          this.problem.set(error.message);
          this.loading.set(false);
        },
      });
  }

  private fillForm(revision: RevisionView): void {
    this.formChanges?.unsubscribe();
    this.form.load(revision.content);
    this.statedUnits.set(this.form.statedUnits());
    this.changeSummary.setValue(revision.changeSummary);
    this.checkContent();
    this.formChanges = this.form.group.valueChanges.pipe(takeUntilDestroyed(this.destroyRef)).subscribe(() => {
      this.statedUnits.set(this.form.statedUnits());
      this.dirty.set(true);
      this.serverProblems.set({});
      this.checkContent();
    });
    this.changeSummary.valueChanges.pipe(takeUntilDestroyed(this.destroyRef)).subscribe(() => this.dirty.set(true));
  }

  /** The shared schema's sentences for the content as it stands, placed at their fields. */
  private checkContent(): void {
    const content = this.form.content();
    this.localProblems.set(contentProblems(content));
    this.coverage.contentChanged(content, Object.keys(this.localProblems()).length);
    this.configurationKeys.set(this.form.configurations.controls.map((c) => c.controls.key.value).filter(Boolean));
    this.placeProblems();
  }

  private placeProblems(): void {
    const problems = this.problems();
    for (const [path, control] of this.form.fieldControls()) {
      const sentence = problems[path];
      control.setErrors(sentence ? { schema: sentence } : null, { emitEvent: false });
    }
  }
}
