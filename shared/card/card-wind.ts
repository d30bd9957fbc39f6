/**
 * The day's wind on the runway in use, and the approach speed it asks for (flight-physics.md,
 * "The day's wind (approach speed)").
 *
 * Components, with θr the runway heading, θw the direction the wind blows from and V its speed
 * (one north for both): headwind = V cos(θw − θr), crosswind = V sin(θw − θr). A negative
 * headwind is a tailwind; a positive crosswind comes from the right of the runway heading,
 * a negative one from the left (resolution of a vector along and across the runway).
 *
 * Approach speed = VREF + additive, the additive by the operator's policy (approach-policy.ts):
 * headwindFraction × max(0, steady headwind) + gustFraction × (gust − steady speed), held within
 * [minimumKt, maximumKt], then rounded up to the whole knot (a speed above the minimum is the
 * safe side, as stall and minimum speeds are rounded up on the card). The unrounded components
 * go into the additive; only what the card prints is rounded ("rounded at the edge").
 *
 * Pure: no clock, no I/O; never NaN or Infinity (the inputs are bounded by `windSchema`).
 */
import { speedRole } from '../speed-book/speed-class';
import type { Limits } from '../speed-book/revision-content';
import type { AerodromeConditions, CardApproach, CardApproachSpeed, CardFlapLimit, CardSpeed, CardWind } from './card';
import { approachPolicyStatement, type ApproachAdditivePolicy } from './approach-policy';
import { refuse } from './card-refusal';

const RADIANS_PER_DEGREE = Math.PI / 180;

/** Unrounded components of a wind on a runway, kt. */
export interface WindComponents {
  /** Along the runway heading; negative for a tailwind. */
  readonly headwindKt: number;
  /** Across it; positive from the right, negative from the left. */
  readonly crosswindKt: number;
}

/**
 * Headwind and crosswind of a wind of `speedKt` from `directionDeg` on a runway of heading
 * `runwayHeadingDeg` (degrees, one north for both).
 * @example windComponents(270, 300, 20) // { headwindKt: 17.32…, crosswindKt: 10 } (from the right)
 */
export function windComponents(runwayHeadingDeg: number, directionDeg: number, speedKt: number): WindComponents {
  const angle = (directionDeg - runwayHeadingDeg) * RADIANS_PER_DEGREE;
  return { headwindKt: speedKt * Math.cos(angle), crosswindKt: speedKt * Math.sin(angle) };
}

/** To the whole knot as printed; `+ 0` turns −0 into 0. */
const wholeKt = (kt: number) => Math.round(kt) + 0;

/**
 * The operator's additive before rounding, kt, within [minimumKt, maximumKt].
 * @example unroundedAdditiveKt({ headwindFraction: 0.5, gustFraction: 1, minimumKt: 5, maximumKt: 20 }, 17.32, 20, 30) // 18.66
 */
export function unroundedAdditiveKt(policy: ApproachAdditivePolicy, headwindKt: number, speedKt: number, gustKt: number | undefined): number {
  const steady = policy.headwindFraction * Math.max(0, headwindKt);
  const gust = policy.gustFraction * Math.max(0, (gustKt ?? speedKt) - speedKt);
  return Math.min(policy.maximumKt, Math.max(policy.minimumKt, steady + gust));
}

/**
 * The additive as the card uses it: whole knots, rounded up. The value is first rounded to
 * 0.001 kt so that floating-point noise (10.000000000000002) does not add a knot.
 * @example roundAdditiveUpKt(18.66) // 19
 */
export function roundAdditiveUpKt(kt: number): number {
  return Math.ceil(Math.round(kt * 1000) / 1000) + 0;
}

/**
 * The card's wind block for an aerodrome, or undefined when the pilot gave no wind there.
 * Cautions (never refusals) when the crosswind or the tailwind, steady or in the gust, exceeds
 * the flight manual's demonstrated crosswind or tailwind limit (`limits.demonstratedCrosswindKt`,
 * `limits.maximumTailwindKt`).
 */
export function cardWind(conditions: AerodromeConditions, limits: Limits): CardWind | undefined {
  const { wind, runwayHeadingDeg } = conditions;
  if (!wind || runwayHeadingDeg === undefined) return undefined;
  const steady = windComponents(runwayHeadingDeg, wind.directionDeg, wind.speedKt);
  const gust = wind.gustKt === undefined ? null : windComponents(runwayHeadingDeg, wind.directionDeg, wind.gustKt);
  const crosswindKt = wholeKt(Math.abs(steady.crosswindKt));
  const gustCrosswindKt = gust ? wholeKt(Math.abs(gust.crosswindKt)) : null;
  const headwindKt = wholeKt(steady.headwindKt);
  const gustHeadwindKt = gust ? wholeKt(gust.headwindKt) : null;
  return {
    cautions: windCautions(limits, crosswindKt, gustCrosswindKt, headwindKt, gustHeadwindKt),
    crosswindFrom: crosswindKt === 0 ? null : steady.crosswindKt > 0 ? 'right' : 'left',
    crosswindKt,
    directionDeg: wind.directionDeg,
    gust: gust ? { crosswindKt: gustCrosswindKt!, headwindKt: gustHeadwindKt! } : null,
    gustKt: wind.gustKt ?? null,
    headwindKt,
    runwayHeadingDeg,
    speedKt: wind.speedKt,
  };
}

function windCautions(limits: Limits, crosswindKt: number, gustCrosswindKt: number | null, headwindKt: number, gustHeadwindKt: number | null): string[] {
  const cautions: string[] = [];
  const crosswindLimit = limits.demonstratedCrosswindKt;
  const worstCrosswind = Math.max(crosswindKt, gustCrosswindKt ?? 0);
  if (crosswindLimit !== undefined && worstCrosswind > crosswindLimit) {
    const which = gustCrosswindKt !== null && gustCrosswindKt > crosswindKt ? `in the gusts ${gustCrosswindKt} kt` : `${crosswindKt} kt`;
    cautions.push(`The crosswind (${which}) exceeds the ${crosswindLimit} kt crosswind the flight manual states as demonstrated.`);
  }
  const tailwindLimit = limits.maximumTailwindKt;
  const worstTailwind = Math.max(-headwindKt, gustHeadwindKt === null ? 0 : -gustHeadwindKt);
  if (tailwindLimit !== undefined && worstTailwind > tailwindLimit) {
    cautions.push(`The tailwind (${worstTailwind} kt) exceeds the ${tailwindLimit} kt tailwind limit the flight manual states.`);
  }
  return cautions;
}

/**
 * The approach speeds for the aerodrome the card lands at (the arrival, or the departure when
 * the card has none), or undefined when no wind was given there. Refuses the card when the
 * operator's policy is missing from the inputs: the additive is never guessed.
 */
export function cardApproach(
  landingAt: { readonly conditions: AerodromeConditions; readonly where: 'departure' | 'arrival' },
  policy: ApproachAdditivePolicy | undefined,
  speeds: readonly CardSpeed[],
  vfe: readonly CardFlapLimit[],
): CardApproach | undefined {
  const { wind, runwayHeadingDeg } = landingAt.conditions;
  if (!wind || runwayHeadingDeg === undefined) return undefined;
  if (!policy) {
    refuse('invalid-inputs', 'approachAdditivePolicy', 'The operator’s approach additive policy is missing from this device’s data; sync the device, then make the card again.');
  }
  const { headwindKt } = windComponents(runwayHeadingDeg, wind.directionDeg, wind.speedKt);
  const additiveKt = roundAdditiveUpKt(unroundedAdditiveKt(policy, headwindKt, wind.speedKt, wind.gustKt));
  const approachSpeeds = speeds
    .filter((speed) => speedRole(speed.code) === 'VREF')
    .map((speed): CardApproachSpeed => {
      const approachIasKt = speed.iasKt + additiveKt;
      const flapLimit = vfe.find((limit) => limit.configurationKey === speed.configurationKey);
      return {
        approachIasKt,
        caution:
          flapLimit && approachIasKt >= flapLimit.iasKt
            ? `${speed.code} + ${additiveKt} kt reaches the ${flapLimit.configurationLabel} VFE of ${flapLimit.iasKt} kt: the approach speed must stay below it.`
            : null,
        code: speed.code,
        configurationKey: speed.configurationKey,
        configurationLabel: speed.configurationLabel,
        vrefIasKt: speed.iasKt,
      };
    });
  return {
    additiveKt,
    policy: { gustFraction: policy.gustFraction, headwindFraction: policy.headwindFraction, maximumKt: policy.maximumKt, minimumKt: policy.minimumKt },
    policyStatement: approachPolicyStatement(policy),
    speeds: approachSpeeds,
    windAt: landingAt.where,
  };
}
