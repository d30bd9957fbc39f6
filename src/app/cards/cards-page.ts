import { DOCUMENT, NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { FormControl, NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { ErrorStateMatcher } from '@angular/material/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { EMPTY, Subject, catchError, debounceTime, distinctUntilChanged, firstValueFrom, merge, of, switchMap, tap } from 'rxjs';
import type { RevisionSummary } from '../../../shared/api/revisions';
import { can } from '../../../shared/auth/roles';
import { CardRefusedError, buildCard, enRouteDeviationCheck, startingEnRouteDeviationC, takeoffConfigurationKeys, type CardInputs, type SpeedCard } from '../../../shared/card';
import { AeroInputError, isaDeviationC, pressureAltitudeFt } from '../../../shared/aero';
import { revisionContentSchema, type RevisionContent } from '../../../shared/speed-book/revision-content';
import { ApiRequestError } from '../core/api/api-request-error';
import { AuthService } from '../core/auth/auth-service';
import {
  ALTITUDE_STEPS_FT,
  cardInputsFrom,
  createCardForm,
  formFieldOfRefusal,
  parseTyped,
  startingValues,
  type CardFormValue,
  type FormFieldPath,
} from './card-form';
import { CardLog } from './card-log';
import { CardNumberPipe, cardNumber } from './card-number-pipe';
import { CardSources, airframeChoicesOf, cardContextOf, cardRevisionOf, revisionSourceOf, type AirframeChoice, type CardRevisionSource } from './card-sources';
import { SyncService } from '../core/sync/sync-service';
import { utcMinutes } from '../core/sync/device-sync';
import { SyncStatusPanel } from '../core/sync/sync-status-panel';
import { RevisionNotices } from '../core/sync/revision-notices';
import {
  CANONICAL_UNITS,
  UNIT_FIELDS,
  UnitPreferences,
  formatInUnit,
  fromCanonical,
  otherUnit,
  toCanonical,
  type AnyUnit,
  type UnitChoice,
  type UnitField,
} from './card-units';
import { DeviceCardLog } from './device-card-log';
import { CardPaperPreference } from './card-paper-preference';
import { CardPrintError, CardPrinter } from './card-printer';
import { checkUrl, formatCardCode } from '../../../shared/card-check';
import { CARD_PAPERS, CARD_PAPER_SIZES, cardChanges, cardPdf, previousCardOf, type CardPaperSize, type PreviousCard } from '../../../shared/card-pdf';
import { DeviceStore } from '../core/storage/device-store';
import { SpeedCardView, utcDate, type EnteredInput } from './speed-card-view';
import { TatDeviation } from './tat-deviation';

/** Long enough that typing "1050" builds one card, short enough to feel live. */
export const CARD_DEBOUNCE_MS = 300;

/** The current published revision of the airframe's book, or an open revision an engineer previews. */
const PUBLISHED = 0;

type Outcome =
  | { readonly kind: 'card'; readonly card: SpeedCard }
  | { readonly kind: 'refused'; readonly field: string; readonly message: string }
  | { readonly kind: 'incomplete'; readonly problems: Partial<Record<FormFieldPath, string>> };

interface Snapshot {
  readonly value: CardFormValue;
  readonly units: UnitChoice;
}

/** Which form field each unit choice belongs to. */
const UNIT_CONTROL: Readonly<Record<UnitField, FormFieldPath>> = {
  weight: 'weight',
  landingWeight: 'landingWeight',
  departureElevation: 'departure.elevation',
  departureQnh: 'departure.qnh',
  departureOat: 'departure.oat',
  departureDewPoint: 'departure.dewPoint',
  arrivalElevation: 'arrival.elevation',
  arrivalQnh: 'arrival.qnh',
  arrivalOat: 'arrival.oat',
  arrivalDewPoint: 'arrival.dewPoint',
  isaDeviation: 'isaDeviation',
  cruiseIas: 'cruiseIas',
};

/**
 * The speed card: choose the airframe, type the day's weight and atmosphere in the units you
 * like, and read the card as you type. The card is computed on this device with the same
 * `buildCard` the server runs, so it needs no network once the revision is here.
 */
@Component({
  selector: 'sw-cards-page',
  imports: [
    NgTemplateOutlet,
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatCheckboxModule,
    MatIconModule,
    MatProgressBarModule,
    CardNumberPipe,
    SpeedCardView,
    TatDeviation,
    DeviceCardLog,
    SyncStatusPanel,
    RevisionNotices,
  ],
  templateUrl: './cards-page.html',
  styleUrl: './cards-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CardsPage {
  private readonly sources = inject(CardSources);
  private readonly sync = inject(SyncService);
  private readonly cardLog = inject(CardLog);
  private readonly unitPreferences = inject(UnitPreferences);
  private readonly destroyRef = inject(DestroyRef);
  private readonly document = inject(DOCUMENT);
  private readonly user = inject(AuthService).user;
  private readonly printer = inject(CardPrinter);
  private readonly paperPreference = inject(CardPaperPreference);
  private readonly deviceStore = inject(DeviceStore);

  protected readonly altitudeSteps = ALTITUDE_STEPS_FT;
  protected readonly canPreviewDrafts = computed(() => {
    const user = this.user();
    return user !== null && can(user.role, 'edit-speed-books');
  });

  /** Airframes, types and published revisions from the device store: no network needed. */
  protected readonly choices = computed<readonly AirframeChoice[]>(() => airframeChoicesOf(this.sync.snapshot()));
  protected readonly loadingFleet = computed(() => this.sync.snapshot() === null || (this.sync.snapshot()?.state?.lastSyncedAt == null && this.sync.status().phase === 'syncing'));
  /** Whether the device's data may carry cards (the operator's currency limit), and why not. */
  protected readonly currency = this.sync.currency;
  protected readonly currencyRefusal = computed(() => {
    const currency = this.currency();
    return currency && !currency.current && !this.loadingFleet() ? currency.refusal : null;
  });
  protected readonly dataAsOf = computed(() => {
    const asOf = this.currency()?.asOf;
    return asOf ? `Data as of ${utcMinutes(asOf)} (last sync of this device)` : null;
  });
  protected readonly airframeControl = new FormControl<number | null>({ value: null, disabled: true });
  protected readonly revisionControl = new FormControl<number>(PUBLISHED, { nonNullable: true });
  protected readonly openRevisions = signal<readonly RevisionSummary[]>([]);
  protected readonly revision = signal<CardRevisionSource | null>(null);
  protected readonly loadingRevision = signal(false);
  protected readonly revisionProblem = signal<string | null>(null);

  protected readonly form = createCardForm(inject(NonNullableFormBuilder));
  protected readonly units = signal<UnitChoice>(CANONICAL_UNITS);
  private readonly snapshot = signal<Snapshot | null>(null);
  private readonly recompute = new Subject<void>();

  protected readonly issuing = signal(false);
  protected readonly issued = signal<{ digest: string; sentence: string; ok: boolean; entryId: string | null } | null>(null);

  protected readonly paperSizes = CARD_PAPER_SIZES.map((size) => ({ size, label: CARD_PAPERS[size].label }));
  protected readonly paper = signal<CardPaperSize>('half-letter');
  protected readonly printing = signal(false);
  protected readonly printed = signal<{ digest: string; sentence: string; ok: boolean } | null>(null);

  protected readonly choice = computed(() => this.choices().find((choice) => choice.airframe.id === this.selectedAirframeId()) ?? null);
  private readonly selectedAirframeId = signal<number | null>(null);

  protected readonly content = computed<RevisionContent | null>(() => {
    const revision = this.revision();
    if (!revision) return null;
    const parsed = revisionContentSchema.safeParse(revision.content);
    return parsed.success ? parsed.data : null;
  });

  protected readonly configurations = computed(() => {
    const content = this.content();
    if (!content) return [];
    const keys = takeoffConfigurationKeys(content);
    return content.configurations.filter((configuration) => keys.includes(configuration.key));
  });

  protected readonly isDraft = computed(() => {
    const revision = this.revision();
    return revision !== null && revision.status !== 'published';
  });

  protected readonly outcome = computed<Outcome | null>(() => {
    const snapshot = this.snapshot();
    const revision = this.revision();
    const choice = this.choice();
    if (!snapshot || !revision || !choice?.book) return null;
    const reading = cardInputsFrom(snapshot.value, snapshot.units, choice.airframe.id);
    if (reading.inputs === null) return { kind: 'incomplete', problems: reading.problems };
    return this.build(revision, choice, reading.inputs);
  });

  protected readonly card = computed(() => {
    const outcome = this.outcome();
    return outcome?.kind === 'card' ? outcome.card : null;
  });

  /** The sentence at each field: a typing problem, or the card's refusal at the input at fault. */
  private readonly fieldProblems = computed<Partial<Record<FormFieldPath, string>>>(() => {
    const outcome = this.outcome();
    if (!outcome || outcome.kind === 'card') return {};
    if (outcome.kind === 'incomplete') return outcome.problems;
    const path = formFieldOfRefusal(outcome.field);
    return path ? { [path]: outcome.message } : {};
  });

  /** A refusal that belongs to no field of the form (the revision, the airframe). */
  protected readonly generalRefusal = computed(() => {
    const outcome = this.outcome();
    return outcome?.kind === 'refused' && formFieldOfRefusal(outcome.field) === null ? outcome.message : null;
  });

  protected readonly refusalSentence = computed(() => {
    const outcome = this.outcome();
    if (outcome?.kind === 'refused') return outcome.message;
    if (outcome?.kind === 'incomplete') return Object.values(outcome.problems)[0] ?? null;
    return null;
  });

  protected readonly entered = computed<EnteredInput[]>(() => {
    const snapshot = this.snapshot();
    return snapshot && this.card() ? enteredInputs(snapshot) : [];
  });

  protected readonly weightRange = computed(() => {
    const content = this.content();
    if (!content) return '';
    const unit = this.units().weight;
    const show = (kg: number) => cardNumber(fromCanonical(unit, kg, 'mass'));
    return `${show(content.weights.minimumKg)} to ${show(content.weights.maximumTakeoffKg)} ${unit}`;
  });

  protected readonly landingWeightRange = computed(() => {
    const content = this.content();
    if (!content) return '';
    const unit = this.units().landingWeight;
    return `Optional, up to ${cardNumber(fromCanonical(unit, content.weights.maximumLandingKg, 'mass'))} ${unit}; empty: the takeoff weight, or the maximum landing weight when the takeoff weight is above it`;
  });

  /** The departure's own ISA deviation, °C, from what is typed; null until it can be computed. */
  protected readonly departureDeviationC = computed<number | null>(() => {
    const snapshot = this.snapshot();
    if (!snapshot) return null;
    const reading = cardInputsFrom(snapshot.value, snapshot.units, 1);
    if (!reading.inputs) return null;
    const { elevationFt, qnhHpa, oatC } = reading.inputs.departure;
    try {
      return isaDeviationC(pressureAltitudeFt(elevationFt, qnhHpa), oatC);
    } catch (error) {
      if (error instanceof AeroInputError) return null;
      throw error;
    }
  });

  /** A sentence asking to confirm an en-route deviation more than 20 °C from the departure's. */
  protected readonly enRouteCheck = computed(() => {
    const departureC = this.departureDeviationC();
    const snapshot = this.snapshot();
    // While it follows the departure's own there is nothing to confirm (and no flash while it catches up).
    if (departureC === null || !snapshot || this.isaDeviationFollowsDeparture()) return null;
    const reading = cardInputsFrom(snapshot.value, snapshot.units, 1);
    return reading.inputs ? enRouteDeviationCheck(departureC, reading.inputs.isaDeviationC) : null;
  });
  private readonly confirmedEnRouteCheck = signal<string | null>(null);
  protected readonly needsIsaConfirmation = computed(() => this.enRouteCheck() !== null && this.confirmedEnRouteCheck() !== this.enRouteCheck());
  protected readonly isaDeviationHint = computed(() => {
    const departureC = this.departureDeviationC();
    if (departureC === null) return 'Above ISA: positive';
    const whole = startingEnRouteDeviationC(departureC);
    return `Above ISA: positive; the departure is at ISA ${whole >= 0 ? '+' : '−'}${Math.abs(whole)} °C`;
  });
  protected readonly tatRecoveryFactor = computed(() => this.content()?.aircraft.tatRecoveryFactor ?? 1);
  /** The en-route deviation follows the departure's until the pilot types one. */
  private readonly isaDeviationFollowsDeparture = signal(true);
  private settingIsaDeviation = false;

  protected readonly publishedWords = computed(() => {
    const revision = this.revision();
    if (!revision) return '';
    return revision.publishedAt ? `Revision ${revision.number}, published ${utcDate(revision.publishedAt)}` : `Revision ${revision.number} (${revision.status.replace('_', ' ')}), preview only`;
  });

  constructor() {
    this.loadUnits();
    const user = this.user();
    if (user) this.paper.set(this.paperPreference.load(user.id));
    this.followFleet();
    this.followSelection();
    this.followForm();
    void this.cardLog.refresh();
  }

  protected control(path: FormFieldPath): FormControl<string> {
    return this.form.get(path) as FormControl<string>;
  }

  protected problemAt(path: FormFieldPath): string | null {
    return this.fieldProblems()[path] ?? null;
  }

  /** Marks a field as in error while it has a sentence, whether or not it was touched. */
  protected matcherFor(path: FormFieldPath): ErrorStateMatcher {
    this.matchers[path] ??= { isErrorState: () => this.problemAt(path) !== null };
    return this.matchers[path]!;
  }
  private readonly matchers: Partial<Record<FormFieldPath, ErrorStateMatcher>> = {};

  protected unitOf(field: UnitField): AnyUnit {
    return this.units()[field];
  }

  protected nextUnitOf(field: UnitField): AnyUnit {
    return otherUnit(UNIT_FIELDS[field], this.units()[field] as never);
  }

  /** Switches one field to its other unit, converting what is typed so the card stays the same. */
  protected switchUnit(field: UnitField): void {
    const quantity = UNIT_FIELDS[field];
    const from = this.units()[field];
    const to = otherUnit(quantity, from as never) as AnyUnit;
    const control = this.form.get(UNIT_CONTROL[field]) as FormControl<string>;
    const typed = parseTyped(control.value);
    this.units.update((units) => ({ ...units, [field]: to }));
    const user = this.user();
    if (user) this.unitPreferences.save(user.id, this.units());
    if (typed !== null) {
      try {
        control.setValue(formatInUnit(to, fromCanonical(to, toCanonical(from, typed, quantity), quantity)));
      } catch {
        // A value the conversion refuses stays as typed; its sentence appears at the field.
      }
    }
    this.recompute.next();
  }

  protected confirmEnRouteDeviation(confirmed: boolean): void {
    this.confirmedEnRouteCheck.set(confirmed ? this.enRouteCheck() : null);
  }

  /** Sets the en-route ISA deviation (°C) from the TAT reading, in the field's unit. */
  protected useTatDeviation(deviationC: number): void {
    this.isaDeviationFollowsDeparture.set(false);
    this.setIsaDeviation(deviationC);
  }

  private setIsaDeviation(deviationC: number): void {
    const unit = this.units().isaDeviation;
    const text = formatInUnit(unit, fromCanonical(unit, deviationC, UNIT_FIELDS.isaDeviation));
    if (this.form.controls.isaDeviation.value === text) return;
    this.settingIsaDeviation = true;
    this.form.controls.isaDeviation.setValue(text);
    this.settingIsaDeviation = false;
  }

  protected async issueCard(): Promise<void> {
    const card = this.card();
    const user = this.user();
    if (!card || !user || this.isDraft() || this.issuing() || this.currencyRefusal() || this.needsIsaConfirmation()) return;
    this.issuing.set(true);
    try {
      const { entry, outcome } = await this.cardLog.issue(card, user);
      void this.sync.reload();
      const at = utcDate(entry.issuedAt);
      this.issued.set(
        outcome.problem === null
          ? { digest: card.digest, ok: true, entryId: entry.id, sentence: `Card issued at ${at} and recorded in the operator's card log.` }
          : { digest: card.digest, ok: false, entryId: entry.id, sentence: `Card issued at ${at} on this device. ${outcome.problem}` },
      );
    } catch {
      this.issued.set({ digest: card.digest, ok: false, entryId: null, sentence: 'This device could not store the card, so it was not issued. Check the browser allows site storage, then try again.' });
    } finally {
      this.issuing.set(false);
    }
  }

  protected choosePaper(paper: CardPaperSize): void {
    this.paper.set(paper);
    const user = this.user();
    if (user) this.paperPreference.save(user.id, paper);
  }

  /**
   * Prints the card on screen as a PDF. A printed card is an issued card: when this card is not
   * issued yet, printing issues it first (one card-log entry per card, however often it is
   * printed), so the paper carries the code the card log gave it.
   */
  protected async printCard(): Promise<void> {
    const card = this.card();
    const choice = this.choice();
    const user = this.user();
    if (!card || !choice?.book || !user || this.isDraft() || this.printing() || this.needsIsaConfirmation()) return;
    const refusal = this.currencyRefusal();
    if (refusal) {
      this.printed.set({ digest: card.digest, ok: false, sentence: refusal });
      return;
    }
    this.printing.set(true);
    this.printed.set(null);
    try {
      if (this.issuedForThisCard()?.entryId == null) await this.issueCard();
      const issued = this.issuedForThisCard();
      if (!issued?.entryId) throw new CardPrintError(issued?.sentence ?? 'The card could not be issued, so it was not printed.');
      const entry = await this.deviceStore.db.cardLog.get(issued.entryId);
      const code = await this.cardLog.codeOf(issued.entryId);
      const context = cardContextOf(choice, user.operatorIsDemo);
      const previous = await this.previousCard(card, context);
      const issuedAt = entry?.issuedAt ?? new Date().toISOString();
      const { definition, fileName } = cardPdf({
        card,
        code: code ? formatCardCode(code) : null,
        checkUrl: code ? checkUrl(this.origin(), code, { revisionId: card.revision.id, inputs: card.inputs, digest: card.digest }) : null,
        issuedAt,
        dataAsOf: `${this.dataAsOf() ?? `Data as of ${utcDate(issuedAt)}`}: revision ${card.revision.number} of ${card.speedBook.title}; printed ${utcDate(new Date().toISOString())}.`,
        changes: cardChanges(card, previous),
        paper: this.paper(),
      });
      await this.printer.download(definition, fileName);
      this.printed.set({
        digest: card.digest,
        ok: code !== null,
        sentence: code
          ? `${fileName} is ready: print it ${CARD_PAPERS[this.paper()].howToPrint}. Card code ${formatCardCode(code)}.`
          : `${fileName} is ready, without a check code: this card waits on the device until the card log records it. Print it again then, for a card anyone can check.`,
      });
    } catch (error) {
      const sentence = error instanceof CardPrintError ? error.message : 'The PDF could not be made on this device. Reload Speedwright and try again.';
      this.printed.set({ digest: card.digest, ok: false, sentence });
    } finally {
      this.printing.set(false);
    }
  }

  protected readonly printedForThisCard = computed(() => {
    const printed = this.printed();
    return printed && printed.digest === this.card()?.digest ? printed : null;
  });

  private origin(): string {
    return this.document.defaultView?.location.origin ?? '';
  }

  /** What the revision published before this card's gives for the same inputs (for the revision marks). */
  private async previousCard(card: SpeedCard, context: ReturnType<typeof cardContextOf>): Promise<PreviousCard> {
    // Revision numbers start at 1: the first revision has nothing before it.
    if (card.revision.number <= 1) return { kind: 'none' };
    const earlier = (candidates: { id: number; number: number }[]) => candidates.filter((r) => r.number < card.revision.number).sort((a, b) => b.number - a.number)[0];
    try {
      const stored = earlier(await this.deviceStore.db.revisions.where('speedBookId').equals(card.speedBook.id).toArray());
      if (stored) {
        const record = (await this.deviceStore.db.revisions.get(stored.id))!;
        return previousCardOf({ id: record.id, number: record.number, publishedAt: record.publishedAt, contentSha256: record.contentSha256, content: record.content }, card.inputs, context);
      }
    } catch {
      // No device store: ask the server.
    }
    try {
      const summaries = await firstValueFrom(this.sources.publishedRevisions(card.speedBook.id));
      const summary = earlier(summaries);
      if (!summary) return { kind: 'none' };
      return previousCardOf(cardRevisionOf(await firstValueFrom(this.sources.revision(summary.id))), card.inputs, context);
    } catch {
      return { kind: 'unavailable', revisionNumber: null };
    }
  }

  protected readonly issuedForThisCard = computed(() => {
    const issued = this.issued();
    return issued && issued.digest === this.card()?.digest ? issued : null;
  });

  private build(revision: CardRevisionSource, choice: AirframeChoice, inputs: CardInputs): Outcome {
    try {
      return { kind: 'card', card: buildCard(cardRevisionOf(revision), inputs, cardContextOf(choice, this.user()?.operatorIsDemo ?? true)) };
    } catch (error) {
      if (error instanceof CardRefusedError) return { kind: 'refused', field: error.field, message: error.message };
      throw error;
    }
  }

  private loadUnits(): void {
    const user = this.user();
    if (!user) return;
    this.units.set(this.unitPreferences.load(user.id));
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

  protected syncNow(): void {
    this.sync.syncNow();
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
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe();
    // A sync that brings a new revision (or supersedes, or withdraws this one) changes the card.
    const current = toObservable(computed(() => `${this.choice()?.book?.currentRevision?.id ?? 0}:${this.choice()?.book?.currentRevision?.status ?? ''}`));
    merge(this.revisionControl.valueChanges, current.pipe(distinctUntilChanged()))
      .pipe(
        switchMap(() => this.loadRevision()),
        takeUntilDestroyed(this.destroyRef),
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
    if (!previous || previous.speedBookId !== revision.speedBookId) this.startForm();
    else this.recompute.next();
  }

  private loadOpenRevisions(bookId: number): void {
    this.sources
      .openRevisions(bookId)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({ next: (revisions) => this.openRevisions.set(revisions), error: () => this.openRevisions.set([]) });
  }

  private startForm(): void {
    const content = this.content();
    this.isaDeviationFollowsDeparture.set(true);
    this.settingIsaDeviation = true;
    if (content) this.form.setValue(startingValues(content, this.units()));
    else this.recompute.next();
    this.settingIsaDeviation = false;
  }

  private followForm(): void {
    merge(this.form.valueChanges, this.recompute)
      .pipe(debounceTime(CARD_DEBOUNCE_MS), takeUntilDestroyed(this.destroyRef))
      .subscribe(() => this.snapshot.set({ value: this.form.getRawValue(), units: this.units() }));
    // A deviation the pilot types is theirs; until then it follows the departure's own.
    this.form.controls.isaDeviation.valueChanges.pipe(takeUntilDestroyed(this.destroyRef)).subscribe(() => {
      if (!this.settingIsaDeviation) this.isaDeviationFollowsDeparture.set(false);
    });
    effect(() => {
      const departureC = this.departureDeviationC();
      if (departureC !== null && this.isaDeviationFollowsDeparture()) this.setIsaDeviation(startingEnRouteDeviationC(departureC));
    });
  }
}

/** The inputs as typed, with the canonical figure beside any typed in another unit. */
function enteredInputs({ value, units }: Snapshot): EnteredInput[] {
  const items: EnteredInput[] = [];
  const add = (label: string, field: UnitField, text: string) => {
    const typed = parseTyped(text);
    if (typed === null) return;
    const unit = units[field];
    const canonicalUnit = CANONICAL_UNITS[field];
    // As typed (a comma read as the decimal point), and in the card's unit when typed in another.
    let shown = `${text.trim().replace(',', '.')} ${unit}`;
    if (unit !== canonicalUnit) shown += ` (${formatInUnit(canonicalUnit, toCanonical(unit, typed, UNIT_FIELDS[field]))} ${canonicalUnit})`;
    items.push({ label, value: shown });
  };
  add('Takeoff weight', 'weight', value.weight);
  add('Landing weight', 'landingWeight', value.landingWeight);
  add('Departure elevation', 'departureElevation', value.departure.elevation);
  add('Departure QNH', 'departureQnh', value.departure.qnh);
  add('Departure OAT', 'departureOat', value.departure.oat);
  add('Departure dew point', 'departureDewPoint', value.departure.dewPoint);
  if (value.hasArrival) {
    add('Arrival elevation', 'arrivalElevation', value.arrival.elevation);
    add('Arrival QNH', 'arrivalQnh', value.arrival.qnh);
    add('Arrival OAT', 'arrivalOat', value.arrival.oat);
    add('Arrival dew point', 'arrivalDewPoint', value.arrival.dewPoint);
  }
  add('ISA deviation (en route)', 'isaDeviation', value.isaDeviation);
  return items;
}
