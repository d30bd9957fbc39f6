/**
 * `buildCard`: the speed card for one day's weight and atmosphere, from a revision's content.
 * Pure and deterministic (no clock, no I/O, no Node or DOM APIs), so the device computes it
 * offline and the server re-derives the same card, to the digest, from the same inputs.
 *
 * Methods (all numeric work is the flight-physics library's, shared/aero):
 * - pressure altitude from elevation and QNH by the ISA altimeter relation, density altitude
 *   with the virtual temperature (flight-physics.md, "Altimetry");
 * - weight-scaled speeds V = Vref·√(W/Wref), applied to the calibrated airspeed (the lift at a
 *   fixed angle of attack follows the dynamic pressure, which CAS stands for at these speeds —
 *   common practice), then IAS through the configuration's position-error table;
 * - tabulated speeds read by linear interpolation, never extrapolated;
 * - stall speed in a level turn Vs·√n, n = 1/cos(bank);
 * - CAS/EAS/TAS/Mach by the pitot–static relations of NASA RP 1046; crossover of VMO and MMO;
 * - rounding as printed: limits down, stall speeds up, others nearest (flight-physics.md).
 *
 * Anything outside the flight manual's data or the modelled atmosphere refuses the card with a
 * `CardRefusedError` naming the input at fault.
 */
import * as aero from '../aero';
import { AeroInputError, type PositionErrorTable, type SpeedTable } from '../aero';
import { contentSha256 } from '../speed-book/canonical';
import { bookEnvelope, formatRange, formatWhole, type BookEnvelope, type PhaseEnvelope } from '../speed-book/envelope';
import { roundingOfClass, speedClassOf, speedRole, type SpeedRounding } from '../speed-book/speed-class';
import { ORDERING_RULES, orderingViolations, type OrderingFigure, type OrderingFigures, type OrderingViolation } from './ordering-rules';
import {
  revisionContentSchema,
  type Configuration,
  type RevisionContent,
  type Speed,
  type SpeedBasis,
} from '../speed-book/revision-content';
import {
  CARD_VERSION,
  CardRefusedError,
  STALL_TURN_BANKS_DEG,
  cardInputsSchema,
  type AerodromeConditions,
  type CardAerodrome,
  type CardAltitudeRow,
  type CardContext,
  type CardFlapLimit,
  type CardIndicator,
  type CardIndicatorArc,
  type CardIndicatorLine,
  type CardInputs,
  type CardLanding,
  type CardLimitKind,
  type CardLimitSpeed,
  type CardLimits,
  type CardRefusalCode,
  type CardRevision,
  type CardSpeed,
  type CardStallInTurn,
  type SpeedCard,
} from './card';
import { cardDigest } from './card-digest';

// Bound once (see shared/aero/airspeed.ts: tsx's CommonJS output reads imported names through
// getters on every use).
const {
  casToIasKt,
  convertAirspeed,
  crossoverAltitudeFt,
  densityAltitudeFt,
  iasToCasKt,
  isaDeviationC,
  isaTemperatureC,
  loadFactorInTurn,
  pressureAltitudeFt,
  roundLimitKt,
  roundSpeedKt,
  roundStallKt,
  interpolateSpeedTableKt,
} = aero;

/**
 * The card cautions about density altitude from 5,000 ft, or from 2,000 ft above the field's
 * elevation. The product's own thresholds (no outside source): where takeoff and climb
 * performance falls off noticeably for light aircraft (common practice).
 */
export const HIGH_DENSITY_ALTITUDE_FT = 5000;
export const HIGH_DENSITY_ALTITUDE_ABOVE_FIELD_FT = 2000;

/** The rounding function of each rounding kind (flight-physics.md, "Rounding by kind"). */
const ROUNDERS: Readonly<Record<SpeedRounding, (kt: number) => number>> = {
  'stall-up': roundStallKt,
  'limit-down': roundLimitKt,
  nearest: roundSpeedKt,
};

/** MMO rounded down to 0.001 (a limit; 10⁻⁹ tolerance as for knots, shared/aero/rounding.ts). */
const floorMach3 = (mach: number) => Math.floor(mach * 1000 + 1e-9) / 1000 + 0;

/**
 * How much of the card the envelope sweep needs: one phase's speeds and the ordering rules,
 * without the altitude table or the digest. Internal to shared/card (coverage.ts).
 */
export interface CardScope {
  readonly phase: 'takeoff' | 'landing';
  /** Landing only: the approach and landing speeds of this configuration (every one when absent). */
  readonly landingConfigurationKey?: string;
}

/** A card's speeds and the ordering rules they break, before any refusal for a broken rule. */
export interface CardFigures {
  readonly speeds: readonly CardSpeed[];
  readonly violations: readonly OrderingViolation[];
}

/**
 * The speed card for `inputs`, from `revision` (content checked against its hash first) for
 * the airframe, type, speed book and operator of `context`.
 *
 * @example buildCard(revision, { airframeId: 7, weightKg: 1000, configuration: 'takeoff-flap',
 *   departure: { elevationFt: 500, qnhHpa: 1013, oatC: 20 }, isaDeviationC: 5,
 *   cruise: { iasKt: 110 }, altitudeStepFt: 1000 }, context)
 * @throws CardRefusedError when the card cannot be given (see `CARD_REFUSAL_CODES`)
 */
export function buildCard(revision: CardRevision, rawInputs: CardInputs, context: CardContext): SpeedCard {
  const inputs = parseInputs(rawInputs);
  const content = checkedContent(revision);
  if (context.airframe.id !== inputs.airframeId) {
    refuse('airframe-mismatch', 'airframeId', `These inputs are for airframe ${inputs.airframeId}, not ${context.airframe.registration}.`);
  }
  const book = SpeedBook.of(content);
  const takeoffConfiguration = book.takeoffConfiguration(inputs.configuration);
  checkWeights(content, inputs);
  const landing = landingWeight(content, inputs);

  const departure = aerodrome(inputs.departure, 'departure');
  const arrival = inputs.arrival ? aerodrome(inputs.arrival, 'arrival') : null;
  checkEnvelope(book.envelope, departure, arrival, inputs);
  const speeds = book.speeds(inputs, landing.weightKg, takeoffConfiguration.key, departure, arrival);
  const limits = book.limits();
  refuseBrokenRules(content, orderingViolations(book.orderingFigures(speeds, limits)));
  const cruise = book.cruise(inputs.cruise);

  // Every object of the card is written with its keys in RFC 8785 order, so that the digest
  // can use JSON.stringify as it is (card-digest.ts); the order is checked there, not trusted.
  const body: Omit<SpeedCard, 'digest'> = {
    aircraftType: {
      category: content.aircraft.category,
      ceilingFt: content.aircraft.ceilingFt,
      designator: context.aircraftType.designator,
      engines: content.aircraft.engines,
      name: context.aircraftType.name,
    },
    airframe: { id: context.airframe.id, registration: context.airframe.registration },
    altitudeTable: book.altitudeTable(inputs, cruise, limits),
    arrival: arrival?.card ?? null,
    cardVersion: CARD_VERSION,
    crossoverAltitudeFt: limits.crossoverFt,
    cruise: cruise.card,
    demo: context.demo,
    departure: departure.card,
    indicator: book.indicator(speeds, limits),
    inputs: sortedKeys(inputs),
    landing,
    limits: limits.card,
    revision: { contentSha256: revision.contentSha256, id: revision.id, number: revision.number, publishedAt: revision.publishedAt },
    speedBook: { id: context.speedBook.id, title: context.speedBook.title },
    speeds: speeds.map((speed) => speed.card),
    stallInTurn: book.stallInTurn(speeds),
    takeoffConfiguration: { key: takeoffConfiguration.key, label: takeoffConfiguration.label },
  };
  return { digest: cardDigest(body), ...body };
}

/**
 * The speeds of one phase of a card and the ordering rules they break, for the envelope sweep:
 * the same reading of the book, the same tables and rounding as `buildCard`, from content
 * already parsed. Refusals throw `CardRefusedError` as `buildCard` does; broken rules are
 * returned rather than thrown, so the sweep can tell "refused" from "rule broken".
 * Takeoff: the takeoff configuration's speeds at `inputs.departure`; landing: the approach and
 * landing speeds at `inputs.arrival` and `inputs.landingWeightKg`. Both check the envelope.
 */
export function cardFigures(content: RevisionContent, inputs: CardInputs, scope: CardScope): CardFigures {
  const book = SpeedBook.of(content);
  const takeoffKey = scope.phase === 'takeoff' ? book.takeoffConfiguration(inputs.configuration).key : null;
  checkWeights(content, inputs);
  const landing = landingWeight(content, inputs);
  const conditions = scope.phase === 'takeoff' ? inputs.departure : inputs.arrival ?? inputs.departure;
  const where = aerodrome(conditions, scope.phase === 'takeoff' ? 'departure' : 'arrival');
  if (scope.phase === 'takeoff') checkPhaseEnvelope(book.envelope.takeoff, where, 'departure', 'takeoff');
  else checkPhaseEnvelope(book.envelope.landing, where, 'arrival', 'landing');
  const speeds = book.speeds(inputs, landing.weightKg, takeoffKey, where, where, scope.phase, scope.landingConfigurationKey);
  const limits = book.limits();
  const violations = orderingViolations(book.orderingFigures(speeds, limits));
  return { speeds: speeds.map((speed) => speed.card), violations };
}

/** The ids of the rules `content` records an exception for (the flight manual's reason). */
export function exceptedRuleIds(content: RevisionContent): Set<string> {
  return new Set((content.ruleExceptions ?? []).map((exception) => exception.ruleId));
}

/** Refuses the card for the first broken rule the book records no exception for. */
function refuseBrokenRules(content: RevisionContent, violations: readonly OrderingViolation[]): void {
  const excepted = exceptedRuleIds(content);
  const broken = violations.find((violation) => !excepted.has(violation.ruleId));
  if (!broken) return;
  const rule = ORDERING_RULES.find((candidate) => candidate.id === broken.ruleId)!;
  refuse(
    'ordering-rule-broken',
    'revision',
    `This speed book breaks the rule ${rule.title} at these inputs: ${broken.message} The card is refused; ask the fleet engineer to correct the book.`,
  );
}

/**
 * The configurations a card may be built for: those with takeoff speeds, or every
 * configuration when the speed book has none (for the screen's choice of takeoff configuration).
 */
export function takeoffConfigurationKeys(content: RevisionContent): string[] {
  const withTakeoffSpeeds = new Set(content.speeds.filter((speed) => speed.phase === 'takeoff').map((speed) => speed.configurationKey));
  const keys = content.configurations.map((configuration) => configuration.key);
  return withTakeoffSpeeds.size ? keys.filter((key) => withTakeoffSpeeds.has(key)) : keys;
}

// ---------------------------------------------------------------------------------------------
// Refusals

function refuse(code: CardRefusalCode, field: string, message: string): never {
  throw new CardRefusedError(code, field, message);
}

/**
 * Runs `work`; an `AeroInputError` becomes a refusal at the input `fieldOf(error.field)`
 * carrying the library's sentence (after `prefix`, e.g. the speed's code).
 */
function guarded<T>(work: () => T, fieldOf: (aeroField: string) => string, prefix = ''): T {
  try {
    return work();
  } catch (error) {
    if (!(error instanceof AeroInputError)) throw error;
    const code: CardRefusalCode =
      error.code === 'outside-table' ? 'outside-flight-manual-data' : error.code === 'invalid-table' ? 'invalid-content' : 'out-of-envelope';
    throw new CardRefusedError(code, fieldOf(error.field), prefix + error.message);
  }
}

function parseInputs(raw: unknown): CardInputs {
  const result = cardInputsSchema.safeParse(raw);
  if (result.success) return result.data;
  const issue = result.error.issues[0];
  const path = issue.path.map(String).join('.');
  if (issue.code === 'unrecognized_keys') {
    refuse('invalid-inputs', [path, issue.keys[0]].filter(Boolean).join('.'), `The input ${issue.keys[0]} is not expected.`);
  }
  refuse('invalid-inputs', path || '(inputs)', issue.message);
}

/**
 * Content already checked, by the content object it was read from: a live card is rebuilt on
 * every keystroke from the same revision, and hashing and parsing the content is most of the
 * work. The card is always computed from the parsed, frozen copy taken when the hash matched,
 * so a later change to the caller's object cannot reach a card; a different published hash is
 * checked afresh.
 */
const checkedContents = new WeakMap<object, { contentSha256: string; content: RevisionContent }>();

function checkedContent(revision: CardRevision): RevisionContent {
  const raw = revision.content;
  const cached = typeof raw === 'object' && raw !== null ? checkedContents.get(raw) : undefined;
  if (cached && cached.contentSha256 === revision.contentSha256) return cached.content;
  const content = verifiedContent(revision);
  if (typeof raw === 'object' && raw !== null) checkedContents.set(raw, { contentSha256: revision.contentSha256, content });
  return content;
}

function verifiedContent(revision: CardRevision): RevisionContent {
  if (contentSha256(revision.content) !== revision.contentSha256) {
    refuse(
      'content-hash-mismatch',
      'revision',
      `The data of revision ${revision.number} does not match its published hash; it may have been altered. Sync again before using it.`,
    );
  }
  const parsed = revisionContentSchema.safeParse(revision.content);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    refuse('invalid-content', 'revision', `Revision ${revision.number} is not complete (${issue.path.join('.')}: ${issue.message})`);
  }
  return deepFreeze(parsed.data);
}

/** Freezes `value` and everything in it (zod's parse output is a fresh copy, so nothing of the caller's). */
function deepFreeze<T>(value: T): T {
  if (typeof value === 'object' && value !== null && !Object.isFrozen(value)) {
    Object.freeze(value);
    for (const item of Object.values(value)) deepFreeze(item);
  }
  return value;
}

const kg = (value: number) => `${group(Math.round(value))} kg`;

/** Whole numbers with thousands separators, without the locale (identical everywhere). */
function group(value: number): string {
  return String(value).replace(/\B(?=(\d{3})+(?!\d))/g, ',');
}

function checkWeights(content: RevisionContent, inputs: CardInputs): void {
  const { minimumKg, maximumTakeoffKg, maximumLandingKg } = content.weights;
  const { weightKg, landingWeightKg } = inputs;
  if (weightKg > maximumTakeoffKg) {
    refuse('weight-out-of-range', 'weightKg', `The takeoff weight ${kg(weightKg)} is above the maximum takeoff weight of ${kg(maximumTakeoffKg)}.`);
  }
  if (weightKg < minimumKg) {
    refuse('weight-out-of-range', 'weightKg', `The takeoff weight ${kg(weightKg)} is below the flight manual's lowest weight of ${kg(minimumKg)}.`);
  }
  if (landingWeightKg === undefined) return;
  if (landingWeightKg > maximumLandingKg) {
    refuse('landing-weight-out-of-range', 'landingWeightKg', `The landing weight ${kg(landingWeightKg)} is above the maximum landing weight of ${kg(maximumLandingKg)}.`);
  }
  if (landingWeightKg < minimumKg) {
    refuse('landing-weight-out-of-range', 'landingWeightKg', `The landing weight ${kg(landingWeightKg)} is below the flight manual's lowest weight of ${kg(minimumKg)}.`);
  }
  if (landingWeightKg > weightKg) {
    refuse('landing-weight-out-of-range', 'landingWeightKg', `The landing weight ${kg(landingWeightKg)} cannot be above the takeoff weight ${kg(weightKg)}.`);
  }
}

/**
 * The landing weight the approach and landing speeds use: the one entered; else the takeoff
 * weight when it is within the maximum landing weight; else the maximum landing weight, which
 * the card says in words (the pilot may enter the landing weight instead).
 */
function landingWeight(content: RevisionContent, inputs: CardInputs): CardLanding {
  const { maximumLandingKg } = content.weights;
  if (inputs.landingWeightKg !== undefined) {
    return { source: 'entered', statement: `Landing speeds at the landing weight entered, ${kg(inputs.landingWeightKg)}.`, weightKg: inputs.landingWeightKg };
  }
  if (inputs.weightKg <= maximumLandingKg) {
    return { source: 'takeoff-weight', statement: `Landing speeds at the takeoff weight, ${kg(inputs.weightKg)}; enter a landing weight for lighter landing speeds.`, weightKg: inputs.weightKg };
  }
  return {
    source: 'maximum-landing-weight',
    statement: `The takeoff weight ${kg(inputs.weightKg)} is above the maximum landing weight, so the landing speeds are for the maximum landing weight, ${kg(maximumLandingKg)}; enter the landing weight for the day's figures.`,
    weightKg: maximumLandingKg,
  };
}

/**
 * Refuses a day outside the book's envelope in one sentence: the departure against the takeoff
 * envelope, the arrival (or, without one, the departure) against the landing envelope.
 */
function checkEnvelope(envelope: BookEnvelope, departure: Aerodrome, arrival: Aerodrome | null, inputs: CardInputs): void {
  checkPhaseEnvelope(envelope.takeoff, departure, 'departure', 'takeoff');
  if (arrival) checkPhaseEnvelope(envelope.landing, arrival, 'arrival', 'landing');
  else if (inputs.arrival === undefined) checkPhaseEnvelope(envelope.landing, departure, 'departure', 'landing');
}

function checkPhaseEnvelope(envelope: PhaseEnvelope, where: Aerodrome, field: 'departure' | 'arrival', phase: 'takeoff' | 'landing'): void {
  const [lowFt, highFt] = envelope.pressureAltitudeFt;
  const place = field === 'departure' ? 'departure' : 'arrival';
  const altitudeFt = where.pressureAltitudeFt;
  if (altitudeFt < lowFt - 0.5 || altitudeFt > highFt + 0.5) {
    refuse(
      'outside-book-envelope',
      `${field}.elevationFt`,
      `The day is outside this book's ${phase} envelope: the ${place} pressure altitude of ${formatWhole(altitudeFt)} ft is ${altitudeFt > highFt ? 'above' : 'below'} its range of ${formatRange(envelope.pressureAltitudeFt, 'ft')}.`,
    );
  }
  const [lowC, highC] = envelope.oatC;
  if (where.oatC < lowC || where.oatC > highC) {
    refuse(
      'outside-book-envelope',
      `${field}.oatC`,
      `The day is outside this book's ${phase} envelope: the ${place} temperature of ${round1(where.oatC)} °C is ${where.oatC > highC ? 'above' : 'below'} its range of ${formatRange(envelope.oatC, '°C')}.`,
    );
  }
}

/** A copy of plain data with every object's keys in UTF-16 order (the inputs, as zod returns them in schema order). */
function sortedKeys<T>(value: T): T {
  if (Array.isArray(value)) return value.map(sortedKeys) as T;
  if (typeof value !== 'object' || value === null) return value;
  const sorted: Record<string, unknown> = {};
  for (const key of Object.keys(value).sort()) {
    const item = (value as Record<string, unknown>)[key];
    if (item !== undefined) sorted[key] = sortedKeys(item);
  }
  return sorted as T;
}

// ---------------------------------------------------------------------------------------------
// Aerodromes

const round1 = (value: number) => Math.round(value * 10) / 10 + 0; // + 0 turns −0 into 0
const round2 = (value: number) => Math.round(value * 100) / 100 + 0;
const round3 = (value: number) => Math.round(value * 1000) / 1000 + 0;
const roundFt = (value: number) => Math.round(value) + 0;

interface Aerodrome {
  readonly pressureAltitudeFt: number;
  readonly oatC: number;
  readonly card: CardAerodrome;
}

const AERODROME_FIELDS = new Set(['elevationFt', 'qnhHpa', 'oatC', 'dewPointC']);

function aerodrome(conditions: AerodromeConditions, where: 'departure' | 'arrival'): Aerodrome {
  const fieldOf = (field: string) => `${where}.${AERODROME_FIELDS.has(field) ? field : 'elevationFt'}`;
  return guarded(
    () => {
      const { elevationFt, qnhHpa, oatC, dewPointC } = conditions;
      const pressureFt = pressureAltitudeFt(elevationFt, qnhHpa);
      const deviationC = isaDeviationC(pressureFt, oatC);
      const densityFt = densityAltitudeOrNull(pressureFt, oatC, dewPointC);
      return {
        pressureAltitudeFt: pressureFt,
        oatC,
        card: {
          densityAltitudeFt: densityFt === null ? null : roundFt(densityFt),
          highDensityAltitude: densityFt !== null && (densityFt >= HIGH_DENSITY_ALTITUDE_FT || densityFt - elevationFt >= HIGH_DENSITY_ALTITUDE_ABOVE_FIELD_FT),
          isaDeviationC: round1(deviationC),
          pressureAltitudeFt: roundFt(pressureFt),
        },
      };
    },
    fieldOf,
    where === 'departure' ? 'Departure: ' : 'Arrival: ',
  );
}

/**
 * Density altitude feeds no speed: a figure, never a reason to refuse (issue 11). With the
 * atmosphere down to −5 km no ordinary day leaves the model; a day that still does (denser air
 * than ISA at −5 km) shows no figure. A dew point above the air temperature is still refused
 * (a typing error the pilot must see).
 */
function densityAltitudeOrNull(pressureFt: number, oatC: number, dewPointC: number | undefined): number | null {
  try {
    return densityAltitudeFt(pressureFt, oatC, dewPointC);
  } catch (error) {
    if (error instanceof AeroInputError && error.code === 'altitude-out-of-range') return null;
    throw error;
  }
}

// ---------------------------------------------------------------------------------------------
// The speed book's figures

/** A speed of the card with its unrounded CAS, which the stall-in-turn lines start from. */
interface ComputedSpeed {
  readonly card: CardSpeed;
  readonly casKt: number;
  readonly table: PositionErrorTable;
}

interface ComputedLimits {
  readonly card: CardLimits;
  readonly crossoverFt: number | null;
  /** Unrounded CAS of VMC (for the ordering rules). */
  readonly vmcCasKt: number | null;
  /** Unrounded CAS of VMO, VNE (for the altitude table's limit column). */
  readonly vmoCasKt: number | null;
  readonly vneCasKt: number | null;
  readonly mmo: number | null;
}

interface ComputedCruise {
  readonly card: SpeedCard['cruise'];
  /** CAS of an IAS cruise (null for a Mach cruise, or an IAS outside the table). */
  readonly casKt: number | null;
  /** Why an IAS cruise has no CAS: outside the cruise configuration's table (every row dashed). */
  readonly outsideTable: string | null;
}

/** Reads the figures of one revision's content. */
class SpeedBook {
  private static readonly cache = new WeakMap<RevisionContent, SpeedBook>();

  /** One reader per (frozen, parsed) content: the sweep reads the same book thousands of times. */
  static of(content: RevisionContent): SpeedBook {
    let book = SpeedBook.cache.get(content);
    if (!book) {
      book = new SpeedBook(content);
      SpeedBook.cache.set(content, book);
    }
    return book;
  }

  private readonly byKey = new Map<string, Configuration>();
  /** The first configuration is the cruise configuration (revision-content.ts). */
  private readonly cruiseTable: PositionErrorTable;
  readonly envelope: BookEnvelope;
  private computedLimits: ComputedLimits | null = null;

  private constructor(private readonly content: RevisionContent) {
    for (const configuration of content.configurations) this.byKey.set(configuration.key, configuration);
    this.cruiseTable = content.configurations[0].positionError;
    this.envelope = bookEnvelope(content);
  }

  takeoffConfiguration(key: string): Configuration {
    const configuration = this.byKey.get(key);
    const allowed = takeoffConfigurationKeys(this.content);
    if (!configuration || !allowed.includes(key)) {
      const labels = allowed.map((k) => `${this.byKey.get(k)!.label} (${k})`).join(', ');
      refuse(
        'unknown-configuration',
        'configuration',
        configuration
          ? `The speed book gives no takeoff speeds for ${configuration.label}; choose ${labels}.`
          : `The speed book has no configuration ${key}; choose ${labels}.`,
      );
    }
    return configuration;
  }

  /**
   * The card's V-speeds: takeoff speeds of the takeoff configuration, every other speed as
   * published. With `only`, the speeds of that phase (and those of every phase, 'any').
   */
  speeds(
    inputs: CardInputs,
    landingWeightKg: number,
    takeoffKey: string | null,
    departure: Aerodrome,
    arrival: Aerodrome | null,
    only?: 'takeoff' | 'landing',
    landingKey?: string,
  ): ComputedSpeed[] {
    const result: ComputedSpeed[] = [];
    for (const speed of this.content.speeds) {
      if (speed.phase === 'takeoff' && speed.configurationKey !== takeoffKey) continue;
      const landing = speed.phase === 'landing' || speed.phase === 'approach';
      if (only === 'takeoff' && landing) continue;
      if (only === 'landing' && !landing && speed.phase !== 'any') continue;
      if (only === 'landing' && landing && landingKey !== undefined && speed.configurationKey !== landingKey) continue;
      result.push(this.speed(speed, inputs, landingWeightKg, departure, arrival));
    }
    return result;
  }

  /** Approach and landing speeds at the landing weight and arrival (when given). */
  private speed(speed: Speed, inputs: CardInputs, landingWeightKg: number, departure: Aerodrome, arrival: Aerodrome | null): ComputedSpeed {
    const configuration = this.byKey.get(speed.configurationKey)!;
    const table = configuration.positionError;
    const landing = speed.phase === 'landing' || speed.phase === 'approach';
    const weightField = landing && inputs.landingWeightKg !== undefined ? 'landingWeightKg' : 'weightKg';
    const weightKg = landing ? landingWeightKg : inputs.weightKg;
    const where = landing && arrival ? 'arrival' : 'departure';
    const atmosphere = where === 'arrival' ? arrival! : departure;
    const fieldOf = (field: string) =>
      field === 'pressureAltitudeFt' ? `${where}.elevationFt` : field === 'oatC' ? `${where}.oatC` : weightField;

    return guarded(
      () => {
        let casKt: number;
        if (speed.kind === 'scaled') {
          const referenceCasKt = speed.basis === 'ias' ? iasToCasKt(table, speed.referenceKt) : speed.referenceKt;
          casKt = referenceCasKt * Math.sqrt(weightKg / this.content.weights.referenceKg!);
        } else {
          const valueKt =
            speed.kind === 'fixed'
              ? speed.valueKt
              : interpolateSpeedTableKt(speed as unknown as SpeedTable, {
                  weightKg,
                  pressureAltitudeFt: atmosphere.pressureAltitudeFt,
                  oatC: atmosphere.oatC,
                });
          casKt = speed.basis === 'ias' ? iasToCasKt(table, valueKt) : valueKt;
        }
        const iasKt = casToIasKt(table, casKt);
        const rounding = roundingOfClass(speedClassOf(speed));
        const round = ROUNDERS[rounding];
        return {
          casKt,
          table,
          card: {
            basis: speed.basis,
            casKt: round(casKt),
            code: speed.code,
            configurationKey: speed.configurationKey,
            configurationLabel: configuration.label,
            iasKt: round(iasKt),
            kind: speed.kind,
            label: speed.label,
            phase: speed.phase,
            rounding,
            weightKg,
          },
        };
      },
      fieldOf,
      `${speed.code} (${speed.label}): `,
    );
  }

  /**
   * Stall speed at each bank from VS1 (or VS) at the weight it was computed at, in its
   * configuration. A bank whose stall speed lies beyond the configuration's position-error
   * table has no line (its IAS would be an extrapolation); the card's other figures stand.
   */
  stallInTurn(speeds: readonly ComputedSpeed[]): CardStallInTurn[] {
    const vs1 = speeds.find((speed) => speedRole(speed.card.code) === 'VS1') ?? speeds.find((speed) => speedRole(speed.card.code) === 'VS');
    if (!vs1) return [];
    const topCasKt = vs1.table[vs1.table.length - 1].casKt;
    const lines: CardStallInTurn[] = [];
    for (const bankDeg of STALL_TURN_BANKS_DEG) {
      const loadFactor = loadFactorInTurn(bankDeg);
      const casKt = vs1.casKt * Math.sqrt(loadFactor);
      if (casKt > topCasKt) break;
      lines.push(
        guarded(
          () => ({ bankDeg, casKt: roundStallKt(casKt), iasKt: roundStallKt(casToIasKt(vs1.table, casKt)), loadFactor: round2(loadFactor) }),
          () => 'weightKg',
          `${vs1.card.code} in a ${bankDeg}° bank: `,
        ),
      );
    }
    return lines;
  }

  /** The figures the ordering rules read, from this card's speeds and the book's limits. */
  orderingFigures(speeds: readonly ComputedSpeed[], limits: ComputedLimits): OrderingFigures {
    const figure = (speed: ComputedSpeed): OrderingFigure => ({
      code: speed.card.code,
      iasKt: speed.card.iasKt,
      casKt: speed.card.casKt,
      exactCasKt: speed.casKt,
      weightKg: speed.card.weightKg,
    });
    const byRole = (role: string) => {
      const found = speeds.find((speed) => speedRole(speed.card.code) === role);
      return found ? figure(found) : undefined;
    };
    const basis = this.content.indicatorMarkingBasis;
    const inBasis = (speed: CardLimitSpeed | null) => (speed ? (basis === 'ias' ? speed.iasKt : speed.casKt) : undefined);
    const card = limits.card;
    return {
      v1: byRole('V1'),
      vr: byRole('VR'),
      v2: byRole('V2'),
      vref: speeds.filter((speed) => speedRole(speed.card.code) === 'VREF').map(figure),
      vs0: byRole('VS0'),
      vs1: byRole('VS1') ?? byRole('VS'),
      vx: byRole('VX'),
      vy: byRole('VY'),
      vmc: card.vmc && limits.vmcCasKt !== null ? { code: 'VMC', iasKt: card.vmc.iasKt, casKt: card.vmc.casKt, exactCasKt: limits.vmcCasKt, weightKg: null } : undefined,
      vnoKt: inBasis(card.vno),
      vneKt: inBasis(card.vne),
      vleKt: inBasis(card.vle),
      vloKt: inBasis(card.vlo),
      vfe: card.vfe.map((vfe) => ({ label: vfe.configurationLabel, kt: inBasis(vfe)! })),
      mmo: limits.mmo ?? undefined,
      referenceStallSpeeds: this.content.statesReferenceStallSpeeds === true,
    };
  }

  /** The book's limits; they depend on nothing of the day, so they are read once per book. */
  limits(): ComputedLimits {
    this.computedLimits ??= this.readLimits();
    return this.computedLimits;
  }

  private readLimits(): ComputedLimits {
    const { limits, indicatorMarkingBasis: basis, configurations } = this.content;
    const cruise = configurations[0];
    const vmc = limits.vmcKt === undefined ? null : this.limit('VMC', limits.vmcKt, cruise, basis, roundStallKt);
    const vfe: CardFlapLimit[] = [];
    for (const configuration of configurations) {
      const valueKt = limits.vfeKt[configuration.key];
      if (valueKt === undefined) continue;
      const { casKt, iasKt } = this.limit('VFE', valueKt, configuration, basis).card;
      vfe.push({ casKt, configurationKey: configuration.key, configurationLabel: configuration.label, iasKt });
    }
    const vmo = limits.vmoKt === undefined ? null : this.limit('VMO', limits.vmoKt, cruise, basis);
    const vne = limits.vneKt === undefined ? null : this.limit('VNE', limits.vneKt, cruise, basis);
    const mmo = limits.mmo ?? null;
    const crossoverFt =
      vmo && mmo !== null ? roundFt(guarded(() => crossoverAltitudeFt(vmo.casKt, mmo), () => 'revision', 'VMO and MMO: ')) : null;
    const optional = (code: string, valueKt: number | undefined, round = roundLimitKt) =>
      valueKt === undefined ? null : this.limit(code, valueKt, cruise, basis, round).card;
    return {
      card: {
        basis,
        mmo: mmo === null ? null : floorMach3(mmo),
        vfe,
        vle: optional('VLE', limits.vleKt),
        vlo: optional('VLO', limits.vloKt),
        // VMC is a minimum: rounding it down would promise control below it, so it is rounded
        // up like a stall speed (the reason limits are rounded down, turned the other way).
        vmc: vmc?.card ?? null,
        vmo: vmo?.card ?? null,
        vne: vne?.card ?? null,
        vno: optional('VNO', limits.vnoKt),
        // VYSE is a target speed, not a limit: nearest knot.
        vyse: optional('VYSE', limits.vyseKt, roundSpeedKt),
      },
      crossoverFt,
      vmcCasKt: vmc?.casKt ?? null,
      vmoCasKt: vmo?.casKt ?? null,
      vneCasKt: vne?.casKt ?? null,
      mmo,
    };
  }

  /** A limit speed given in `basis`, both ways through `configuration`'s table, rounded by `round`. */
  private limit(
    code: string,
    valueKt: number,
    configuration: Configuration,
    basis: SpeedBasis,
    round: (kt: number) => number = roundLimitKt,
  ): { card: CardLimitSpeed; casKt: number } {
    return guarded(
      () => {
        const table = configuration.positionError;
        const casKt = basis === 'cas' ? valueKt : iasToCasKt(table, valueKt);
        const iasKt = basis === 'ias' ? valueKt : casToIasKt(table, valueKt);
        return { casKt, card: { casKt: round(casKt), iasKt: round(iasKt) } };
      },
      () => 'revision',
      `${code} through the ${configuration.label} position-error table: `,
    );
  }

  /**
   * The planned cruise. An IAS outside the cruise configuration's position-error table gives no
   * CAS (never extrapolated): the card stands, and every altitude row says why it has a dash.
   */
  cruise(cruise: CardInputs['cruise']): ComputedCruise {
    if ('mach' in cruise) return { card: { mach: cruise.mach }, casKt: null, outsideTable: null };
    const first = this.cruiseTable[0].iasKt;
    const last = this.cruiseTable[this.cruiseTable.length - 1].iasKt;
    if (cruise.iasKt < first || cruise.iasKt > last) {
      const note = `The cruise IAS of ${group(Math.round(cruise.iasKt))} kt is outside the cruise configuration's position-error table (${group(first)} to ${group(last)} KIAS); no figure is given.`;
      return { card: { casKt: null, iasKt: cruise.iasKt }, casKt: null, outsideTable: note };
    }
    const casKt = guarded(() => iasToCasKt(this.cruiseTable, cruise.iasKt), () => 'cruise.iasKt', 'Cruise: ');
    return { card: { casKt: roundSpeedKt(casKt), iasKt: cruise.iasKt }, casKt, outsideTable: null };
  }

  /** Rows from 0 ft every `altitudeStepFt` below the ceiling, then the ceiling, on the day's ISA deviation. */
  altitudeTable(inputs: CardInputs, cruise: ComputedCruise, limits: ComputedLimits): CardAltitudeRow[] {
    const { ceilingFt } = this.content.aircraft;
    const rows: CardAltitudeRow[] = [];
    const cruiseField = cruise.casKt === null ? 'cruise.mach' : 'cruise.iasKt';
    const fieldOf = (field: string) => (field === 'oatC' || field === 'isaDeviationC' ? 'isaDeviationC' : cruiseField);
    for (let altitudeFt = 0; ; altitudeFt += inputs.altitudeStepFt) {
      const rowFt = Math.min(altitudeFt, ceilingFt);
      // A deviation that leaves even the surface row outside the atmosphere is a mistyped input:
      // the card is refused at that field. Aloft only, the rows concerned show a dash.
      const outside = rowFt === 0 ? null : this.outsideAtmosphereRow(rowFt, inputs, cruise);
      rows.push(outside ?? guarded(() => this.altitudeRow(rowFt, inputs, cruise, limits), fieldOf, `At ${group(rowFt)} ft: `));
      if (rowFt >= ceilingFt) break;
    }
    return rows;
  }

  /**
   * A row whose temperature on the day's ISA deviation lies outside the modelled atmosphere
   * (a cold surface day's deviation carried up to the ceiling gives −100 °C and below): every
   * figure is a dash, with the reason. The en-route table is no reason to refuse the takeoff and
   * landing speeds. Null for a row inside the atmosphere.
   */
  private outsideAtmosphereRow(pressureAltitudeFt: number, inputs: CardInputs, cruise: ComputedCruise): CardAltitudeRow | null {
    try {
      isaTemperatureC(pressureAltitudeFt, inputs.isaDeviationC);
      return null;
    } catch (error) {
      if (!(error instanceof AeroInputError) || error.code !== 'temperature-out-of-range') throw error;
      const oatC = isaTemperatureC(pressureAltitudeFt, 0) + inputs.isaDeviationC;
      return {
        aboveLimit: false,
        casKt: null,
        cruiseNote: `At ${group(pressureAltitudeFt)} ft: ${error.message} No figure is given; check the en-route ISA deviation.`,
        easKt: null,
        iasKt: 'iasKt' in inputs.cruise && cruise.outsideTable === null ? inputs.cruise.iasKt : null,
        limitCasKt: null,
        limitIasKt: null,
        limitKind: null,
        mach: null,
        oatC: round1(oatC),
        pressureAltitudeFt,
        tasKt: null,
      };
    }
  }

  private altitudeRow(pressureAltitudeFt: number, inputs: CardInputs, cruise: ComputedCruise, limits: ComputedLimits): CardAltitudeRow {
    const oatC = isaTemperatureC(pressureAltitudeFt, inputs.isaDeviationC);
    const machCruise = 'mach' in inputs.cruise ? inputs.cruise.mach : null;
    const speeds =
      machCruise !== null
        ? convertAirspeed({ pressureAltitudeFt, oatC, mach: machCruise })
        : cruise.casKt === null
          ? null
          : convertAirspeed({ pressureAltitudeFt, oatC, casKt: cruise.casKt });
    let cruiseNote: string | null = cruise.outsideTable;
    if (speeds && machCruise === null && speeds.mach >= 1) {
      cruiseNote = `At ${group(pressureAltitudeFt)} ft the cruise IAS of ${group(Math.round((inputs.cruise as { iasKt: number }).iasKt))} kt would be Mach ${round3(speeds.mach)}, at or above Mach 1; no figure is given.`;
    }
    const figures = cruiseNote === null ? speeds : null;
    const iasKt = machCruise !== null ? this.iasWithinTable(speeds!.casKt, roundSpeedKt) : (inputs.cruise as { iasKt: number }).iasKt;
    if (machCruise !== null && iasKt === null) {
      cruiseNote = `At ${group(pressureAltitudeFt)} ft Mach ${machCruise} is ${roundSpeedKt(speeds!.casKt)} KCAS, outside the cruise configuration's position-error table: no IAS is given.`;
    }

    let limitCasKt: number | null = null;
    let limitKind: CardLimitKind | null = null;
    if (limits.vmoCasKt !== null) {
      limitCasKt = limits.vmoCasKt;
      limitKind = 'vmo';
      if (limits.mmo !== null) {
        const mmoCasKt = convertAirspeed({ pressureAltitudeFt, oatC, mach: limits.mmo }).casKt;
        if (mmoCasKt < limitCasKt) {
          limitCasKt = mmoCasKt;
          limitKind = 'mmo';
        }
      }
    } else if (limits.vneCasKt !== null) {
      limitCasKt = limits.vneCasKt;
      limitKind = 'vne';
    }
    return {
      aboveLimit: limitCasKt !== null && speeds !== null && speeds.casKt > limitCasKt + 1e-9,
      casKt: figures ? roundSpeedKt(figures.casKt) : null,
      cruiseNote,
      easKt: figures ? roundSpeedKt(figures.easKt) : null,
      iasKt,
      limitCasKt: limitCasKt === null ? null : roundLimitKt(limitCasKt),
      limitIasKt: limitCasKt === null ? null : this.iasWithinTable(limitCasKt, roundLimitKt),
      limitKind,
      mach: figures ? round3(figures.mach) : null,
      oatC: round1(oatC),
      pressureAltitudeFt,
      tasKt: figures ? roundSpeedKt(figures.tasKt) : null,
    };
  }

  /** IAS of `casKt` through the cruise table, or null where the table gives no correction. */
  private iasWithinTable(casKt: number, round: (kt: number) => number): number | null {
    const first = this.cruiseTable[0].casKt;
    const last = this.cruiseTable[this.cruiseTable.length - 1].casKt;
    if (casKt < first || casKt > last) return null;
    return round(casToIasKt(this.cruiseTable, casKt));
  }

  /** Arcs and radial lines on the basis the speed book states, with this card's stall speeds. */
  indicator(speeds: readonly ComputedSpeed[], limits: ComputedLimits): CardIndicator {
    const basis = this.content.indicatorMarkingBasis;
    const inBasis = (speed: CardLimitSpeed | CardSpeed | null | undefined) =>
      speed ? (basis === 'ias' ? speed.iasKt : speed.casKt) : null;
    const stallSpeed = (role: string) => speeds.find((speed) => speedRole(speed.card.code) === role);
    const vs0Speed = stallSpeed('VS0');
    const vs0 = inBasis(vs0Speed?.card);
    const vs1 = inBasis(stallSpeed('VS1')?.card) ?? inBasis(stallSpeed('VS')?.card);
    // The white arc ends at the VFE of the landing flap (14 CFR 23.1545(b)(1), from memory): the
    // configuration VS0 is given in, else the landing speeds' configuration.
    const landingKey = vs0Speed?.card.configurationKey ?? speeds.find((speed) => speed.card.phase === 'landing')?.card.configurationKey;
    const landingVfe = limits.card.vfe.find((vfe) => vfe.configurationKey === landingKey);
    const vfeTop = landingVfe ? inBasis(landingVfe) : null;
    const vno = inBasis(limits.card.vno);
    const vne = inBasis(limits.card.vne);
    const vmo = inBasis(limits.card.vmo);
    const { category } = this.content.aircraft;
    const piston = category === 'piston-single' || category === 'piston-twin';

    const arcs: CardIndicatorArc[] = [];
    const arc = (colour: CardIndicatorArc['colour'], fromKt: number | null, toKt: number | null) => {
      if (fromKt !== null && toKt !== null && fromKt < toKt) arcs.push({ colour, fromKt, toKt });
    };
    const lines: CardIndicatorLine[] = [];
    const line = (colour: CardIndicatorLine['colour'], code: CardIndicatorLine['code'], kt: number | null) => {
      if (kt !== null) lines.push({ code, colour, kt });
    };

    arc('white', vs0, vfeTop);
    if (piston) {
      arc('green', vs1, vno);
      arc('yellow', vno, vne);
      line('red', 'VNE', vne);
      if (this.content.aircraft.engines > 1) {
        line('red', 'VMC', inBasis(limits.card.vmc));
        line('blue', 'VYSE', inBasis(limits.card.vyse));
      }
    } else if (vmo !== null) {
      line('red', 'VMO', vmo);
    } else {
      line('red', 'VNE', vne);
    }
    return { arcs, basis, lines };
  }
}
