import { Injectable, InjectionToken, computed, effect, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl, NonNullableFormBuilder } from '@angular/forms';
import type { ErrorStateMatcher } from '@angular/material/core';
import { Subject, asyncScheduler, debounceTime, merge, type SchedulerLike } from 'rxjs';
import { CardRefusedError, buildCard, enRouteDeviationCheck, startingEnRouteDeviationC, type CardInputs, type SpeedCard } from '@shared/card';
import { AeroInputError, isaDeviationC, pressureAltitudeFt } from '@shared/aero';
import { AuthService } from '../core/auth/auth-service';
import { SyncService } from '../core/sync/sync-service';
import { cardNumber } from '../core/format/display-format';
import { cardInputsFrom, createCardForm, formFieldOfRefusal, parseTyped, startingValues, type CardFormValue, type FormFieldPath } from './card-form';
import { CardRevisionSelection } from './card-revision-selection';
import { cardContextOf, cardRevisionOf, type AirframeChoice, type CardRevisionSource } from './card-sources';
import { CANONICAL_UNITS, UNIT_FIELDS, UnitPreferences, formatInUnit, fromCanonical, otherUnit, toCanonical, type AnyUnit, type UnitChoice, type UnitField } from './card-units';
import type { EnteredInput } from './speed-card-view';
import { directionWords, windWords } from '@shared/card/card-wind-words';

/** Long enough that typing "1050" builds one card, short enough to feel live. */
export const CARD_DEBOUNCE_MS = 300;

/** The clock of the typing pause: RxJS's own; a spec provides a virtual one and flushes it. */
export const CARD_FORM_SCHEDULER = new InjectionToken<SchedulerLike>('CARD_FORM_SCHEDULER', { factory: () => asyncScheduler });

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
 * The card page's form model (component-scoped: provided by `CardsPage`): the day's weight and
 * atmosphere as typed, in the units the person likes, and the card built from them on this
 * device with the same `buildCard` the server runs — or the refusal at the field at fault.
 * The card follows the form `CARD_DEBOUNCE_MS` after the last keystroke.
 */
@Injectable()
export class CardFormModel {
  private readonly selection = inject(CardRevisionSelection);
  private readonly sync = inject(SyncService);
  private readonly unitPreferences = inject(UnitPreferences);
  private readonly user = inject(AuthService).user;
  private readonly scheduler = inject(CARD_FORM_SCHEDULER);
  /** The operator's approach additive policy as this device last synced it (null before the first sync after an upgrade). */
  readonly approachPolicy = computed(() => this.sync.snapshot()?.operator?.approachAdditivePolicy ?? null);

  readonly form = createCardForm(inject(NonNullableFormBuilder));
  readonly units = signal<UnitChoice>(CANONICAL_UNITS);
  private readonly snapshot = signal<Snapshot | null>(null);
  private readonly recompute = new Subject<void>();

  readonly outcome = computed<Outcome | null>(() => {
    const snapshot = this.snapshot();
    const revision = this.selection.revision();
    const choice = this.selection.choice();
    if (!snapshot || !revision || !choice?.book) return null;
    const reading = cardInputsFrom(snapshot.value, snapshot.units, choice.airframe.id, this.approachPolicy());
    if (reading.inputs === null) return { kind: 'incomplete', problems: reading.problems };
    return this.build(revision, choice, reading.inputs);
  });

  readonly card = computed(() => {
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
  readonly generalRefusal = computed(() => {
    const outcome = this.outcome();
    return outcome?.kind === 'refused' && formFieldOfRefusal(outcome.field) === null ? outcome.message : null;
  });

  readonly refusalSentence = computed(() => {
    const outcome = this.outcome();
    if (outcome?.kind === 'refused') return outcome.message;
    if (outcome?.kind === 'incomplete') return Object.values(outcome.problems)[0] ?? null;
    return null;
  });

  readonly entered = computed<EnteredInput[]>(() => {
    const snapshot = this.snapshot();
    return snapshot && this.card() ? enteredInputs(snapshot) : [];
  });

  readonly weightRange = computed(() => {
    const content = this.selection.content();
    if (!content) return '';
    const unit = this.units().weight;
    const show = (kg: number) => cardNumber(fromCanonical(unit, kg, 'mass'));
    return `${show(content.weights.minimumKg)} to ${show(content.weights.maximumTakeoffKg)} ${unit}`;
  });

  readonly landingWeightRange = computed(() => {
    const content = this.selection.content();
    if (!content) return '';
    const unit = this.units().landingWeight;
    return `Optional, up to ${cardNumber(fromCanonical(unit, content.weights.maximumLandingKg, 'mass'))} ${unit}; empty: the takeoff weight, or the maximum landing weight when the takeoff weight is above it`;
  });

  /** The departure's own ISA deviation, °C, from what is typed; null until it can be computed. */
  readonly departureDeviationC = computed<number | null>(() => {
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
  readonly enRouteCheck = computed(() => {
    const departureC = this.departureDeviationC();
    const snapshot = this.snapshot();
    // While it follows the departure's own there is nothing to confirm (and no flash while it catches up).
    if (departureC === null || !snapshot || this.isaDeviationFollowsDeparture()) return null;
    const reading = cardInputsFrom(snapshot.value, snapshot.units, 1);
    return reading.inputs ? enRouteDeviationCheck(departureC, reading.inputs.isaDeviationC) : null;
  });
  private readonly confirmedEnRouteCheck = signal<string | null>(null);
  readonly needsIsaConfirmation = computed(() => this.enRouteCheck() !== null && this.confirmedEnRouteCheck() !== this.enRouteCheck());
  readonly isaDeviationHint = computed(() => {
    const departureC = this.departureDeviationC();
    if (departureC === null) return 'Above ISA: positive';
    const whole = startingEnRouteDeviationC(departureC);
    return `Above ISA: positive; the departure is at ISA ${whole >= 0 ? '+' : '−'}${Math.abs(whole)} °C`;
  });
  readonly tatRecoveryFactor = computed(() => this.selection.content()?.aircraft.tatRecoveryFactor ?? 1);
  /** The en-route deviation follows the departure's until the pilot types one. */
  private readonly isaDeviationFollowsDeparture = signal(true);
  private settingIsaDeviation = false;
  private readonly matchers: Partial<Record<FormFieldPath, ErrorStateMatcher>> = {};

  constructor() {
    this.loadUnits();
    this.followForm();
    this.selection.shown.pipe(takeUntilDestroyed()).subscribe(({ newBook }) => (newBook ? this.startForm() : this.recompute.next()));
  }

  control(path: FormFieldPath): FormControl<string> {
    return this.form.get(path) as FormControl<string>;
  }

  problemAt(path: FormFieldPath): string | null {
    return this.fieldProblems()[path] ?? null;
  }

  /** Marks a field as in error while it has a sentence, whether or not it was touched. */
  matcherFor(path: FormFieldPath): ErrorStateMatcher {
    this.matchers[path] ??= { isErrorState: () => this.problemAt(path) !== null };
    return this.matchers[path]!;
  }

  unitOf(field: UnitField): AnyUnit {
    return this.units()[field];
  }

  nextUnitOf(field: UnitField): AnyUnit {
    return otherUnit(UNIT_FIELDS[field], this.units()[field] as never);
  }

  /** Switches one field to its other unit, converting what is typed so the card stays the same. */
  switchUnit(field: UnitField): void {
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

  confirmEnRouteDeviation(confirmed: boolean): void {
    this.confirmedEnRouteCheck.set(confirmed ? this.enRouteCheck() : null);
  }

  /** Sets the en-route ISA deviation (°C) from the TAT reading, in the field's unit. */
  useTatDeviation(deviationC: number): void {
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

  private startForm(): void {
    const content = this.selection.content();
    this.isaDeviationFollowsDeparture.set(true);
    this.settingIsaDeviation = true;
    if (content) this.form.setValue(startingValues(content, this.units()));
    else this.recompute.next();
    this.settingIsaDeviation = false;
  }

  private followForm(): void {
    merge(this.form.valueChanges, this.recompute)
      .pipe(debounceTime(CARD_DEBOUNCE_MS, this.scheduler), takeUntilDestroyed())
      .subscribe(() => this.snapshot.set({ value: this.form.getRawValue(), units: this.units() }));
    // A deviation the pilot types is theirs; until then it follows the departure's own.
    this.form.controls.isaDeviation.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => {
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
  addWind(items, 'Departure wind', value.departure);
  if (value.hasArrival) addWind(items, 'Arrival wind', value.arrival);
  add('ISA deviation (en route)', 'isaDeviation', value.isaDeviation);
  if (value.icing) items.push({ label: 'Icing conditions', value: 'yes: iced speeds shown beside the normal ones' });
  return items;
}

/** "runway 270°M, wind 300°M 20 kt gusting 30 kt", when the wind fields are filled. */
function addWind(items: EnteredInput[], label: string, conditions: CardFormValue['departure']): void {
  const runway = parseTyped(conditions.runwayHeading);
  const direction = parseTyped(conditions.windDirection);
  const speed = parseTyped(conditions.windSpeed);
  if (runway === null || direction === null || speed === null) return;
  const gust = parseTyped(conditions.windGust);
  items.push({ label, value: `runway ${directionWords(runway)}, wind ${windWords({ directionDeg: direction, speedKt: speed, gustKt: gust })}` });
}
