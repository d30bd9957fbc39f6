import { DestroyRef, Injectable, computed, effect, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { FormControl } from '@angular/forms';
import { EMPTY, Subject, catchError, distinctUntilChanged, merge, of, switchMap, tap } from 'rxjs';
import type { RevisionSummary } from '@shared/api/revisions';
import { takeoffConfigurationKeys } from '@shared/card';
import { revisionContentSchema, type RevisionContent } from '@shared/speed-book/revision-content';
import { userMay } from '../core/auth/user-may';
import { ApiRequestError } from '../core/api/api-request-error';
import { utcDate, utcMinutes } from '../core/format/display-format';
import { SyncService } from '../core/sync/sync-service';
import { CardSources, airframeChoicesOf, revisionSourceOf, type AirframeChoice, type CardRevisionSource } from './card-sources';

/** The current published revision of the airframe's book, or an open revision an engineer previews. */
export const PUBLISHED = 0;

/** A revision the page now shows; `newBook` when it belongs to another book than the one before. */
export interface ShownRevision {
  readonly revision: CardRevisionSource;
  readonly newBook: boolean;
}

/**
 * The card page's revision selection (component-scoped: provided by `CardsPage`): the airframe
 * chosen from the device store, the revision its card rests on (the book's published revision on
 * this device, or an open revision an engineer previews from the server), and whether the device's
 * data is current enough for cards (the operator's currency limit). Offline-first: the published
 * revision needs no network.
 */
@Injectable()
export class CardRevisionSelection {
  private readonly sources = inject(CardSources);
  private readonly sync = inject(SyncService);
  private readonly destroyRef = inject(DestroyRef);

  readonly canPreviewDrafts = userMay('edit-speed-books');

  /** Airframes, types and published revisions from the device store: no network needed. */
  readonly choices = computed<readonly AirframeChoice[]>(() => airframeChoicesOf(this.sync.snapshot()));
  readonly loadingFleet = computed(() => this.sync.snapshot() === null || (this.sync.snapshot()?.state?.lastSyncedAt == null && this.sync.status().phase === 'syncing'));
  /** Whether the device's data may carry cards (the operator's currency limit), and why not. */
  readonly currency = this.sync.currency;
  readonly currencyRefusal = computed(() => {
    const currency = this.currency();
    return currency && !currency.current && !this.loadingFleet() ? currency.refusal : null;
  });
  readonly dataAsOf = computed(() => {
    const asOf = this.currency()?.asOf;
    return asOf ? `Data as of ${utcMinutes(asOf)} (last sync of this device)` : null;
  });

  readonly airframeControl = new FormControl<number | null>({ value: null, disabled: true });
  readonly revisionControl = new FormControl<number>(PUBLISHED, { nonNullable: true });
  readonly openRevisions = signal<readonly RevisionSummary[]>([]);
  readonly revision = signal<CardRevisionSource | null>(null);
  readonly loadingRevision = signal(false);
  readonly revisionProblem = signal<string | null>(null);

  private readonly selectedAirframeId = signal<number | null>(null);
  readonly choice = computed(() => this.choices().find((choice) => choice.airframe.id === this.selectedAirframeId()) ?? null);

  readonly content = computed<RevisionContent | null>(() => {
    const revision = this.revision();
    if (!revision) return null;
    const parsed = revisionContentSchema.safeParse(revision.content);
    return parsed.success ? parsed.data : null;
  });

  readonly configurations = computed(() => {
    const content = this.content();
    if (!content) return [];
    const keys = takeoffConfigurationKeys(content);
    return content.configurations.filter((configuration) => keys.includes(configuration.key));
  });

  readonly isDraft = computed(() => {
    const revision = this.revision();
    return revision !== null && revision.status !== 'published';
  });

  readonly publishedWords = computed(() => {
    const revision = this.revision();
    if (!revision) return '';
    return revision.publishedAt ? `Revision ${revision.number}, published ${utcDate(revision.publishedAt)}` : `Revision ${revision.number} (${revision.status.replace('_', ' ')}), preview only`;
  });

  private readonly shownSubject = new Subject<ShownRevision>();
  /** Each revision shown, in order: the card form starts afresh for a new book. */
  readonly shown = this.shownSubject.asObservable();

  constructor() {
    this.followFleet();
    this.followSelection();
  }

  syncNow(): void {
    this.sync.syncNow();
  }

  /** The airframe list follows the device store (a sync may bring airframes while the page is open). */
  private followFleet(): void {
    effect(() => {
      const choices = this.choices();
      if (choices.length === 0) {
        this.airframeControl.disable({ emitEvent: false });
        return;
      }
      this.airframeControl.enable({ emitEvent: false });
      const chosen = this.airframeControl.value;
      if (chosen !== null && !choices.some((choice) => choice.airframe.id === chosen)) this.airframeControl.setValue(null);
      else if (chosen === null && choices.length === 1) this.airframeControl.setValue(choices[0].airframe.id);
    });
  }

  private followSelection(): void {
    this.airframeControl.valueChanges
      .pipe(
        tap((airframeId) => {
          this.selectedAirframeId.set(airframeId);
          this.openRevisions.set([]);
          this.revisionControl.setValue(PUBLISHED, { emitEvent: false });
        }),
        switchMap(() => this.loadRevision()),
        takeUntilDestroyed(),
      )
      .subscribe();
    // A sync that brings a new revision (or supersedes, or withdraws this one) changes the card.
    const current = toObservable(computed(() => `${this.choice()?.book?.currentRevision?.id ?? 0}:${this.choice()?.book?.currentRevision?.status ?? ''}`));
    merge(this.revisionControl.valueChanges, current.pipe(distinctUntilChanged()))
      .pipe(
        switchMap(() => this.loadRevision()),
        takeUntilDestroyed(),
      )
      .subscribe();
  }

  private loadRevision() {
    const choice = this.choice();
    this.revisionProblem.set(null);
    if (!choice) {
      this.revision.set(null);
      return EMPTY;
    }
    if (!choice.book) {
      this.revision.set(null);
      this.revisionProblem.set(`There is no speed book for the ${choice.type.name} yet, so no card can be prepared for ${choice.airframe.registration}.`);
      return EMPTY;
    }
    if (this.canPreviewDrafts() && this.openRevisions().length === 0) this.loadOpenRevisions(choice.book.id);
    if (this.revisionControl.value === PUBLISHED) {
      const published = choice.book.currentRevision;
      if (!published) {
        this.revision.set(null);
        this.revisionProblem.set(`${choice.book.title} has no published revision on this device, so no card can be prepared for ${choice.airframe.registration}.`);
        return EMPTY;
      }
      return of(revisionSourceOf(published)).pipe(tap((revision) => this.showRevision(revision)));
    }
    this.loadingRevision.set(true);
    return this.sources.revision(this.revisionControl.value).pipe(
      tap((revision) => {
        this.loadingRevision.set(false);
        this.showRevision(revision);
      }),
      catchError((error: ApiRequestError) => {
        this.revision.set(null);
        this.loadingRevision.set(false);
        this.revisionProblem.set(error.message);
        return EMPTY;
      }),
    );
  }

  private showRevision(revision: CardRevisionSource): void {
    const previous = this.revision();
    this.revision.set(revision);
    this.shownSubject.next({ revision, newBook: !previous || previous.speedBookId !== revision.speedBookId });
  }

  private loadOpenRevisions(bookId: number): void {
    this.sources
      .openRevisions(bookId)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({ next: (revisions) => this.openRevisions.set(revisions), error: () => this.openRevisions.set([]) });
  }
}
