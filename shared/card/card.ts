/**
 * The speed card: what a pilot enters (`CardInputs`), what the card holds (`SpeedCard`), and
 * why a card can be refused (`CardRefusedError`). Built by `buildCard` (build-card.ts), the same
 * pure function on the device and on the server, so any card can be re-derived from its inputs.
 *
 * Every figure of a `SpeedCard` is already rounded as printed (flight-physics.md, "Rounding on
 * cards"): limits down, stall speeds up, other speeds to the nearest knot; altitudes to the
 * foot, temperatures to 0.1 °C, Mach to 0.001. No field is ever NaN or Infinity; a figure the
 * flight manual's data cannot give is `null` (only where said below) or refuses the card.
 *
 * Units are in every name: kt (knots), ft, hPa, °C (`…C`), kg.
 */
import type { AircraftCategory, SpeedBasis, SpeedPhase } from '../speed-book/revision-content';
import type { CardInputs } from './card-inputs-schema';
import type { CardIcing } from './card-icing-model';
import type { CardApproach, CardWind } from './card-wind-model';

/**
 * Schema version of the card JSON; part of the digest, so a change of meaning changes it.
 * 2: speeds rounded by class, the landing weight used, the book's envelope and ordering rules.
 */
export const CARD_VERSION = 2;

/** The banks of the stall-speed-in-turn lines, degrees (product.md, "What a card shows"). */
export const STALL_TURN_BANKS_DEG = [0, 15, 30, 45, 60] as const;

// ---------------------------------------------------------------------------------------------
// Inputs: card-inputs-schema.ts (re-exported here, where every caller finds them)

export * from './card-inputs-schema';

// ---------------------------------------------------------------------------------------------
// What buildCard is given besides the inputs

/**
 * The revision a card is built from, as the server stores it and devices sync it. `content` is
 * the parsed content; `contentSha256` the hash it was published with (for a draft preview,
 * the server passes the hash of the draft's content and `publishedAt: null`).
 */
export interface CardRevision {
  readonly id: number;
  readonly number: number;
  /** ISO 8601 UTC, or null for a draft preview. */
  readonly publishedAt: string | null;
  readonly contentSha256: string;
  readonly content: unknown;
}

/** The airframe, its type, its speed book and its operator, for the card's header. */
export interface CardContext {
  readonly airframe: { readonly id: number; readonly registration: string };
  readonly aircraftType: { readonly designator: string; readonly name: string };
  readonly speedBook: { readonly id: number; readonly title: string };
  /** The operator is a demo operator: the card says "invented demo data — not for flight". */
  readonly demo: boolean;
}

// ---------------------------------------------------------------------------------------------
// The card

/** Pressure and density altitude at an aerodrome (departure or arrival). */
export interface CardAerodrome {
  readonly pressureAltitudeFt: number;
  /** Null only for air denser than the model reaches (ISA at −5 km): density altitude never refuses a card. */
  readonly densityAltitudeFt: number | null;
  /** OAT minus the ISA temperature at the pressure altitude, °C (0.1). */
  readonly isaDeviationC: number;
  /** Density altitude is high enough for the card's caution (see `HIGH_DENSITY_ALTITUDE_*` in build-card.ts). */
  readonly highDensityAltitude: boolean;
  /** The wind's components on the runway, present only when the pilot gave a runway heading and a wind (card-wind.ts). */
  readonly wind?: CardWind;
}

// The day's wind and the approach speed: card-wind-model.ts (re-exported here)

export * from './card-wind-model';

// Icing conditions: card-icing-model.ts (re-exported here)

export * from './card-icing-model';

/** Why a speed was rounded the way it was. */
export type CardRounding = 'limit-down' | 'stall-up' | 'nearest';

/** One V-speed of the card at the weight it applies to. */
export interface CardSpeed {
  readonly code: string;
  readonly label: string;
  readonly phase: SpeedPhase;
  readonly configurationKey: string;
  readonly configurationLabel: string;
  /** How the speed book gives it: weight-scaled, tabulated or fixed. */
  readonly kind: 'scaled' | 'tabulated' | 'fixed';
  /** The basis the speed book gives it in. */
  readonly basis: SpeedBasis;
  /** The weight it was computed at, kg: the landing weight for approach and landing speeds when given. */
  readonly weightKg: number;
  readonly iasKt: number;
  readonly casKt: number;
  readonly rounding: CardRounding;
}

/** The landing weight the approach and landing speeds were computed at, and why that one. */
export interface CardLanding {
  /** `entered` by the pilot; the `takeoff-weight` (within the maximum landing weight); or the `maximum-landing-weight`. */
  readonly source: 'entered' | 'takeoff-weight' | 'maximum-landing-weight';
  /** One sentence the card prints. */
  readonly statement: string;
  readonly weightKg: number;
}

/** Stall speed in a level coordinated turn at `bankDeg`, from VS1 at the takeoff weight. */
export interface CardStallInTurn {
  readonly bankDeg: number;
  /** Load factor 1/cos(bank), to 0.01 g. */
  readonly loadFactor: number;
  readonly iasKt: number;
  readonly casKt: number;
}

/** A limit speed, both ways, rounded down (VMC, a minimum, is rounded up; see build-card.ts). */
export interface CardLimitSpeed {
  readonly iasKt: number;
  readonly casKt: number;
}

export interface CardFlapLimit extends CardLimitSpeed {
  readonly configurationKey: string;
  readonly configurationLabel: string;
}

/** The limits of the speed book, through the cruise (first) configuration's table unless said. */
export interface CardLimits {
  /** The basis the speed book states its limits (and the indicator markings) in. */
  readonly basis: SpeedBasis;
  readonly vno: CardLimitSpeed | null;
  readonly vne: CardLimitSpeed | null;
  readonly vmo: CardLimitSpeed | null;
  /** MMO, to 0.001. */
  readonly mmo: number | null;
  /** VFE of each flap configuration, through that configuration's table. */
  readonly vfe: readonly CardFlapLimit[];
  readonly vle: CardLimitSpeed | null;
  readonly vlo: CardLimitSpeed | null;
  readonly vmc: CardLimitSpeed | null;
  /** VYSE is a target speed, rounded to the nearest knot. */
  readonly vyse: CardLimitSpeed | null;
}

/** Which limit governs a row of the altitude table. */
export type CardLimitKind = 'vne' | 'vmo' | 'mmo';

/** One row of the altitude table: the planned cruise at this pressure altitude on the day's ISA deviation. */
export interface CardAltitudeRow {
  readonly pressureAltitudeFt: number;
  readonly oatC: number;
  /**
   * IAS of the planned cruise; null when the cruise is a Mach number whose CAS at this altitude
   * lies outside the cruise configuration's position-error table (never extrapolated).
   */
  readonly iasKt: number | null;
  /** CAS, EAS, TAS and Mach of the planned cruise; null (a dash) where `cruiseNote` says why. */
  readonly casKt: number | null;
  readonly easKt: number | null;
  readonly tasKt: number | null;
  readonly mach: number | null;
  /**
   * Why this row shows a dash instead of a figure: the IAS cruise is at or above Mach 1 here, or
   * lies outside the cruise configuration's position-error table; a Mach cruise's CAS outside it
   * (IAS dashed). Null when every figure of the row is given.
   */
  readonly cruiseNote: string | null;
  /**
   * The speed limit at this altitude as IAS, rounded down: VMO or the CAS of MMO at this altitude,
   * whichever is lower, or VNE. Null when the type has neither VNE nor VMO, or when the limit's
   * CAS lies outside the cruise configuration's position-error table (never extrapolated).
   */
  readonly limitIasKt: number | null;
  /** The same limit as CAS, rounded down; null when the type has neither VNE nor VMO. */
  readonly limitCasKt: number | null;
  readonly limitKind: CardLimitKind | null;
  /** The planned cruise exceeds the limit at this altitude. */
  readonly aboveLimit: boolean;
}

/** A coloured arc of the airspeed indicator, in `CardIndicator.basis`. */
export interface CardIndicatorArc {
  /** white: VS0–VFE (flap operating range); green: VS1–VNO (normal); yellow: VNO–VNE (caution). */
  readonly colour: 'white' | 'green' | 'yellow';
  readonly fromKt: number;
  readonly toKt: number;
}

/** A radial line of the airspeed indicator, in `CardIndicator.basis`. */
export interface CardIndicatorLine {
  /**
   * red VNE (never exceed, pistons); red VMO (maximum operating, turbines: the sea-level value,
   * MMO governs above the crossover); red VMC and blue VYSE (multi-engine pistons).
   */
  readonly colour: 'red' | 'blue';
  readonly code: 'VNE' | 'VMO' | 'VMC' | 'VYSE';
  readonly kt: number;
}

/**
 * What the airspeed-indicator picture needs, on the basis the speed book states
 * (`indicatorMarkingBasis`), with the stall speeds at this card's weights. The markings follow
 * the airworthiness rules for airspeed indicators of small aeroplanes (14 CFR 23.1545, from
 * memory): white arc VS0 to VFE, green arc VS1 to VNO, yellow arc VNO to VNE, red line VNE;
 * for multi-engine pistons a red line at VMC and a blue line at VYSE; turbine types show their
 * VMO (and MMO) limit instead of the arcs above VS1.
 */
export interface CardIndicator {
  readonly basis: SpeedBasis;
  readonly arcs: readonly CardIndicatorArc[];
  readonly lines: readonly CardIndicatorLine[];
}

/**
 * A speed card. `digest` is `cardDigest` of everything else (card-digest.ts): the same inputs
 * and revision give the same digest on every device and on the server.
 */
export interface SpeedCard {
  readonly digest: string;
  readonly cardVersion: typeof CARD_VERSION;
  /** Invented demo data — not for flight. */
  readonly demo: boolean;
  readonly revision: {
    readonly id: number;
    readonly number: number;
    /** ISO 8601 UTC; null on a draft preview (never issued). */
    readonly publishedAt: string | null;
    readonly contentSha256: string;
  };
  readonly speedBook: { readonly id: number; readonly title: string };
  readonly airframe: { readonly id: number; readonly registration: string };
  readonly aircraftType: {
    readonly designator: string;
    readonly name: string;
    readonly category: AircraftCategory;
    readonly engines: number;
    readonly ceilingFt: number;
  };
  /** The inputs as entered (canonical units), so the card can be re-derived. */
  readonly inputs: CardInputs;
  readonly takeoffConfiguration: { readonly key: string; readonly label: string };
  /** The landing weight the approach and landing speeds use. */
  readonly landing: CardLanding;
  readonly departure: CardAerodrome;
  readonly arrival: CardAerodrome | null;
  /** The approach speeds for the day's wind; present only when the aerodrome the card lands at has a wind. */
  readonly approach?: CardApproach;
  /** The speeds beside their iced figures; present only when the pilot ticked icing conditions (card-icing.ts). */
  readonly icing?: CardIcing;
  readonly speeds: readonly CardSpeed[];
  readonly stallInTurn: readonly CardStallInTurn[];
  readonly limits: CardLimits;
  /** Where VMO and MMO meet, ft; null unless the type has both. */
  readonly crossoverAltitudeFt: number | null;
  /** The planned cruise as entered: IAS through the cruise configuration, or Mach. */
  readonly cruise: { readonly iasKt: number; readonly casKt: number | null } | { readonly mach: number };
  readonly altitudeTable: readonly CardAltitudeRow[];
  readonly indicator: CardIndicator;
}

// ---------------------------------------------------------------------------------------------
// Refusal

/** Every reason a card can be refused. */
export const CARD_REFUSAL_CODES = [
  /** The revision content does not hash to the published hash (altered or damaged). */
  'content-hash-mismatch',
  /** The revision content is not usable revision content (a draft with problems, bad sync). */
  'invalid-content',
  /** An input is missing or not a number (`cardInputsSchema`). */
  'invalid-inputs',
  /** The inputs name another airframe than the one the card is built for. */
  'airframe-mismatch',
  /** The takeoff configuration is not one of the speed book's, or has no takeoff speeds. */
  'unknown-configuration',
  /** The takeoff weight is outside the flight manual's weights. */
  'weight-out-of-range',
  /** The landing weight is above the maximum landing weight or below the minimum weight. */
  'landing-weight-out-of-range',
  /** A figure would need the flight manual's data beyond its tables (never extrapolated). */
  'outside-flight-manual-data',
  /** The day lies outside the pressure-altitude or temperature envelope the speed book declares. */
  'outside-book-envelope',
  /** The card's speeds would break an ordering rule the book records no exception for. */
  'ordering-rule-broken',
  /** An input lies outside the atmosphere, the altimeter relation or the airspeed relations. */
  'out-of-envelope',
] as const;
export type CardRefusalCode = (typeof CARD_REFUSAL_CODES)[number];

/** A refusal as data: what the API carries and the screen shows. */
export interface CardRefusal {
  readonly code: CardRefusalCode;
  /** The input at fault as a path into `CardInputs` (`departure.oatC`, `weightKg`), or `revision`. */
  readonly field: string;
  /** A sentence a pilot understands. */
  readonly message: string;
}

/** Thrown by `buildCard` when the card cannot be given; nothing is extrapolated. */
export class CardRefusedError extends Error implements CardRefusal {
  override readonly name = 'CardRefusedError' as const;

  constructor(
    readonly code: CardRefusalCode,
    readonly field: string,
    message: string,
  ) {
    super(message);
  }

  toRefusal(): CardRefusal {
    return { code: this.code, field: this.field, message: this.message };
  }
}
