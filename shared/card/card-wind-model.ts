/**
 * What a card holds of the day's wind: its components on the runway in use and the approach
 * speeds the operator's additive policy gives (computed in card-wind.ts; part of `SpeedCard`,
 * card.ts, which re-exports these).
 */
import type { ApproachAdditivePolicy } from './approach-policy';

/**
 * The day's wind on the runway in use (card-wind.ts): headwind = V cos(θw − θr), crosswind =
 * V sin(θw − θr), each rounded to the nearest knot as printed. A tailwind is a negative headwind.
 */
export interface CardWind {
  /** Runway heading and wind direction, degrees, from the same north (`WIND_DIRECTION_REFERENCE`). */
  readonly runwayHeadingDeg: number;
  readonly directionDeg: number;
  readonly speedKt: number;
  readonly gustKt: number | null;
  /** Steady headwind component, kt; negative for a tailwind. */
  readonly headwindKt: number;
  /** Steady crosswind component, kt, as a magnitude (0 or more); `crosswindFrom` says from which side. */
  readonly crosswindKt: number;
  /** The side the crosswind comes from, looking along the runway heading; null when it rounds to 0 kt. */
  readonly crosswindFrom: 'left' | 'right' | null;
  /** The components of the gust, when one is given (kt, headwind negative for a tailwind). */
  readonly gust: { readonly headwindKt: number; readonly crosswindKt: number } | null;
  /** Sentences where the crosswind or tailwind exceeds what the flight manual states (cautions, not refusals). */
  readonly cautions: readonly string[];
}

/** The approach speed for one landing configuration: VREF plus the additive. */
export interface CardApproachSpeed {
  readonly code: string;
  readonly configurationKey: string;
  readonly configurationLabel: string;
  /** VREF as printed (IAS, rounded up). */
  readonly vrefIasKt: number;
  /** VREF + the additive, IAS, kt. */
  readonly approachIasKt: number;
  /** A sentence when the approach speed reaches the configuration's VFE; null otherwise. */
  readonly caution: string | null;
}

/** The approach speeds for the day's wind at the aerodrome the card lands at, by the operator's policy. */
export interface CardApproach {
  /** Where the wind was taken from: the arrival, or the departure when the card has no arrival. */
  readonly windAt: 'departure' | 'arrival';
  /** The operator's policy the card used (as it was when the card was made). */
  readonly policy: ApproachAdditivePolicy;
  /** The policy in one sentence, as printed. */
  readonly policyStatement: string;
  /** The additive, whole kt, rounded up (card-wind.ts). */
  readonly additiveKt: number;
  /** One approach speed per VREF of the card (one per landing configuration); empty when the book gives no VREF. */
  readonly speeds: readonly CardApproachSpeed[];
}
