/**
 * The card form as values typed in the units the pilot chose, and its one way into the card
 * model: `cardInputsFrom` converts every field to the canonical unit of `CardInputs` or says,
 * per field, what is missing or not a number.
 */
import { FormControl, FormGroup, NonNullableFormBuilder } from '@angular/forms';
import { takeoffConfigurationKeys } from '@shared/card';
import type { ApproachAdditivePolicy, CardInputs } from '@shared/card';
import type { RevisionContent } from '@shared/speed-book/revision-content';
import { AeroInputError } from '@shared/aero';
import { CANONICAL_UNITS, UNIT_FIELDS, formatInUnit, fromCanonical, toCanonical, type UnitChoice, type UnitField } from './card-units';

export type CruiseKind = 'ias' | 'mach';

export interface AerodromeControls {
  elevation: FormControl<string>;
  qnh: FormControl<string>;
  oat: FormControl<string>;
  dewPoint: FormControl<string>;
  /** Runway heading and wind, degrees (the one reference of `WIND_REFERENCE_SENTENCE`) and kt; all empty: no wind. */
  runwayHeading: FormControl<string>;
  windDirection: FormControl<string>;
  windSpeed: FormControl<string>;
  windGust: FormControl<string>;
}

/** The wind controls of an aerodrome, in the order the form shows them. */
export const WIND_CONTROLS = ['runwayHeading', 'windDirection', 'windSpeed', 'windGust'] as const;

export interface CardFormControls {
  configuration: FormControl<string>;
  weight: FormControl<string>;
  landingWeight: FormControl<string>;
  departure: FormGroup<AerodromeControls>;
  hasArrival: FormControl<boolean>;
  arrival: FormGroup<AerodromeControls>;
  isaDeviation: FormControl<string>;
  cruiseKind: FormControl<CruiseKind>;
  cruiseIas: FormControl<string>;
  cruiseMach: FormControl<string>;
  altitudeStepFt: FormControl<number>;
  /** Icing conditions: the card shows the book's iced speeds beside the normal ones. */
  icing: FormControl<boolean>;
}

export type CardForm = FormGroup<CardFormControls>;
export type CardFormValue = ReturnType<CardForm['getRawValue']>;

/** Spacing of the altitude table the pilot may choose, ft. */
export const ALTITUDE_STEPS_FT = [500, 1000, 2000, 5000] as const;

/** The path of a form control, as the template names it (`departure.oat`, `weight`). */
export type FormFieldPath =
  | 'configuration'
  | 'weight'
  | 'landingWeight'
  | `${'departure' | 'arrival'}.${keyof AerodromeControls}`
  | 'isaDeviation'
  | 'cruiseIas'
  | 'cruiseMach'
  | 'altitudeStepFt';

export function createCardForm(fb: NonNullableFormBuilder): CardForm {
  const aerodrome = () =>
    fb.group<AerodromeControls>({
      elevation: fb.control('0'),
      qnh: fb.control('1013'),
      oat: fb.control('15'),
      dewPoint: fb.control(''),
      runwayHeading: fb.control(''),
      windDirection: fb.control(''),
      windSpeed: fb.control(''),
      windGust: fb.control(''),
    });
  return fb.group<CardFormControls>({
    configuration: fb.control(''),
    weight: fb.control(''),
    landingWeight: fb.control(''),
    departure: aerodrome(),
    hasArrival: fb.control(false),
    arrival: aerodrome(),
    isaDeviation: fb.control('0'),
    cruiseKind: fb.control<CruiseKind>('ias'),
    cruiseIas: fb.control(''),
    cruiseMach: fb.control(''),
    altitudeStepFt: fb.control(1000),
    icing: fb.control(false),
  });
}

/**
 * Starting values for a revision, in the pilot's units: the reference weight, a standard day at
 * sea level, and a cruise IAS a little below VNO or VMO. Only a start: the pilot types the day's figures over them.
 */
export function startingValues(content: RevisionContent, units: UnitChoice): CardFormValue {
  const shown = (field: UnitField, canonical: number) => formatInUnit(units[field], fromCanonical(units[field], canonical, UNIT_FIELDS[field]));
  const aerodrome = (prefix: 'departure' | 'arrival') => ({
    elevation: shown(`${prefix}Elevation`, 0),
    qnh: shown(`${prefix}Qnh`, 1013),
    oat: shown(`${prefix}Oat`, 15),
    dewPoint: '',
    runwayHeading: '',
    windDirection: '',
    windSpeed: '',
    windGust: '',
  });
  const { limits, aircraft, weights, configurations } = content;
  const cruiseTable = configurations[0].positionError;
  const topIasKt = cruiseTable[cruiseTable.length - 1].iasKt;
  const limitKt = limits.vnoKt ?? limits.vmoKt ?? limits.vneKt ?? topIasKt;
  const cruiseIasKt = Math.min(topIasKt, Math.round((0.8 * limitKt) / 5) * 5);
  return {
    configuration: takeoffConfigurationKeys(content)[0] ?? '',
    weight: shown('weight', weights.referenceKg ?? weights.maximumTakeoffKg),
    landingWeight: '',
    departure: aerodrome('departure'),
    hasArrival: false,
    arrival: aerodrome('arrival'),
    isaDeviation: shown('isaDeviation', 0),
    cruiseKind: 'ias',
    cruiseIas: shown('cruiseIas', cruiseIasKt),
    cruiseMach: limits.mmo === undefined ? '0.3' : String(Math.round((limits.mmo - 0.05) * 100) / 100),
    altitudeStepFt: aircraft.ceilingFt > 20_000 ? 2000 : 1000,
    icing: false,
  };
}

const NUMBER = /^[+-]?(\d+([.,]\d*)?|[.,]\d+)$/;

/** A typed number: a point or a comma as the decimal separator; null for text that is not one. */
export function parseTyped(text: string): number | null {
  const trimmed = text.trim().replace(/\s/g, '');
  if (!NUMBER.test(trimmed)) return null;
  const value = Number(trimmed.replace(',', '.'));
  return Number.isFinite(value) ? value : null;
}

/** What the pilot typed, as `CardInputs`, or the sentence for each field that cannot be read. */
export type FormReading = { readonly inputs: CardInputs; readonly problems: null } | { readonly inputs: null; readonly problems: Partial<Record<FormFieldPath, string>> };

const FIELD_WORDS: Record<UnitField, string> = {
  weight: 'the takeoff weight',
  landingWeight: 'the landing weight',
  departureElevation: 'the departure field elevation',
  departureQnh: 'the departure QNH',
  departureOat: 'the departure OAT',
  departureDewPoint: 'the departure dew point',
  arrivalElevation: 'the arrival field elevation',
  arrivalQnh: 'the arrival QNH',
  arrivalOat: 'the arrival OAT',
  arrivalDewPoint: 'the arrival dew point',
  isaDeviation: 'the ISA deviation',
  cruiseIas: 'the cruise IAS',
};

/** What each wind field is called in its sentences. */
const WIND_WORDS: Readonly<Record<(typeof WIND_CONTROLS)[number], { what: string; example: string }>> = {
  runwayHeading: { what: 'runway heading in degrees', example: '270' },
  windDirection: { what: 'wind direction in degrees', example: '300' },
  windSpeed: { what: 'wind speed in kt', example: '20' },
  windGust: { what: 'gust speed in kt', example: '30' },
};

/**
 * The runway heading and wind typed at an aerodrome, as the inputs' `runwayHeadingDeg` and
 * `wind`; nothing when all four fields are empty. The gust is optional; the others go together.
 */
function windFrom(
  conditions: CardFormValue['departure'],
  where: 'departure' | 'arrival',
  problems: Partial<Record<FormFieldPath, string>>,
): { runwayHeadingDeg?: number; wind?: { directionDeg: number; speedKt: number; gustKt?: number } } {
  if (WIND_CONTROLS.every((control) => conditions[control].trim() === '')) return {};
  const figure = (control: (typeof WIND_CONTROLS)[number], optional = false): number | undefined => {
    const text = conditions[control];
    const words = WIND_WORDS[control];
    if (text.trim() === '') {
      if (!optional) problems[`${where}.${control}`] = `Give the ${where} ${words.what} with the rest of the wind, or leave all the wind fields empty.`;
      return undefined;
    }
    const typed = parseTyped(text);
    if (typed === null) problems[`${where}.${control}`] = `Type the ${where} ${words.what} as a number, such as ${words.example}.`;
    return typed ?? undefined;
  };
  const runwayHeadingDeg = figure('runwayHeading');
  const directionDeg = figure('windDirection');
  const speedKt = figure('windSpeed');
  const gustKt = figure('windGust', true);
  if (runwayHeadingDeg === undefined || directionDeg === undefined || speedKt === undefined) return {};
  return { runwayHeadingDeg, wind: { directionDeg, speedKt, ...(gustKt === undefined ? {} : { gustKt }) } };
}

/**
 * The form as `CardInputs`. `approachPolicy` is the operator's approach additive policy from the
 * device store: it goes into the inputs when the aerodrome the card lands at has a wind (the
 * arrival, or the departure without one); without it such a card is refused, never guessed.
 */
export function cardInputsFrom(value: CardFormValue, units: UnitChoice, airframeId: number, approachPolicy: ApproachAdditivePolicy | null = null): FormReading {
  const problems: Partial<Record<FormFieldPath, string>> = {};
  const read = (field: UnitField, path: FormFieldPath, text: string, optional = false): number | undefined => {
    if (text.trim() === '') {
      if (!optional) problems[path] = `Give ${FIELD_WORDS[field]} in ${units[field]}.`;
      return undefined;
    }
    const typed = parseTyped(text);
    if (typed === null) {
      problems[path] = `Type ${FIELD_WORDS[field]} as a number in ${units[field]}, such as ${example(field, units)}.`;
      return undefined;
    }
    try {
      return toCanonical(units[field], typed, UNIT_FIELDS[field]);
    } catch (error) {
      if (!(error instanceof AeroInputError)) throw error;
      problems[path] = error.message;
      return undefined;
    }
  };
  const aerodrome = (where: 'departure' | 'arrival') => {
    const conditions = value[where];
    const elevationFt = read(`${where}Elevation`, `${where}.elevation`, conditions.elevation);
    const qnhHpa = read(`${where}Qnh`, `${where}.qnh`, conditions.qnh);
    const oatC = read(`${where}Oat`, `${where}.oat`, conditions.oat);
    const dewPointC = read(`${where}DewPoint`, `${where}.dewPoint`, conditions.dewPoint, true);
    return { elevationFt: elevationFt!, qnhHpa: qnhHpa!, oatC: oatC!, ...(dewPointC === undefined ? {} : { dewPointC }), ...windFrom(conditions, where, problems) };
  };

  const weightKg = read('weight', 'weight', value.weight);
  const landingWeightKg = read('landingWeight', 'landingWeight', value.landingWeight, true);
  const departure = aerodrome('departure');
  const arrival = value.hasArrival ? aerodrome('arrival') : undefined;
  const isaDeviationC = read('isaDeviation', 'isaDeviation', value.isaDeviation);
  let cruise: CardInputs['cruise'] | undefined;
  if (value.cruiseKind === 'ias') {
    const iasKt = read('cruiseIas', 'cruiseIas', value.cruiseIas);
    if (iasKt !== undefined) cruise = { iasKt };
  } else {
    const mach = value.cruiseMach.trim() === '' ? null : parseTyped(value.cruiseMach);
    if (mach === null) problems.cruiseMach = value.cruiseMach.trim() === '' ? 'Give the cruise Mach number, such as 0.62.' : 'Type the cruise Mach number as a number, such as 0.62.';
    else cruise = { mach };
  }
  if (!value.configuration) problems.configuration = 'Choose the takeoff configuration.';
  if (Object.keys(problems).length > 0) return { inputs: null, problems };

  const inputs: CardInputs = {
    airframeId,
    weightKg: weightKg!,
    ...(landingWeightKg === undefined ? {} : { landingWeightKg }),
    configuration: value.configuration,
    departure,
    ...(arrival ? { arrival } : {}),
    isaDeviationC: isaDeviationC!,
    cruise: cruise!,
    altitudeStepFt: value.altitudeStepFt,
    // Only when ticked, so a card without icing keeps its inputs, payload and digest as before.
    ...(value.icing ? { icing: true } : {}),
  };
  const landingAt = arrival ?? departure;
  if (landingAt.wind && approachPolicy) inputs.approachAdditivePolicy = approachPolicy;
  return { inputs, problems: null };
}

function example(field: UnitField, units: UnitChoice): string {
  const canonical: Record<UnitField, number> = {
    weight: 1050,
    landingWeight: 1000,
    departureElevation: 1200,
    departureQnh: 1013,
    departureOat: 12,
    departureDewPoint: 4,
    arrivalElevation: 1200,
    arrivalQnh: 1013,
    arrivalOat: 12,
    arrivalDewPoint: 4,
    isaDeviation: 5,
    cruiseIas: 120,
  };
  const unit = units[field];
  return unit === CANONICAL_UNITS[field] ? String(canonical[field]) : formatInUnit(unit, fromCanonical(unit, canonical[field], UNIT_FIELDS[field]));
}

/** The form control a refusal's input path (`departure.oatC`, `cruise.iasKt`) points at, or null. */
export function formFieldOfRefusal(field: string): FormFieldPath | null {
  const map: Record<string, FormFieldPath> = {
    weightKg: 'weight',
    landingWeightKg: 'landingWeight',
    configuration: 'configuration',
    isaDeviationC: 'isaDeviation',
    'cruise.iasKt': 'cruiseIas',
    'cruise.mach': 'cruiseMach',
    altitudeStepFt: 'altitudeStepFt',
  };
  if (map[field]) return map[field];
  const wind = /^(departure|arrival)\.(runwayHeadingDeg|wind|wind\.directionDeg|wind\.speedKt|wind\.gustKt)$/.exec(field);
  if (wind) {
    const control = ({ runwayHeadingDeg: 'runwayHeading', wind: 'windDirection', 'wind.directionDeg': 'windDirection', 'wind.speedKt': 'windSpeed', 'wind.gustKt': 'windGust' } as const)[wind[2] as 'wind'];
    return `${wind[1] as 'departure' | 'arrival'}.${control}`;
  }
  const aerodrome = /^(departure|arrival)\.(elevationFt|qnhHpa|oatC|dewPointC)$/.exec(field);
  if (!aerodrome) return null;
  const control = { elevationFt: 'elevation', qnhHpa: 'qnh', oatC: 'oat', dewPointC: 'dewPoint' }[aerodrome[2]] as keyof AerodromeControls;
  return `${aerodrome[1] as 'departure' | 'arrival'}.${control}`;
}
